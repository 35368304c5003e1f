import type { SimulationResult, SimulationSummary, WaveformPhase, WaveformTrace } from '@ladderwright/shared/api';
import type { DischargeRule } from '@ladderwright/shared/designs';
import { isDomainError } from '@ladderwright/shared/errors';
import { ladderSpecFromDesign, type PlotTrace, runLadder } from '@ladderwright/shared/sim';
import type { SimulationProgressMessage, SimulationTask, SimulationTaskOutcome } from './simulation-task.types';

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

function dischargeVoltageV(rule: DischargeRule): number {
  if (typeof rule === 'object') return rule.voltageV;
  return rule === '60V-5s' ? 60 : 50;
}

function toWaveform(phase: WaveformPhase, trace: PlotTrace, name = 'V(top)'): WaveformTrace {
  return { name, phase, unit: 'V', timeS: trace.timeS, values: trace.values };
}

/**
 * One design-level run of the shared simulator (`runLadder`): start-up transient, steady-state ripple
 * (periodic steady state unless a cycle count is given) and, for 'discharge' and 'full', the bleeder
 * discharge after the drive stops, with the output and every capacitor's voltage. `runLadder` downsamples
 * with min/max buckets, so peaks are kept.
 */
function simulate(task: SimulationTask): SimulationResult {
  const { document: design, options, kind } = task;
  let postedPct = 0;
  const isDischarge = kind === 'discharge' || kind === 'full';
  const run = runLadder(ladderSpecFromDesign(design), {
    until: options.cycles !== undefined ? { cycles: options.cycles } : 'steady',
    maxStepPerPeriod: options.maxStepPerPeriod ?? DEFAULT_MAX_STEP_PER_PERIOD,
    plotBuckets: PLOT_BUCKETS,
    onProgress: (fraction) => {
      const progressPct = Math.floor(fraction * 100);
      if (progressPct <= postedPct) return;
      postedPct = progressPct;
      task.progressPort.postMessage({ progressPct } satisfies SimulationProgressMessage);
    },
    shouldCancel: () => Atomics.load(task.cancelFlag, 0) === 1,
    ...(isDischarge ? { dischargeToV: dischargeVoltageV(design.targets.dischargeRule) } : {}),
  });
  const summary: SimulationSummary = {
    outputMeanV: run.outputMeanV,
    ripplePeakToPeakV: run.ripplePeakToPeakV,
    timeToSteadyStateS: run.timeToSteadyStateS,
    dischargeTimeS: run.discharge?.dischargeTimeS ?? null,
    safeVoltageV: run.discharge?.safeVoltageV ?? null,
    cyclesSimulated: run.cyclesSimulated,
    method: run.method,
  };
  const waveforms: WaveformTrace[] = [];
  if (kind === 'startup' || kind === 'full') waveforms.push(toWaveform('startup', run.startUp));
  if (kind !== 'discharge') waveforms.push(toWaveform('steady-state', run.ripple));
  if (run.discharge) {
    waveforms.push(toWaveform('discharge', run.discharge.output));
    // Each capacitor's own voltage, min/max-downsampled by runLadder like the output (C1, C2, … in design order).
    for (const [capacitor, trace] of Object.entries(run.discharge.capacitorVoltagesV)) {
      waveforms.push(toWaveform('discharge', trace, `V(${capacitor})`));
    }
  }
  return { summary, waveforms };
}

/** The piscina task: runs one simulation job, posting whole-percent progress; never posts the same percent twice. */
export function runSimulationTask(task: SimulationTask): SimulationTaskOutcome {
  if (task.kind === 'fault-throw') throw new Error('fault injection: the simulation worker threw');
  if (task.kind === 'fault-exit') process.exit(70);
  try {
    return { ok: true, result: simulate(task) };
  } catch (error) {
    if (isDomainError(error)) return { ok: false, error: { code: error.code, message: error.message, field: error.field } };
    const { code, field } = error as { code?: unknown; field?: unknown };
    if (error instanceof Error && typeof code === 'string') {
      return { ok: false, error: { code, message: error.message, field: typeof field === 'string' ? field : null } };
    }
    throw error;
  } finally {
    task.progressPort.close();
  }
}
