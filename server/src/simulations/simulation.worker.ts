import type { SimulationResult, SimulationSummary, WaveformPhase, WaveformTrace } from '@ladderwright/shared/api';
import { capacitorTraceName, TRACE_NAMES } from '@ladderwright/shared/api';
import { predictDatasets } from '@ladderwright/shared/calibration';
import { validateDesign } from '@ladderwright/shared/designs';
import { ENGINE_VERSION } from '@ladderwright/shared/multiplier';
import { isDomainError } from '@ladderwright/shared/errors';
import { dischargeRuleLimits } from '@ladderwright/shared/safety';
import { ladderSpecFromDesign } from '@ladderwright/shared/circuits';
import { type PlotTrace, runDriverDesign, runDriverStartUp, runLadder } from '@ladderwright/shared/runs';
import {
  CALIBRATION_PREDICT,
  type SimulationProgressMessage,
  type SimulationTask,
  type SimulationTaskOutcome,
} from './simulation-task.types';
import { lowerThreadPriority } from '../common/workers/thread-priority';

// Requests first: this thread yields the core to the request thread whenever both want it.
lowerThreadPriority();

/*
 * Worker-thread entry (piscina). Everything here runs off the request thread; the main thread sees only
 * progress messages on `task.progressPort` and the returned outcome. The numerics are the shared
 * simulator's design-level run: its progress fraction is posted in whole percent, and it reads the shared
 * cancel flag between time steps, so a cancel stops it at its next step (the piscina abort after the cancel
 * grace remains for a phase without steps, such as the periodic-steady-state solve).
 */

/** Steps per drive period when the request gives none (the simulator's own tests use 100 to 200). */
export const DEFAULT_MAX_STEP_PER_PERIOD = 100;
/** Buckets of the min/max downsampling: at most twice as many points per trace reach the client. */
const PLOT_BUCKETS = 500;

function toWaveform(
  phase: WaveformPhase,
  trace: PlotTrace,
  name: string = TRACE_NAMES.output,
  unit: 'V' | 'A' = 'V',
): WaveformTrace {
  return { name, phase, unit, timeS: trace.timeS, values: trace.values };
}

/**
 * One design-level run of the shared simulator (`runLadder`): start-up transient, steady-state ripple
 * (periodic steady state unless a cycle count is given) and, for 'discharge' and 'full', the bleeder
 * discharge after the drive stops, with the output and every capacitor's voltage. `runLadder` downsamples
 * with min/max buckets, so peaks are kept.
 */
/**
 * Simulated-time budget of a driver design's cold start when the request gives none: 20 ms, some 500
 * oscillation periods (the run stops earlier once the output settles).
 */
const DEFAULT_STARTUP_WINDOW_S = 20e-3;

/**
 * A design driven by its blocking oscillator (`runDriverDesign`): warm-started steady state with the
 * output, collector, secondary and primary current over a few oscillation periods, the bleeder discharge
 * after the supply is switched off ('discharge', 'full'), and for 'startup' and 'full' a push-button start
 * from an empty ladder until it settles or `options.startUpWindowS` of simulated time has passed (time to
 * 90 % and to 1 % of the settled output, or the time within which it did not settle; the charging curve is
 * the cycle means). Progress: the start-up window takes the first
 * quarter when there is one.
 */
function simulateDriver(task: SimulationTask, post: (fraction: number) => void): SimulationResult {
  const { document: design, options, kind } = task;
  const shouldCancel = (): boolean => Atomics.load(task.cancelFlag, 0) === 1;
  const isDischarge = kind === 'discharge' || kind === 'full';
  const hasStartUp = kind === 'startup' || kind === 'full';
  const startShare = hasStartUp ? 0.25 : 0;
  const coldRun = hasStartUp
    ? runDriverStartUp(design, {
        maxTimeS: options.startUpWindowS ?? DEFAULT_STARTUP_WINDOW_S,
        plotBuckets: PLOT_BUCKETS,
        shouldCancel,
        onProgress: (f) => post(startShare * f),
      })
    : null;
  const run = runDriverDesign(design, {
    plotBuckets: PLOT_BUCKETS,
    shouldCancel,
    onProgress: (f) => post(startShare + (1 - startShare) * f),
    ...(isDischarge ? { dischargeToV: dischargeRuleLimits(design.targets.dischargeRule).voltageV } : {}),
  });
  const summary: SimulationSummary = {
    engineVersion: ENGINE_VERSION,
    outputMeanV: run.outputMeanV,
    ripplePeakToPeakV: run.ripplePeakToPeakV,
    timeToSteadyStateS: coldRun?.timeTo90PercentS ?? null,
    timeTo1PercentS: coldRun?.timeTo1PercentS ?? null,
    // The steady figures come from the warm run: when it did not settle, its simulated time; else the cold start's.
    notSettledWithinS: run.isSettled
      ? (coldRun?.notSettledWithinS ?? null)
      : run.oscillationFrequencyHz
        ? run.cyclesSimulated / run.oscillationFrequencyHz
        : (coldRun?.notSettledWithinS ?? null),
    inputPowerW: run.figures?.inputPowerW ?? null,
    outputPowerW: run.figures?.outputPowerW ?? null,
    efficiency: run.figures?.efficiency ?? null,
    dischargeTimeS: run.discharge?.dischargeTimeS ?? null,
    safeVoltageV: run.discharge?.safeVoltageV ?? null,
    cyclesSimulated: run.cyclesSimulated + (coldRun?.cyclesSimulated ?? 0),
    method: run.method,
    oscillationFrequencyHz: run.oscillationFrequencyHz,
    isOscillationIrregular: run.figures?.isIrregular ?? null,
    oscillationCyclesMeasured: run.figures?.cycles ?? null,
  };
  const waveforms: WaveformTrace[] = [];
  if (coldRun) waveforms.push(toWaveform('startup', coldRun.curve));
  waveforms.push(toWaveform('steady-state', run.waveforms.outputV));
  waveforms.push(toWaveform('steady-state', run.waveforms.collectorV, TRACE_NAMES.collector));
  waveforms.push(toWaveform('steady-state', run.waveforms.secondaryV, TRACE_NAMES.secondary));
  waveforms.push(toWaveform('steady-state', run.waveforms.primaryA, TRACE_NAMES.primaryCurrent, 'A'));
  if (run.discharge) {
    waveforms.push(toWaveform('discharge', run.discharge.output));
    for (const [capacitor, trace] of Object.entries(run.discharge.capacitorVoltagesV)) {
      waveforms.push(toWaveform('discharge', trace, capacitorTraceName(capacitor)));
    }
  }
  return { summary, waveforms };
}

