import { useState } from 'react';
import {
  Alert,
  Button,
  Checkbox,
  Fieldset,
  Group,
  SegmentedControl,
  SimpleGrid,
  Stack,
  Table,
  Text,
} from '@mantine/core';
import type { Part } from '@ladderwright/shared/api';
import { designExamples, type Design, type Topology } from '@ladderwright/shared/designs';
import { shelfForSizer, type DiodeModelParameters } from '@ladderwright/shared/parts';
import type { SizerRequest, SizerResult } from '@ladderwright/shared/sizing';
import { formatQuantity } from '@ladderwright/shared/units';
import { QuantityInput } from '../../../components/quantity-input';
import { candidateDocument } from '../candidate-document';
import { useSizerRun } from '../hooks/use-sizer-run';

/** A figure and its unit, or a part code, stay on one line in the candidates' table. */
const unbroken = { whiteSpace: 'nowrap' } as const;

export interface SizerPanelProps {
  /** Starts a design from a candidate's document; resolves when the design exists. */
  onStartDesign: (document: Design) => void;
  isStarting: boolean;
  /** The project's Parts shelf; with it, the Sizer can draw values, ratings and costs from it. */
  shelf?: readonly Part[];
}

type ValueSource = 'e-series' | 'shelf';

/**
 * The shelf holds ratings, not the diode's Shockley parameters: shelf diodes are sized on the stacked
 * HV rectifier model of the design examples.
 */
const { saturationCurrentA, emissionCoefficient, seriesResistanceOhm } =
  designExamples.surfaceChargeTester.multiplier.diode;
const SHELF_DIODE_MODEL: DiodeModelParameters = { saturationCurrentA, emissionCoefficient, seriesResistanceOhm };

const topologyOptions: Array<{ value: Topology; label: string }> = [
  { value: 'half-wave', label: 'half-wave cascade' },
  { value: 'full-wave', label: 'full-wave cascade' },
  { value: 'bridge-doubler', label: 'bridge doubler' },
];

/** The Sizer: a target in, ranked ladder candidates out (shared sizeLadder), each a click away from a design. */
export function SizerPanel({ onStartDesign, isStarting, shelf = [] }: SizerPanelProps) {
  const [valueSource, setValueSource] = useState<ValueSource>('e-series');
  const [targetOutputV, setTargetOutputV] = useState(-6000);
  const [loadCurrentA, setLoadCurrentA] = useState(30e-6);
  const [rippleMaxV, setRippleMaxV] = useState(30);
  const [peakV, setPeakV] = useState(480);
  const [frequencyHz, setFrequencyHz] = useState(25e3);
  const [sourceResistanceOhm, setSourceResistanceOhm] = useState(150);
  const [safeVoltageV, setSafeVoltageV] = useState(50);
  const [topologies, setTopologies] = useState<Topology[]>(['half-wave', 'full-wave']);
  const { outcome, error, isRunning, run: runSizer, cancel } = useSizerRun();

  const run = () => {
    const request: SizerRequest = {
      targetOutputV,
      loadCurrentA,
      rippleMaxV,
      drive: { kind: 'sine', peakV, frequencyHz, sourceResistanceOhm },
      topologies,
      safeVoltageV,
      dischargeRule: '50V-1min',
      resultCount: 12,
      ...(valueSource === 'shelf' ? { parts: shelfForSizer(shelf, SHELF_DIODE_MODEL) } : {}),
    };
    runSizer(request);
  };

  return (
    <Stack gap="md">
      <form
        onSubmit={(event) => {
          event.preventDefault();
          run();
        }}
      >
        <Fieldset legend="Target">
          <SimpleGrid cols={{ base: 1, sm: 2, md: 4 }} spacing="sm">
            <QuantityInput label="Output (signed)" unit="V" value={targetOutputV} onChange={setTargetOutputV} />
            <QuantityInput label="Load current" unit="A" value={loadCurrentA} onChange={setLoadCurrentA} />
            <QuantityInput label="Ripple at most" unit="V" value={rippleMaxV} onChange={setRippleMaxV} />
            <QuantityInput label="Safe touch level" unit="V" value={safeVoltageV} onChange={setSafeVoltageV} />
            <QuantityInput label="Secondary peak (sine)" unit="V" value={peakV} onChange={setPeakV} />
            <QuantityInput label="Drive frequency" unit="Hz" value={frequencyHz} onChange={setFrequencyHz} />
            <QuantityInput
              label="Source resistance"
              unit="Ohm"
              value={sourceResistanceOhm}
              onChange={setSourceResistanceOhm}
            />
          </SimpleGrid>
          <Checkbox.Group label="Topologies" value={topologies} onChange={(v) => setTopologies(v)} mt="sm">
            <Group gap="md" mt={4}>
              {topologyOptions.map((option) => (
                <Checkbox key={option.value} value={option.value} label={option.label} />
              ))}
            </Group>
          </Checkbox.Group>
          <Stack gap={4} mt="sm">
            <Text id="sizer-value-source" size="sm" fw={500}>
              Values from
            </Text>
            <SegmentedControl
              aria-labelledby="sizer-value-source"
              value={valueSource}
              onChange={(value) => setValueSource(value)}
              data={[
                { value: 'e-series', label: 'E-series' },
                { value: 'shelf', label: 'Parts shelf', disabled: shelf.length === 0 },
              ]}
              w="fit-content"
            />
          </Stack>
          {valueSource === 'shelf' && (
            <Text size="xs" c="dimmed" mt={4}>
              Capacitors, diodes and bleeder resistors from this project&apos;s shelf ({shelf.length} parts), with their
              ratings and unit costs; candidates are ranked by cost.
            </Text>
          )}
          <Group gap="sm" mt="md">
            <Button type="submit" loading={isRunning} disabled={topologies.length === 0}>
              Find ladders
            </Button>
            {isRunning && (
              <>
                <Button variant="default" onClick={cancel}>
                  Cancel search
                </Button>
                <Text size="sm" c="dimmed" role="status">
                  Searching ladders…
                </Text>
              </>
            )}
          </Group>
        </Fieldset>
      </form>
      {error && (
        <Alert color="red" title="The Sizer could not run">
          {error}
        </Alert>
      )}
      {outcome && <CandidateTable outcome={outcome} isStarting={isStarting} onStartDesign={onStartDesign} />}
    </Stack>
  );
}

