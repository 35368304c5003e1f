import { useState } from 'react';
import { Alert, Button, Group, Progress, SimpleGrid, Stack, Text } from '@mantine/core';
import type {
  SimulationOptions,
  SimulationResult,
  SimulationSummary,
  StartSimulationRequest,
  WaveformPhase,
  WaveformTrace,
} from '@ladderwright/shared/api';
import { IRREGULAR_OSCILLATION_NOTE } from '@ladderwright/shared/analysis';
import { START_UP_WINDOW_S } from '@ladderwright/shared/api';
import { formatQuantity } from '@ladderwright/shared/units';
import { QuantityInput } from '../../../components/quantity-input';
import { useSimulationJob } from '../hooks/use-simulation-job';
import {
  aboutMean,
  collectorTrace,
  fromTime,
  lastCycle,
  primaryCurrentTrace,
  secondaryTrace,
  startOf,
  TraceChart,
  traceLabel,
  type TimeMark,
} from './waveform-charts';

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
  /** False where no job may be started (an archived project); the panel still shows what it shows. */
  canStart?: boolean;
  /** A stored simulation of this revision gives the headline figures (its waveforms are not kept). */
  hasStoredRun?: boolean;
}

/** The cold start-up window the panel proposes for a driver run (the engineer may change it). */
export const DEFAULT_STARTUP_WINDOW_S = 2e-3;

/** Why a start-up window is refused, or null when the server accepts it. */
export function startUpWindowIssue(windowS: number): string | null {
  const { min, max } = START_UP_WINDOW_S;
  if (Number.isFinite(windowS) && windowS >= min && windowS <= max) return null;
  return `the start-up window must be between ${formatQuantity(min, 's')} and ${formatQuantity(max, 's')}`;
}

/** A run of a driver design: it carries the oscillator's traces (collector, secondary, primary current). */
export function isDriverRun(result: SimulationResult): boolean {
  return result.waveforms.some(
    (w) => w.name === collectorTrace || w.name === secondaryTrace || w.name === primaryCurrentTrace,
  );
}

