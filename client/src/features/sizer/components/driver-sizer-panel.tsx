import { useState } from 'react';
import { Alert, Button, Fieldset, Group, SegmentedControl, SimpleGrid, Stack, Table, Text } from '@mantine/core';
import type { Design } from '@ladderwright/shared/designs';
import type { DriverStage } from '@ladderwright/shared/driver';
import {
  DRIVER_SIZER_DEFAULTS,
  driverSizerDesign,
  type DriverSizerCandidate,
  type DriverSizerRequest,
  type DriverSizerResult,
} from '@ladderwright/shared/sizing';
import { formatQuantity } from '@ladderwright/shared/units';
import { QuantityInput } from '../../../components/quantity-input';
import { useDriverSizerRun } from '../hooks/use-driver-sizer-run';

export interface DriverSizerPanelProps {
  onStartDesign: (document: Design) => void;
  isStarting: boolean;
}

type SupplyKind = 'cells' | 'dc';

/** The stage a candidate stands for: the Sizer's starting stage with its cells and secondary turns. */
function stageOf(request: DriverSizerRequest, candidate: DriverSizerCandidate): DriverStage {
  const base = request.stage;
  return {
    ...base,
    supply:
      base.supply.kind === 'cells' && candidate.cellsInSeries !== null
        ? { ...base.supply, cellsInSeries: candidate.cellsInSeries }
        : base.supply,
    transformer: { ...base.transformer, secondaryTurns: candidate.secondaryTurns },
  };
}

/**
 * The Sizer for a whole battery- or DC-fed supply (shared sizeDriverSupply, the CLI's `size-driver` defaults):
 * cells, turns ratio, ladder cells, capacitors and bleeder whose output lands within ±3 % of the target.
 */
export function DriverSizerPanel({ onStartDesign, isStarting }: DriverSizerPanelProps) {
  const [targetOutputV, setTargetOutputV] = useState(1500);
  const [loadCurrentA, setLoadCurrentA] = useState(5e-6);
  const [rippleMaxV, setRippleMaxV] = useState(20);
  const [supplyKind, setSupplyKind] = useState<SupplyKind>('cells');
  const [dcVoltageV, setDcVoltageV] = useState(6);
  const { outcome, error, isRunning, run, cancel } = useDriverSizerRun();

  const submit = () => {
    const base = DRIVER_SIZER_DEFAULTS.stage;
    const stage: DriverStage =
      supplyKind === 'cells'
        ? base
        : { ...base, supply: { kind: 'dc', voltageV: dcVoltageV, sourceResistanceOhm: 0.1 } };
    run({ targetOutputV, loadCurrentA, rippleMaxV, stage, resultCount: DRIVER_SIZER_DEFAULTS.resultCount });
  };

  return (
    <Stack gap="md">
      <form
        onSubmit={(event) => {
          event.preventDefault();
          submit();
        }}
      >
        <Fieldset legend="Whole supply from a battery or a DC input">
          <SimpleGrid cols={{ base: 1, sm: 2, md: 4 }} spacing="sm">
            <QuantityInput label="Output" unit="V" value={targetOutputV} onChange={setTargetOutputV} />
            <QuantityInput label="Load current" unit="A" value={loadCurrentA} onChange={setLoadCurrentA} />
            <QuantityInput label="Ripple at most" unit="V" value={rippleMaxV} onChange={setRippleMaxV} />
            {supplyKind === 'dc' && (
              <QuantityInput label="DC input" unit="V" value={dcVoltageV} onChange={setDcVoltageV} />
            )}
          </SimpleGrid>
          <Stack gap={4} mt="sm">
            <Text id="driver-sizer-supply" size="sm" fw={500}>
              Supply
            </Text>
            <SegmentedControl
              aria-labelledby="driver-sizer-supply"
              value={supplyKind}
              onChange={(value) => setSupplyKind(value)}
              data={[
                { value: 'cells', label: `alkaline cells (${DRIVER_SIZER_DEFAULTS.cellCounts.join(', ')} in series)` },
                { value: 'dc', label: 'DC input' },
              ]}
              w="fit-content"
            />
          </Stack>
          <Text size="xs" c="dimmed" mt={4}>
            Starts from the handheld tester&apos;s transistor, core and clamp; tries ladders of{' '}
            {DRIVER_SIZER_DEFAULTS.ladderCells.join(', ')} cells, E6 capacitors from{' '}
            {formatQuantity(DRIVER_SIZER_DEFAULTS.capacitorRangeF[0], 'F')} to{' '}
            {formatQuantity(DRIVER_SIZER_DEFAULTS.capacitorRangeF[1], 'F')} and bleeders of{' '}
            {DRIVER_SIZER_DEFAULTS.bleedersOhm.map((r) => formatQuantity(r, 'Ohm')).join(' or ')}; solves the turns
            ratio for each.
          </Text>
          <Group gap="sm" mt="md">
            <Button type="submit" loading={isRunning}>
              Find supplies
            </Button>
            {isRunning && (
              <Button variant="default" onClick={cancel}>
                Cancel search
              </Button>
            )}
          </Group>
        </Fieldset>
      </form>
      {error && (
        <Alert color="red" title="The Sizer could not run">
          {error}
        </Alert>
      )}
      {outcome && (
        <DriverCandidateTable
          request={outcome.request}
          result={outcome.result}
          isStarting={isStarting}
          onStartDesign={onStartDesign}
        />
      )}
    </Stack>
  );
}

