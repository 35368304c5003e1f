import {
  Alert,
  Button,
  Checkbox,
  Group,
  NumberInput,
  Progress,
  Select,
  Stack,
  Table,
  Text,
  Title,
} from '@mantine/core';
import { useState } from 'react';
import { formatParameterValue, type CalibrationParameterOption } from '@ladderwright/shared/api';
import type { BenchKind } from '@ladderwright/shared/bench';
import type { CalibrationDataUse, CalibrationParameterId, PriorRange } from '@ladderwright/shared/calibration';
import { formatDateTime } from '../../../lib/format-date';
import { prefixOfExponent } from '../../../lib/tick-format';
import { useCancelCalibration } from '../api/cancel-calibration';
import { useCalibration } from '../api/get-calibration';
import { useCalibrationParameters } from '../api/get-calibration-parameters';
import { useCalibrations } from '../api/get-calibrations';
import { useStartCalibratedRevision } from '../api/start-calibrated-revision';
import { useStartCalibration } from '../api/start-calibration';
import { CalibrationResultView } from './calibration-result';

/** A bench run the panel may fit (the route passes the revision's runs). */
export interface CalibrationRunChoice {
  id: string;
  title: string;
  kind: BenchKind;
  pointCount: number;
}

/** The factor and unit label the prior range is typed in: an SI prefix that puts the range's top in 1 … 1000. */
export function priorInputScale(unit: string, max: number): { factor: number; label: string } {
  if (!unit || !(max > 0)) return { factor: 1, label: unit };
  const exponent = Math.max(-15, Math.min(9, 3 * Math.floor(Math.log10(max) / 3)));
  return { factor: 10 ** exponent, label: `${prefixOfExponent[exponent] ?? ''}${unit}` };
}

const USES: Record<BenchKind, { value: CalibrationDataUse; label: string }[]> = {
  'load-sweep': [{ value: 'load-sweep', label: 'load sweep (estimate)' }],
  'scope-capture': [
    { value: 'start-up', label: 'start-up (simulator)' },
    { value: 'discharge', label: 'discharge (simulator)' },
    { value: 'collector-waveform', label: 'collector waveform, one cycle (simulator)' },
    { value: 'secondary-waveform', label: 'secondary waveform, one cycle (simulator)' },
  ],
};

interface Props {
  projectId: string;
  designId: string;
  revisionNumber: number;
  runs: readonly CalibrationRunChoice[];
  canRun: boolean;
  /** Called with the new revision's number when one was started from the calibrated model. */
  onRevisionStarted: (revisionNumber: number) => void;
}

/**
 * Calibrate: choose uncertain parameters (with their prior ranges) and bench runs, fit them, follow the
 * progress or cancel, and read the fitted values with their intervals and the overlays; start the next
 * revision from the calibrated model.
 */
