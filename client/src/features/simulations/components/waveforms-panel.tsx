import { useState } from 'react';
import { Alert, Button, Group, Paper, Progress, SimpleGrid, Stack, Text } from '@mantine/core';
import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type {
  SimulationOptions,
  SimulationResult,
  SimulationSummary,
  StartSimulationRequest,
  WaveformPhase,
  WaveformTrace,
} from '@ladderwright/shared/api';
import { START_UP_WINDOW_S } from '@ladderwright/shared/api';
import { formatQuantity } from '@ladderwright/shared/units';
import { QuantityInput } from '../../../components/quantity-input';
import { quantityTickFormatter } from '../../../lib/tick-format';
import { useCancelSimulation } from '../api/cancel-simulation';
import { isSimulationActive, useSimulation } from '../api/get-simulation';
import { useStartSimulation } from '../api/start-simulation';

export interface WaveformsPanelProps {
  projectId: string;
  /** What to simulate: the document being edited or a saved revision (without `kind`). */
  source: Omit<StartSimulationRequest, 'kind'>;
  /** Drive frequency, to cut one cycle out of the steady-state trace. */
  frequencyHz: number;
  /** The design's safe touch level; the discharge plot draws the run's own level when its result gives one. */
  safeVoltageV: number;
  /** The design is fed by its blocking oscillator: the panel offers the cold start-up window. */
  isDriverDesign?: boolean;
}

/** The cold start-up window the panel proposes for a driver run (the engineer may change it). */
export const DEFAULT_STARTUP_WINDOW_S = 2e-3;

/** Why a start-up window is refused, or null when the server accepts it. */
export function startUpWindowIssue(windowS: number): string | null {
  const { min, max } = START_UP_WINDOW_S;
  if (Number.isFinite(windowS) && windowS >= min && windowS <= max) return null;
  return `the start-up window must be between ${formatQuantity(min, 's')} and ${formatQuantity(max, 's')}`;
}

/** Trace names of a driver run's steady state besides the output. */
const collectorTrace = 'V(col)';
const secondaryTrace = 'V(s)';
const primaryCurrentTrace = 'I(Lp)';
const traceLabels: Readonly<Record<string, string>> = {
  [collectorTrace]: 'collector V(col)',
  [secondaryTrace]: 'secondary V(s)',
  [primaryCurrentTrace]: 'primary I(Lp)',
};

/** A run of a driver design: it carries the oscillator's traces (collector, secondary, primary current). */
export function isDriverRun(result: SimulationResult): boolean {
  return result.waveforms.some(
    (w) => w.name === collectorTrace || w.name === secondaryTrace || w.name === primaryCurrentTrace,
  );
}

/** The safe level to draw on a run's discharge plot: the level the run discharged to, else the design's target. */
export function dischargeSafeLevelV(
  summary: Pick<SimulationSummary, 'safeVoltageV'>,
  targetSafeVoltageV: number,
): number {
  return summary.safeVoltageV ?? targetSafeVoltageV;
}

const traceColors = [
  'var(--mantine-primary-color-filled)',
  'var(--mantine-color-ember-7)',
  'var(--mantine-color-blue-6)',
  'var(--mantine-color-grape-6)',
];