/** A note that starts in lower case, as a sentence of its own. */
function sentence(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The safe level to draw on a run's discharge plot: the level the run discharged to, else the design's target. */
export function dischargeSafeLevelV(
  summary: Pick<SimulationSummary, 'safeVoltageV'>,
  targetSafeVoltageV: number,
): number {
  return summary.safeVoltageV ?? targetSafeVoltageV;
}

/** Waveforms: start a full simulation job, follow its progress, cancel it, then plot start-up, ripple and discharge. */
export function WaveformsPanel({
  projectId,
  source,
  frequencyHz,
  safeVoltageV,
  isDriverDesign = false,
  canStart = true,
  hasStoredRun = false,
}: WaveformsPanelProps) {
  const [startUpWindowS, setStartUpWindowS] = useState(DEFAULT_STARTUP_WINDOW_S);
  const windowIssue = isDriverDesign ? startUpWindowIssue(startUpWindowS) : null;
  const simulation = useSimulationJob(projectId);
  const { jobId, job, result, isActive } = simulation;
  const tracesOf = (phase: WaveformPhase, unit: 'V' | 'A' = 'V') =>
    result?.waveforms.filter((w) => w.phase === phase && w.unit === unit) ?? [];
  const isDriver = result ? isDriverRun(result) : false;
  const steadyStateV = tracesOf('steady-state');
  const outputSteadyState = steadyStateV.filter((w) => w.name !== collectorTrace && w.name !== secondaryTrace);
  // A driver run's period is the oscillator's own, not the nominal drive frequency.
  const cycleFrequencyHz = (isDriver ? result?.summary.oscillationFrequencyHz : null) ?? frequencyHz;
  const startRun = () => {
    const options: SimulationOptions | undefined = isDriverDesign ? { startUpWindowS } : undefined;
    simulation.start({ ...source, kind: 'full', ...(options ? { options } : {}) });
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
        <Button onClick={startRun} disabled={!canStart || isActive || windowIssue !== null}>
          Start simulation
        </Button>
        {!canStart && (
          <Text size="sm" c="dimmed">
            The project is archived: no new simulation.
          </Text>
        )}
        {isActive && jobId && (
          <Button variant="default" onClick={simulation.cancel} loading={simulation.isCancelling}>
            Cancel simulation
          </Button>
        )}
      </Group>
      {isActive && (
        <div>
          <Text size="sm" mb={4}>
            Simulation {job?.status ?? 'queued'}: {Math.round(simulation.progressPct)} %
          </Text>
          <Progress
            value={simulation.progressPct}
            animated
            aria-label="Simulation progress"
            aria-valuenow={Math.round(simulation.progressPct)}
          />
        </div>
      )}
      {simulation.startError && (
        <Alert color="red" title="The simulation was not started">
          {simulation.startError.message}
        </Alert>
      )}
      {job?.status === 'failed' && (
        <Alert color="red" title="The simulation failed">
          {job.error?.message ?? 'No reason given.'}
        </Alert>
      )}
      {job?.status === 'cancelled' && <Alert color="gray">The simulation was cancelled.</Alert>}
      {!jobId && (
        <Text size="sm" c="dimmed">
          {hasStoredRun ? '' : 'No simulation has run for this document yet. '}Start-up, ripple over one cycle and
          discharge come from a simulation run on the server
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
            <Summary label="Time to 90 %" value={result.summary.timeToSteadyStateS} unit="s" />
            {isOnePercentTimed(result.summary) && (
              <Summary label="Time to within 1 %" value={result.summary.timeTo1PercentS ?? null} unit="s" />
            )}
            <Summary
              label={`Discharge to ${formatQuantity(dischargeSafeLevelV(result.summary, safeVoltageV), 'V')}`}
              value={result.summary.dischargeTimeS}
              unit="s"
            />
            {result.summary.oscillationFrequencyHz !== undefined && (
              <Summary label="Oscillation frequency" value={result.summary.oscillationFrequencyHz} unit="Hz" />
            )}
            <Text size="xs" c="dimmed">
              {runMethodNote(result.summary)}
            </Text>
          </Group>
          {result.summary.isOscillationIrregular === true && (
            <Text size="sm" data-oscillation="irregular">
              {sentence(IRREGULAR_OSCILLATION_NOTE)}
              {result.summary.oscillationCyclesMeasured != null
                ? ` over ${result.summary.oscillationCyclesMeasured} cycles`
                : ''}
              .
            </Text>
          )}
          {result.summary.notSettledWithinS != null && (
            <Alert color="yellow" title="Not settled">
              The output had not settled within {formatQuantity(result.summary.notSettledWithinS, 's')} of simulated
              time
              {result.summary.remainingDriftV != null
                ? `; it may still move by about ${formatQuantity(result.summary.remainingDriftV, 'V')} (extrapolated from the last cycles).`
                : '; the last cycles show no steady approach to extrapolate from.'}
            </Alert>
          )}
          <SimpleGrid type="container" cols={{ base: 1, '720px': 2 }} spacing="md">
            <TraceChart
              title="Start-up"
              traces={tracesOf('startup')}
              valueTitle={result.summary.startUpMethod === 'envelope-following' ? 'Output, cycle mean' : undefined}
              timeMarks={startUpMarks(result.summary)}
              firstViewEndS={startUpViewEndS(result.summary) ?? undefined}
              isTimeFromZero
            />
            <RippleChart traces={lastCycle(outputSteadyState, cycleFrequencyHz)} />
            <TraceChart
              title="Discharge"
              traces={tracesOf('discharge')}
              safeVoltageV={dischargeSafeLevelV(result.summary, safeVoltageV)}
              isTimeFromZero
            />
            {isDriver && (
              <>
                <TraceChart
                  title="Collector and secondary"
                  traces={fromTime(
                    steadyStateV.filter((w) => w.name === collectorTrace),
                    startOf(steadyStateV),
                  )}
                  rightTraces={fromTime(
                    steadyStateV.filter((w) => w.name === secondaryTrace),
                    startOf(steadyStateV),
                  )}
                  timeOriginS={startOf(steadyStateV)}
                />
                <TraceChart
                  title="Primary current"
                  traces={fromTime(tracesOf('steady-state', 'A'), startOf(tracesOf('steady-state', 'A')))}
                  timeOriginS={startOf(tracesOf('steady-state', 'A'))}
                />
              </>
            )}
          </SimpleGrid>
        </>
      )}
    </Stack>
  );
}

/** The run times the settling to within 1 % (a driver's cold start, a ladder's start-up by envelope following). */
const isOnePercentTimed = (summary: SimulationSummary): boolean =>
  summary.timeTo1PercentS !== undefined && summary.startUpMethod !== 'transient';

/** The times to 90 % and to within 1 % of the settled output, as lines on the Start-up plot (those the run gives). */
export function startUpMarks(summary: SimulationSummary): TimeMark[] {
  const marks: TimeMark[] = [];
  const at90S = summary.timeToSteadyStateS;
  if (at90S !== null)
    marks.push({ key: '90', label: `time to 90 % (${formatQuantity(at90S, 's')})`, tag: '90 %', timeS: at90S });
  const at1S = isOnePercentTimed(summary) ? (summary.timeTo1PercentS ?? null) : null;
  if (at1S !== null)
    marks.push({
      key: '1',
      label: `time to within 1 % (${formatQuantity(at1S, 's')})`,
      tag: '1 %',
      timeS: at1S,
      isLater: true,
    });
  return marks;
}

/** How far past the time to within 1 % the Start-up plot first reaches: the settled tail is a third of it. */
export const START_UP_VIEW_PER_SETTLING = 1.5;

/**
 * Where the Start-up plot's first view ends: 1.5× the time to within 1 % (else 3× the time to 90 %), so the rise
 * fills the plot and the settled tail shows without dominating; null when the run times neither.
 */
export function startUpViewEndS(summary: SimulationSummary): number | null {
  const at1S = isOnePercentTimed(summary) ? (summary.timeTo1PercentS ?? null) : null;
  if (at1S !== null && at1S > 0) return START_UP_VIEW_PER_SETTLING * at1S;
  const at90S = summary.timeToSteadyStateS;
  return at90S !== null && at90S > 0 ? 3 * at90S : null;
}

/** How the run got its figures, in plain words, with the number of cycles it simulated. */
export function runMethodNote(summary: SimulationSummary): string {
  const steady =
    summary.method === 'periodic-steady-state'
      ? 'Steady state solved directly as a periodic state'
      : 'Steady state from the last simulated cycles';
  const startUp =
    summary.startUpMethod === 'envelope-following' ? '; start-up by envelope following, plotted as cycle means' : '';
  return `${steady}${startUp}; ${summary.cyclesSimulated} cycles simulated`;
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

/** The last cycle of the output as a scope in AC coupling shows it: about its mean, from the cycle's start. */
function RippleChart({ traces }: { traces: WaveformTrace[] }) {
  const originS = startOf(traces);
  const { traces: ripple, meansV } = aboutMean(fromTime(traces, originS));
  return (
    <TraceChart
      title="Ripple over one cycle"
      traces={ripple}
      timeOriginS={originS}
      valueTitle="Ripple"
      names={ripple.map((trace, i) => `${traceLabel(trace.name)} − ${formatQuantity(meansV[i] ?? 0, 'V', 4)}`)}
    />
  );
}