function CandidateTable({
  outcome,
  isStarting,
  onStartDesign,
}: {
  outcome: { request: SizerRequest; result: SizerResult };
  isStarting: boolean;
  onStartDesign: (document: Design) => void;
}) {
  const { request, result } = outcome;
  return (
    <div>
      <Text size="sm" mb="xs">
        {result.meetingSpecCount} of {result.evaluatedCount} evaluated ladders meet the target; the best{' '}
        {result.candidates.length} are ranked below.{' '}
        <Text span c="dimmed">
          {result.method.summary}
        </Text>
      </Text>
      {result.candidates.length === 0 ? (
        <Alert color="ember">
          No ladder meets this target with these parts. Raise the secondary peak or loosen the ripple.
        </Alert>
      ) : (
        <Table.ScrollContainer minWidth={900}>
          <Table striped verticalSpacing={4} aria-label="Sizer candidates">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Rank</Table.Th>
                <Table.Th miw={130}>Ladder</Table.Th>
                <Table.Th>Capacitors</Table.Th>
                <Table.Th>Diode</Table.Th>
                <Table.Th>Output</Table.Th>
                <Table.Th>Ripple</Table.Th>
                <Table.Th>Stored energy</Table.Th>
                <Table.Th>Worst margin</Table.Th>
                <Table.Th>Parts</Table.Th>
                <Table.Th>Part codes</Table.Th>
                <Table.Th>Cost</Table.Th>
                <Table.Th>Design</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {result.candidates.map((candidate) => {
                // Each value whole on its line ("1.2 nF", never "1.2" over "nF"); the list breaks between values.
                const distinct = [...new Set(candidate.capacitorsF)]
                  .map((v) => formatQuantity(v, 'F').replace(' ', '\u00a0'))
                  .join(' … ');
                const codes = partCodesOf(candidate);
                const name = `${candidate.topology} ${candidate.cellCount} cells, ${candidate.grading}`;
                return (
                  <Table.Tr key={candidate.rank}>
                    <Table.Td fw={700}>{candidate.rank}</Table.Td>
                    <Table.Td>{name}</Table.Td>
                    <Table.Td>{distinct}</Table.Td>
                    <Table.Td style={unbroken}>
                      {candidate.diode.partCode ?? `${formatQuantity(candidate.diode.ratedPivV, 'V')} PIV`}
                    </Table.Td>
                    <Table.Td style={unbroken}>{formatQuantity(candidate.outputMeanV, 'V')}</Table.Td>
                    <Table.Td style={unbroken}>{formatQuantity(candidate.ripplePeakToPeakV, 'V')}</Table.Td>
                    <Table.Td style={unbroken}>{formatQuantity(candidate.storedEnergyJ, 'J')}</Table.Td>
                    <Table.Td style={unbroken}>{candidate.worstMarginPct.toFixed(1)} %</Table.Td>
                    <Table.Td>{candidate.partCount}</Table.Td>
                    <Table.Td ff="monospace" fz="xs">
                      {codes.length === 0
                        ? '—'
                        : codes.map((code, i) => (
                            <span key={code}>
                              {i > 0 && ', '}
                              <span style={unbroken}>{code}</span>
                            </span>
                          ))}
                    </Table.Td>
                    <Table.Td>{candidate.cost === null ? '—' : candidate.cost.toFixed(2)}</Table.Td>
                    <Table.Td>
                      <Button
                        size="xs"
                        variant="light"
                        disabled={isStarting}
                        aria-label={`Start a design from candidate ${candidate.rank}`}
                        onClick={() => onStartDesign(candidateDocument(candidate, request, `Sizer: ${name}`))}
                      >
                        Start design
                      </Button>
                    </Table.Td>
                  </Table.Tr>
                );
              })}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
    </div>
  );
}

/** The distinct part codes of a candidate: capacitors, diode, bleeder resistor. */
function partCodesOf(candidate: SizerResult['candidates'][number]): string[] {
  const codes = [...candidate.capacitorPartCodes, candidate.diode.partCode, candidate.bleeder?.resistor.partCode];
  return [...new Set(codes.filter((code): code is string => Boolean(code)))];
}