/** Waveforms: start a full simulation job, follow its progress, cancel it, then plot start-up, ripple and discharge. */
export function WaveformsPanel({
  projectId,
  source,
  frequencyHz,
  safeVoltageV,
  isDriverDesign = false,
}: WaveformsPanelProps) {
  const [jobId, setJobId] = useState<string | null>(null);
  const [startUpWindowS, setStartUpWindowS] = useState(DEFAULT_STARTUP_WINDOW_S);
  const windowIssue = isDriverDesign ? startUpWindowIssue(startUpWindowS) : null;
  const start = useStartSimulation(projectId);
  const cancel = useCancelSimulation(projectId);
  const job = useSimulation(projectId, jobId);
  const isActive = start.isPending || isSimulationActive(job.data) || (jobId !== null && !job.data);
  const result = job.data?.status === 'succeeded' ? job.data.result : undefined;
  const tracesOf = (phase: WaveformPhase, unit: 'V' | 'A' = 'V') =>
    result?.waveforms.filter((w) => w.phase === phase && w.unit === unit) ?? [];
  const isDriver = result ? isDriverRun(result) : false;
  const steadyStateV = tracesOf('steady-state');
  const outputSteadyState = steadyStateV.filter((w) => w.name !== collectorTrace && w.name !== secondaryTrace);
  // A driver run's period is the oscillator's own, not the nominal drive frequency.
  const cycleFrequencyHz = (isDriver ? result?.summary.oscillationFrequencyHz : null) ?? frequencyHz;
  const startRun = () => {
    const options: SimulationOptions | undefined = isDriverDesign ? { startUpWindowS } : undefined;
    start.mutate(
      { ...source, kind: 'full', ...(options ? { options } : {}) },
      { onSuccess: (answer) => setJobId(answer.jobId) },
    );
  };

  return (
    <Stack gap="sm">
      <Group gap="sm" align="center">
        {isDriverDesign && (
          <QuantityInput
            label="Start-up window"
            unit="s"
            value={startUpWindowS}
            onChange={setStartUpWindowS}
            issue={windowIssue}
            significantFigures={3}
            w={160}
            size="xs"
            disabled={isActive}
          />
        )}
        <Button onClick={startRun} disabled={isActive || windowIssue !== null}>
          Start simulation
        </Button>
        {isActive && jobId && (
          <Button variant="default" onClick={() => cancel.mutate(jobId)} loading={cancel.isPending}>
            Cancel simulation
          </Button>
        )}
      </Group>
      {isActive && (
        <div>
          <Text size="sm" mb={4}>
            Simulation {job.data?.status ?? 'queued'}: {Math.round(job.data?.progressPct ?? 0)} %
          </Text>
          <Progress
            value={job.data?.progressPct ?? 0}
            animated
            aria-label="Simulation progress"
            aria-valuenow={Math.round(job.data?.progressPct ?? 0)}
          />
        </div>
      )}
      {start.isError && (
        <Alert color="red" title="The simulation was not started">
          {start.error.message}
        </Alert>
      )}
      {job.data?.status === 'failed' && (
        <Alert color="red" title="The simulation failed">
          {job.data.error?.message ?? 'No reason given.'}
        </Alert>
      )}
      {job.data?.status === 'cancelled' && <Alert color="gray">The simulation was cancelled.</Alert>}
      {!jobId && (
        <Text size="sm" c="dimmed">
          No simulation has run for this document yet. Start-up, ripple over one cycle and discharge come from a
          transient run on the server
          {isDriverDesign
            ? '; for this driver design also the collector and secondary voltages and the primary current, with the start-up timed over the window set here.'
            : '.'}
        </Text>
      )}
      {result && (
        <>
          <Group gap="lg">
            <Summary label="Output (mean)" value={result.summary.outputMeanV} unit="V" />
            <Summary label="Ripple (peak-to-peak)" value={result.summary.ripplePeakToPeakV} unit="V" />
            <Summary label="Time to steady state" value={result.summary.timeToSteadyStateS} unit="s" />
            <Summary
              label={`Discharge to ${formatQuantity(dischargeSafeLevelV(result.summary, safeVoltageV), 'V')}`}
              value={result.summary.dischargeTimeS}
              unit="s"
            />
            {result.summary.oscillationFrequencyHz !== undefined && (
              <Summary label="Oscillation frequency" value={result.summary.oscillationFrequencyHz} unit="Hz" />
            )}
            <Text size="xs" c="dimmed">
              {result.summary.method}, {result.summary.cyclesSimulated} cycles
            </Text>
          </Group>
          <SimpleGrid cols={{ base: 1, lg: 3 }} spacing="md">
            <TraceChart title="Start-up" traces={tracesOf('startup')} isTimeFromZero />
            <TraceChart title="Ripple over one cycle" traces={lastCycle(outputSteadyState, cycleFrequencyHz)} />
            <TraceChart
              title="Discharge"
              traces={tracesOf('discharge')}
              safeVoltageV={dischargeSafeLevelV(result.summary, safeVoltageV)}
              isTimeFromZero
            />
          </SimpleGrid>
          {isDriver && (
            <SimpleGrid cols={{ base: 1, lg: 2 }} spacing="md">
              <TraceChart
                title="Collector and secondary"
                traces={steadyStateV.filter((w) => w.name === collectorTrace || w.name === secondaryTrace)}
              />
              <TraceChart title="Primary current" traces={tracesOf('steady-state', 'A')} unit="A" />
            </SimpleGrid>
          )}
        </>
      )}
    </Stack>
  );
}