function DriverCandidateTable({
  request,
  result,
  isStarting,
  onStartDesign,
}: {
  request: DriverSizerRequest;
  result: DriverSizerResult;
  isStarting: boolean;
  onStartDesign: (document: Design) => void;
}) {
  return (
    <div>
      <Text size="sm" mb="xs">
        {result.meetingSpecCount} of {result.evaluatedCount} combinations land within ±
        {DRIVER_SIZER_DEFAULTS.tolerance * 100} % of the target; the best {result.candidates.length} are ranked below.
      </Text>
      {result.candidates.length === 0 ? (
        <Alert color="ember">No supply lands on this target. Loosen the ripple or lower the load.</Alert>
      ) : (
        <Table.ScrollContainer minWidth={1100}>
          <Table striped verticalSpacing={4} aria-label="Driver Sizer candidates" style={{ whiteSpace: 'nowrap' }}>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Rank</Table.Th>
                <Table.Th>Supply</Table.Th>
                <Table.Th>Turns ratio</Table.Th>
                <Table.Th>Ladder</Table.Th>
                <Table.Th>Bleeder</Table.Th>
                <Table.Th>Output</Table.Th>
                <Table.Th>Ripple</Table.Th>
                <Table.Th>Drain</Table.Th>
                <Table.Th>Battery life</Table.Th>
                <Table.Th>Worst check</Table.Th>
                <Table.Th>Design</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {result.candidates.map((c) => (
                <Table.Tr key={c.rank}>
                  <Table.Td fw={700}>{c.rank}</Table.Td>
                  <Table.Td>{c.cellsInSeries === null ? 'DC' : `${c.cellsInSeries} × alkaline`}</Table.Td>
                  <Table.Td>
                    1 : {c.turnsRatio.toFixed(1)} ({c.secondaryTurns} turns)
                  </Table.Td>
                  <Table.Td>
                    {c.ladderCells} cells × {formatQuantity(c.capacitorF, 'F')}
                  </Table.Td>
                  <Table.Td>{c.bleederOhm === null ? '—' : formatQuantity(c.bleederOhm, 'Ohm')}</Table.Td>
                  <Table.Td>{formatQuantity(c.outputMeanV, 'V')}</Table.Td>
                  <Table.Td>{formatQuantity(c.ripplePeakToPeakV, 'V')}</Table.Td>
                  <Table.Td>{formatQuantity(c.supplyCurrentA, 'A')}</Table.Td>
                  <Table.Td>{c.batteryLifeS === null ? '—' : `${(c.batteryLifeS / 3600).toFixed(1)} h`}</Table.Td>
                  <Table.Td>
                    {c.worstCheck.verdict} {c.worstCheck.marginPct.toFixed(1)} %
                    <Text size="xs" c="dimmed">
                      {c.worstCheck.id.replace(/^driver\./, '').replace(/-/g, ' ')}
                    </Text>
                  </Table.Td>
                  <Table.Td>
                    <Button
                      size="xs"
                      variant="light"
                      disabled={isStarting}
                      aria-label={`Start a design from supply ${c.rank}`}
                      onClick={() =>
                        onStartDesign({
                          ...driverSizerDesign(stageOf(request, c), request, c.ladderCells, c.capacitorF, c.bleederOhm),
                          name: `Sizer: ${c.ladderCells}-cell ladder, 1:${c.turnsRatio.toFixed(0)}`,
                        })
                      }
                    >
                      Start design
                    </Button>
                  </Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
    </div>
  );
}