export function CalibrationPanel({ projectId, designId, revisionNumber, runs, canRun, onRevisionStarted }: Props) {
  const parameters = useCalibrationParameters(projectId, designId, revisionNumber);
  const [chosen, setChosen] = useState<Partial<Record<CalibrationParameterId, PriorRange>>>({});
  const [uses, setUses] = useState<Record<string, CalibrationDataUse | null>>({});
  const [calibrationId, setCalibrationId] = useState<string | null>(null);
  const start = useStartCalibration(projectId, designId, revisionNumber);
  const cancel = useCancelCalibration(projectId, designId, revisionNumber);
  const revision = useStartCalibratedRevision(projectId, designId, revisionNumber);
  // Until one is run here, the panel shows the revision's newest calibration, so coming back to the page (or a
  // re-mount of the panel) keeps the last result and its "Start revision" step.
  const calibrations = useCalibrations(projectId, designId, revisionNumber);
  const shownId = calibrationId ?? calibrations.data?.[0]?.id ?? null;
  const calibration = useCalibration(projectId, designId, revisionNumber, shownId);
  const current = calibration.data;
  const isActive = current?.status === 'queued' || current?.status === 'running';

  const toggleParameter = (option: CalibrationParameterOption, isOn: boolean) =>
    setChosen((previous) => {
      const next = { ...previous };
      if (isOn) next[option.id] = { ...option.prior };
      else delete next[option.id];
      return next;
    });
  const setPrior = (id: CalibrationParameterId, key: keyof PriorRange, value: number) =>
    setChosen((previous) => {
      const range = previous[id];
      return range ? { ...previous, [id]: { ...range, [key]: value } } : previous;
    });
  const chosenRuns = runs.flatMap((run) => {
    const use = uses[run.id];
    return use ? [{ benchRunId: run.id, use }] : [];
  });
  const chosenParameters = Object.entries(chosen).map(([id, prior]) => ({
    id: id as CalibrationParameterId,
    prior: prior,
  }));

  const submit = () => {
    start.mutate(
      { parameters: chosenParameters, runs: chosenRuns },
      { onSuccess: (created) => setCalibrationId(created.id) },
    );
  };

  return (
    <Stack gap="md" aria-label="Calibrate">
      <Title order={2} size="h4">
        Calibrate
      </Title>
      <Text size="sm" c="dimmed">
        Fits the parameters you choose, within their prior ranges, to the bench runs you choose: load sweeps against the
        engine’s estimate, start-up and discharge captures against the simulator.
      </Text>
      <Table aria-label="Parameters to fit">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Fit</Table.Th>
            <Table.Th>Parameter</Table.Th>
            <Table.Th ta="right">Design value</Table.Th>
            <Table.Th>Prior range, from</Table.Th>
            <Table.Th>to</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {(parameters.data ?? []).map((option) => {
            const range = chosen[option.id];
            const scale = priorInputScale(option.unit, option.prior.max);
            const shown = (value: number) => Number((value / scale.factor).toPrecision(6));
            return (
              <Table.Tr key={option.id}>
                <Table.Td>
                  <Checkbox
                    aria-label={`Fit ${option.label}`}
                    checked={range !== undefined}
                    disabled={!canRun || isActive}
                    onChange={(event) => toggleParameter(option, event.currentTarget.checked)}
                  />
                </Table.Td>
                <Table.Td>{option.label}</Table.Td>
                <Table.Td ta="right">{formatParameterValue(option.value, option.unit)}</Table.Td>
                <Table.Td>
                  <NumberInput
                    aria-label={`${option.label}, prior from`}
                    size="xs"
                    w={130}
                    rightSection={<Text size="xs">{scale.label}</Text>}
                    rightSectionWidth={36}
                    hideControls
                    disabled={range === undefined || isActive}
                    key={`${option.id}-min-${range ? 'on' : 'off'}`}
                    defaultValue={shown(range?.min ?? option.prior.min)}
                    onChange={(value) => typeof value === 'number' && setPrior(option.id, 'min', value * scale.factor)}
                  />
                </Table.Td>
                <Table.Td>
                  <NumberInput
                    aria-label={`${option.label}, prior to`}
                    size="xs"
                    w={130}
                    rightSection={<Text size="xs">{scale.label}</Text>}
                    rightSectionWidth={36}
                    hideControls
                    disabled={range === undefined || isActive}
                    key={`${option.id}-max-${range ? 'on' : 'off'}`}
                    defaultValue={shown(range?.max ?? option.prior.max)}
                    onChange={(value) => typeof value === 'number' && setPrior(option.id, 'max', value * scale.factor)}
                  />
                </Table.Td>
              </Table.Tr>
            );
          })}
        </Table.Tbody>
      </Table>
      <Table aria-label="Bench runs to fit">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Bench run</Table.Th>
            <Table.Th ta="right">Points</Table.Th>
            <Table.Th>Fit as</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {runs.map((run) => (
            <Table.Tr key={run.id}>
              <Table.Td>{run.title || run.kind}</Table.Td>
              <Table.Td ta="right">{run.pointCount}</Table.Td>
              <Table.Td>
                <Select
                  aria-label={`Fit ${run.title || run.kind} as`}
                  size="xs"
                  w={220}
                  placeholder="not used"
                  clearable
                  disabled={!canRun || isActive}
                  data={USES[run.kind]}
                  value={uses[run.id] ?? null}
                  onChange={(value) => setUses((previous) => ({ ...previous, [run.id]: value }))}
                />
              </Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
      {runs.length === 0 && <Text size="sm">Upload a bench run first.</Text>}
      {canRun && (
        <Group>
          <Button
            onClick={submit}
            loading={start.isPending}
            disabled={isActive || chosenParameters.length === 0 || chosenRuns.length === 0}
          >
            Run calibration
          </Button>
          {isActive && current && (
            <Button variant="default" onClick={() => cancel.mutate(current.id)} loading={cancel.isPending}>
              Cancel
            </Button>
          )}
        </Group>
      )}
      {start.error && (
        <Alert color="red" title="Calibration refused">
          {start.error.message}
        </Alert>
      )}
      {current && calibrationId === null && (
        <Text size="sm" c="dimmed">
          Newest calibration of this revision, run {formatDateTime(current.createdAt)} by {current.requestedByName}.
        </Text>
      )}
      {current && isActive && (
        <Stack gap={4}>
          <Text size="sm">
            Calibration {current.status}, {current.progressPct} %
          </Text>
          <Progress value={current.progressPct} aria-label="Calibration progress" />
        </Stack>
      )}
      {current?.status === 'failed' && (
        <Alert color="red" title="Calibration failed">
          {current.error?.message}
        </Alert>
      )}
      {current?.status === 'cancelled' && <Text size="sm">Calibration cancelled.</Text>}
      {current?.status === 'succeeded' && current.result && (
        <Stack gap="sm">
          <CalibrationResultView result={current.result} />
          {canRun && (
            <Group>
              <Button
                onClick={() =>
                  revision.mutate(current.id, { onSuccess: (saved) => onRevisionStarted(saved.revisionNumber) })
                }
                loading={revision.isPending}
                disabled={current.draftRevisionNumber !== null}
              >
                Start revision from calibrated model
              </Button>
              {current.draftRevisionNumber !== null && (
                <Text size="sm">Revision {current.draftRevisionNumber} was started from this calibration.</Text>
              )}
            </Group>
          )}
          {revision.error && <Text c="red">{revision.error.message}</Text>}
        </Stack>
      )}
    </Stack>
  );
}