function Summary({ label, value, unit }: { label: string; value: number | null; unit: 'V' | 's' | 'Hz' }) {
  return (
    <div>
      <Text size="xs" c="dimmed">
        {label}
      </Text>
      <Text fw={700}>{value === null ? '—' : formatQuantity(value, unit)}</Text>
    </div>
  );
}

/** The samples of the last drive period of each trace (ripple is read over one cycle). */
function lastCycle(traces: WaveformTrace[], frequencyHz: number): WaveformTrace[] {
  const periodS = 1 / frequencyHz;
  return traces.map((trace) => {
    const endS = trace.timeS[trace.timeS.length - 1] ?? 0;
    const keep = trace.timeS.map((t) => t >= endS - periodS);
    return {
      ...trace,
      timeS: trace.timeS.filter((_, i) => keep[i]),
      values: trace.values.filter((_, i) => keep[i]),
    };
  });
}

function TraceChart({
  title,
  traces,
  safeVoltageV,
  isTimeFromZero = false,
  unit = 'V',
}: {
  title: string;
  traces: WaveformTrace[];
  safeVoltageV?: number;
  /** What the traces carry: volts, or amperes for a current. */
  unit?: 'V' | 'A';
  /** Start the time axis at 0 s (start-up, discharge) rather than at the first sample (one cycle cut out of a run). */
  isTimeFromZero?: boolean;
}) {
  const rows = new Map<number, Record<string, number>>();
  for (const trace of traces) {
    trace.timeS.forEach((t, i) => {
      const row = rows.get(t) ?? { t };
      row[trace.name] = trace.values[i] ?? NaN;
      rows.set(t, row);
    });
  }
  const data = [...rows.values()].sort((a, b) => (a.t ?? 0) - (b.t ?? 0));
  const timeTick = quantityTickFormatter(
    isTimeFromZero ? [0, ...traces.flatMap((trace) => trace.timeS)] : traces.flatMap((trace) => trace.timeS),
    's',
  );
  const valueTick = quantityTickFormatter(
    traces.flatMap((trace) => trace.values),
    unit,
  );
  const negative = traces.some((trace) => trace.values.length > 0 && trace.values.every((v) => v <= 0));
  return (
    <Paper withBorder p="sm" role="figure" aria-label={title}>
      <Text size="sm" fw={600} mb={4}>
        {title}
      </Text>
      {traces.length === 0 ? (
        <Text size="sm" c="dimmed">
          This run has no trace for this phase.
        </Text>
      ) : (
        <div style={{ width: '100%', height: 220 }}>
          <ResponsiveContainer>
            <LineChart data={data} margin={{ top: 8, right: 12, bottom: 8, left: 8 }}>
              <CartesianGrid strokeDasharray="2 4" />
              <XAxis
                dataKey="t"
                type="number"
                domain={[isTimeFromZero ? 0 : 'dataMin', 'dataMax']}
                tick={{ fontSize: 11 }}
                tickFormatter={timeTick}
              />
              <YAxis tick={{ fontSize: 11 }} tickFormatter={valueTick} width={72} domain={['auto', 'auto']} />
              <Tooltip
                formatter={(v) => formatQuantity(Number(v), unit, 4)}
                labelFormatter={(t) => formatQuantity(Number(t), 's', 4)}
              />
              {traces.length > 1 && <Legend wrapperStyle={{ fontSize: 11 }} />}
              {safeVoltageV !== undefined && (
                <ReferenceLine
                  y={negative ? -safeVoltageV : safeVoltageV}
                  stroke="var(--mantine-color-ember-7)"
                  strokeDasharray="5 3"
                  label={{
                    value: `safe level ${formatQuantity(safeVoltageV, 'V')}`,
                    fontSize: 10,
                    position: 'insideTopRight',
                  }}
                />
              )}
              {traces.map((trace, i) => (
                <Line
                  key={trace.name}
                  dataKey={trace.name}
                  name={traceLabels[trace.name] ?? trace.name}
                  dot={false}
                  strokeWidth={1.6}
                  stroke={traceColors[i % traceColors.length]}
                  isAnimationActive={false}
                  connectNulls
                />
              ))}
            </LineChart>
          </ResponsiveContainer>
        </div>
      )}
    </Paper>
  );
}