function simulate(task: SimulationTask): SimulationResult {
  const { document: design, options, kind } = task;
  let postedPct = 0;
  const post = (fraction: number): void => {
    const progressPct = Math.floor(fraction * 100);
    if (progressPct <= postedPct) return;
    postedPct = progressPct;
    task.progressPort.postMessage({ progressPct } satisfies SimulationProgressMessage);
  };
  if (design.drive.kind === 'driver') return simulateDriver(task, post);
  const isDischarge = kind === 'discharge' || kind === 'full';
  const spec = ladderSpecFromDesign(design);
  const run = runLadder(spec, {
    until: options.cycles !== undefined ? { cycles: options.cycles } : 'steady',
    maxStepPerPeriod: options.maxStepPerPeriod ?? DEFAULT_MAX_STEP_PER_PERIOD,
    plotBuckets: PLOT_BUCKETS,
    onProgress: post,
    shouldCancel: () => Atomics.load(task.cancelFlag, 0) === 1,
    ...(isDischarge ? { dischargeToV: dischargeRuleLimits(design.targets.dischargeRule).voltageV } : {}),
  });
  const summary: SimulationSummary = {
    engineVersion: ENGINE_VERSION,
    outputMeanV: run.outputMeanV,
    ripplePeakToPeakV: run.ripplePeakToPeakV,
    timeToSteadyStateS: run.timeToSteadyStateS,
    dischargeTimeS: run.discharge?.dischargeTimeS ?? null,
    safeVoltageV: run.discharge?.safeVoltageV ?? null,
    cyclesSimulated: run.cyclesSimulated,
    method: run.method,
    timeTo1PercentS: run.timeTo1PercentS,
    startUpMethod: run.startUpMethod,
    notSettledWithinS: run.isSettled ? null : run.cyclesSimulated / spec.drive.frequencyHz,
    remainingDriftV: run.remainingDriftV,
  };
  const waveforms: WaveformTrace[] = [];
  if (kind === 'startup' || kind === 'full') waveforms.push(toWaveform('startup', run.startUp));
  if (kind !== 'discharge') waveforms.push(toWaveform('steady-state', run.ripple));
  if (run.discharge) {
    waveforms.push(toWaveform('discharge', run.discharge.output));
    // Each capacitor's own voltage, min/max-downsampled by runLadder like the output (C1, C2, … in design order).
    for (const [capacitor, trace] of Object.entries(run.discharge.capacitorVoltagesV)) {
      waveforms.push(toWaveform('discharge', trace, capacitorTraceName(capacitor)));
    }
  }
  return { summary, waveforms };
}

/** The piscina task: runs one simulation job, posting whole-percent progress; never posts the same percent twice. */
export function runSimulationTask(task: SimulationTask): SimulationTaskOutcome {
  if (task.kind === 'fault-throw') throw new Error('fault injection: the simulation worker threw');
  if (task.kind === 'fault-exit') process.exit(70);
  try {
    if (task.kind === CALIBRATION_PREDICT) {
      // The calibration set the fitted values itself within their prior ranges; the engine or the
      // simulator refusing a set is an answer (null), not a failure of the job.
      const shouldCancel = (): boolean => Atomics.load(task.cancelFlag, 0) === 1;
      return { ok: true, predictions: predictDatasets(task.document, task.datasets ?? [], { shouldCancel }) };
    }
    // Validated again here: a stored document may predate a limit of the domain.
    validateDesign(task.document);
    return { ok: true, result: simulate(task) };
  } catch (error) {
    if (isDomainError(error))
      return { ok: false, error: { code: error.code, message: error.message, field: error.field } };
    const { code, field } = error as { code?: unknown; field?: unknown };
    if (error instanceof Error && typeof code === 'string') {
      return { ok: false, error: { code, message: error.message, field: typeof field === 'string' ? field : null } };
    }
    throw error;
  } finally {
    task.progressPort.close();
  }
}
