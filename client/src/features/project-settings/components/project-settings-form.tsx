import { useState } from 'react';
import {
  Alert,
  Button,
  Group,
  NumberInput,
  Paper,
  Select,
  SimpleGrid,
  Stack,
  Text,
  Textarea,
  TextInput,
  Title,
} from '@mantine/core';
import type { DefaultTargets, ProjectDetail } from '@ladderwright/shared/api';
import { DISCHARGE_RULE_LABELS, NAMED_DISCHARGE_RULES } from '@ladderwright/shared/designs';
import { ACCEPTANCE_COVERAGES, type AcceptanceCoverage, BENCH_ALLOWANCE_MAX } from '@ladderwright/shared/reviews';
import { useArchiveProject } from '../api/archive-project';
import { useUnarchiveProject } from '../api/unarchive-project';
import { useUpdateProject } from '../api/update-project';

function optional(value: string | number): number | undefined {
  return typeof value === 'number' && Number.isFinite(value) ? value : undefined;
}

/** Name, description, the targets new blank designs start from, the spec sheet's acceptance window; archive. */
export function ProjectSettingsForm({ project }: { project: ProjectDetail }) {
  const targets = project.settings.defaultTargets;
  const [name, setName] = useState(project.name);
  const [description, setDescription] = useState(project.description);
  const [outputKv, setOutputKv] = useState<string | number>(
    targets.outputV !== undefined ? targets.outputV / 1000 : '',
  );
  const [rippleV, setRippleV] = useState<string | number>(targets.rippleMaxV ?? '');
  const [loadUa, setLoadUa] = useState<string | number>(
    targets.loadCurrentA !== undefined ? targets.loadCurrentA * 1e6 : '',
  );
  const [safeV, setSafeV] = useState<string | number>(targets.safeVoltageV ?? '');
  const [rule, setRule] = useState<string | null>(
    typeof targets.dischargeRule === 'string' ? targets.dischargeRule : null,
  );
  const [coverage, setCoverage] = useState<string>(String(project.settings.acceptance.coverage));
  const [allowancePct, setAllowancePct] = useState<string | number>(
    project.settings.acceptance.benchAllowanceFraction * 100,
  );
  const update = useUpdateProject(project.id);
  const archive = useArchiveProject(project.id);
  const unarchive = useUnarchiveProject(project.id);
  const [isConfirmingArchive, setIsConfirmingArchive] = useState(false);
  const isReadOnly = project.isArchived;

  const save = () => {
    const outputV = optional(outputKv);
    const loadCurrentA = optional(loadUa);
    const defaultTargets: DefaultTargets = {
      ...(outputV !== undefined ? { outputV: outputV * 1000 } : {}),
      ...(optional(rippleV) !== undefined ? { rippleMaxV: optional(rippleV) } : {}),
      ...(loadCurrentA !== undefined ? { loadCurrentA: loadCurrentA / 1e6 } : {}),
      ...(optional(safeV) !== undefined ? { safeVoltageV: optional(safeV) } : {}),
      ...(rule ? { dischargeRule: rule as (typeof NAMED_DISCHARGE_RULES)[number] } : {}),
    };
    update.mutate({
      name: name.trim(),
      description: description.trim(),
      defaultTargets,
      acceptance: {
        coverage: Number(coverage) as AcceptanceCoverage,
        benchAllowanceFraction: (optional(allowancePct) ?? 0) / 100,
      },
    });
  };

  return (
    <Stack gap="md">
      {isReadOnly && (
        <Alert color="gray" title="Archived">
          <Group justify="space-between" gap="sm">
            <Text size="sm">This project is archived: it can be read but not changed.</Text>
            <Button variant="default" loading={unarchive.isPending} onClick={() => unarchive.mutate()}>
              Unarchive project
            </Button>
          </Group>
        </Alert>
      )}
      {unarchive.error && <Alert color="red">{unarchive.error.message}</Alert>}
      <Paper withBorder p="md">
        <Stack gap="sm">
          <Title order={2} size="h5">
            Project
          </Title>
          <TextInput
            label="Name"
            required
            value={name}
            disabled={isReadOnly}
            onChange={(e) => setName(e.currentTarget.value)}
          />
          <Textarea
            label="Description"
            autosize
            minRows={2}
            value={description}
            disabled={isReadOnly}
            onChange={(e) => setDescription(e.currentTarget.value)}
          />
        </Stack>
      </Paper>
      <Paper withBorder p="md">
        <Stack gap="sm">
          <Title order={2} size="h5">
            Default targets
          </Title>
          <Text size="sm" c="dimmed">
            A new blank design in this project starts from these; fields left empty keep the built-in blank.
          </Text>
          <SimpleGrid cols={{ base: 1, sm: 2, lg: 3 }}>
            <NumberInput
              label="Output"
              description="Signed; negative for a negative ladder"
              suffix=" kV"
              value={outputKv}
              onChange={setOutputKv}
              disabled={isReadOnly}
              decimalScale={3}
            />
            <NumberInput
              label="Ripple, peak-to-peak, at most"
              suffix=" V"
              min={0}
              value={rippleV}
              onChange={setRippleV}
              disabled={isReadOnly}
            />
            <NumberInput
              label="Load current"
              suffix=" µA"
              min={0}
              value={loadUa}
              onChange={setLoadUa}
              disabled={isReadOnly}
            />
            <NumberInput
              label="Safe voltage after discharge"
              suffix=" V"
              min={1}
              max={1000}
              value={safeV}
              onChange={setSafeV}
              disabled={isReadOnly}
            />
            <Select
              label="Discharge rule"
              placeholder="Keep the blank's"
              clearable
              data={NAMED_DISCHARGE_RULES.map((value) => ({ value, label: DISCHARGE_RULE_LABELS[value] }))}
              value={rule}
              onChange={setRule}
              disabled={isReadOnly}
            />
          </SimpleGrid>
        </Stack>
      </Paper>
      <Paper withBorder p="md">
        <Stack gap="sm">
          <Title order={2} size="h5">
            Acceptance window on the spec sheet
          </Title>
          <Text size="sm" c="dimmed">
            The output window is the predicted spread over the capacitor tolerances at this coverage, plus the bench
            allowance, and always contains the design target.
          </Text>
          <SimpleGrid cols={{ base: 1, sm: 2 }}>
            <Select
              label="Coverage"
              data={ACCEPTANCE_COVERAGES.map((value) => ({ value: String(value), label: `${value * 100} %` }))}
              value={coverage}
              allowDeselect={false}
              onChange={(value) => value && setCoverage(value)}
              disabled={isReadOnly}
            />
            <NumberInput
              label="Bench allowance"
              description="Meter and set-up error, as a share of the target"
              suffix=" %"
              min={0}
              max={BENCH_ALLOWANCE_MAX * 100}
              decimalScale={2}
              value={allowancePct}
              onChange={setAllowancePct}
              disabled={isReadOnly}
            />
          </SimpleGrid>
        </Stack>
      </Paper>
      {update.error && (
        <Alert color="red" title="Not saved" role="alert">
          {update.error.message}
        </Alert>
      )}
      {update.isSuccess && !update.isPending && <Alert color="verdigris">Settings saved.</Alert>}
      {!isReadOnly && (
        <Group justify="space-between">
          <Group>
            {isConfirmingArchive ? (
              <>
                <Text size="sm">Archive this project? It stays readable and takes no more changes.</Text>
                <Button color="ember" loading={archive.isPending} onClick={() => archive.mutate()}>
                  Archive
                </Button>
                <Button variant="default" onClick={() => setIsConfirmingArchive(false)}>
                  Keep it open
                </Button>
              </>
            ) : (
              <Button variant="subtle" color="ember" onClick={() => setIsConfirmingArchive(true)}>
                Archive project…
              </Button>
            )}
          </Group>
          <Button onClick={save} loading={update.isPending} disabled={!name.trim()}>
            Save settings
          </Button>
        </Group>
      )}
      {archive.error && <Alert color="red">{archive.error.message}</Alert>}
    </Stack>
  );
}
