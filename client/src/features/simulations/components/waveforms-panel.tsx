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
import type { SimulationSummary, StartSimulationRequest, WaveformPhase, WaveformTrace } from '@ladderwright/shared/api';
import { formatQuantity } from '@ladderwright/shared/units';
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
export function WaveformsPanel({ projectId, source, frequencyHz, safeVoltageV }: WaveformsPanelProps) {
  const [jobId, setJobId] = useState<string | null>(null);
  const start = useStartSimulation(projectId);
  const cancel = useCancelSimulation(projectId);
  const job = useSimulation(projectId, jobId);
  const isActive = start.isPending || isSimulationActive(job.data) || (jobId !== null && !job.data);
  const result = job.data?.status === 'succeeded' ? job.data.result : undefined;
  const tracesOf = (phase: WaveformPhase) => result?.waveforms.filter((w) => w.phase === phase && w.unit === 'V') ?? [];

  return (
    <Stack gap="sm">
      <Group gap="sm">
        <Button
          onClick={() => start.mutate({ ...source, kind: 'full' }, { onSuccess: (answer) => setJobId(answer.jobId) })}
          disabled={isActive}
        >
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
          transient run on the server.
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
            <Text size="xs" c="dimmed">
              {result.summary.method}, {result.summary.cyclesSimulated} cycles
            </Text>
          </Group>
          <SimpleGrid cols={{ base: 1, lg: 3 }} spacing="md">
            <TraceChart title="Start-up" traces={tracesOf('startup')} isTimeFromZero />
            <TraceChart title="Ripple over one cycle" traces={lastCycle(tracesOf('steady-state'), frequencyHz)} />
            <TraceChart
              title="Discharge"
              traces={tracesOf('discharge')}
              safeVoltageV={dischargeSafeLevelV(result.summary, safeVoltageV)}
              isTimeFromZero
            />
          </SimpleGrid>
        </>
      )}
    </Stack>
  );
}

function Summary({ label, value, unit }: { label: string; value: number | null; unit: 'V' | 's' }) {
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
}: {
  title: string;
  traces: WaveformTrace[];
  safeVoltageV?: number;
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
    'V',
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
                formatter={(v) => formatQuantity(Number(v), 'V', 4)}
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
                  name={trace.name}
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
