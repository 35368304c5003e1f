import type { BenchLossKind, DriverBenchFigures } from '../driver/driver-report';
import type { EnergyAccount } from '../sim/energy-meter';
import type { LadderRunResult, PlotTrace } from './ladder-runs';

export interface DriverRunOptions {
  /**
   * 'warm' (default): the ladder capacitors start at the engine's steady-state estimate (analyzeDesign's
   * node voltages) and the run settles the rest. 'cold': the push-button start from an empty ladder.
   */
  start?: 'warm' | 'cold';
  /** Simulate exactly this long (s) instead of until the output settles (the cold start-up window). */
  windowS?: number;
  /** Settled when the projected remaining change of the output's window mean is below this fraction; default 1e-3. */
  settleFraction?: number;
  /** Estimated oscillation periods per settling window (K); default 20. */
  settleWindowPeriods?: number;
  /** Maximum time step; default 1/200 of the estimated oscillation period. */
  maxStepS?: number;
  /** The solver's relative tolerance (sim/tolerances.ts); default 1e-3. Comparisons with ngspice take 1e-5. */
  relativeTolerance?: number;
  /** Give up settling after this many estimated oscillation periods; default 20000. */
  maxCycles?: number;
  /** Measured oscillation periods of the full-resolution steady-state waveforms at the end; default 4. */
  waveformPeriods?: number;
  /** After settling, switch the supply off and follow the bleeder discharge down to this voltage. */
  dischargeToV?: number;
  plotBuckets?: number;
  /** Called with the completed fraction, 0..1, non-decreasing, about every 1 % and last with 1. */
  onProgress?: (fraction: number) => void;
  /** Checked between time steps; true stops the run with a DomainError of code 'cancelled'. */
  shouldCancel?: () => boolean;
}

/** Waveforms of the last few oscillation periods, min/max downsampled (peaks kept). */
export interface DriverWaveforms {
  /** Ladder top, V. */
  outputV: PlotTrace;
  /** Collector to ground, V. */
  collectorV: PlotTrace;
  /** Secondary dot end to ground, V. */
  secondaryV: PlotTrace;
  /** Primary winding current from the supply into the collector, A. */
  primaryA: PlotTrace;
}

/** Loss kinds of a driver circuit's elements (see lossKindOf), W each in DriverFigures.lossesW; the estimate groups its losses the same way. */
export type DriverLossKind = BenchLossKind;

/**
 * Bench figures over whole oscillation cycles at the end of a run (SI units; efficiency 0–1): the estimate's
 * figures (DriverBenchFigures) as measured, output power being the power into the load at the output terminal
 * (the bleeder and output resistor are losses), with the number of cycles and the losses by kind in W.
 */
export interface DriverFigures extends Omit<DriverBenchFigures, 'losses'> {
  /** Whole cycles the frequency was measured over (more than the recorded ones when irregular). */
  cycles: number;
  /** First and last turn-on (or cycle mark) of those cycles, s of the run. */
  measuredFromS: number;
  measuredToS: number;
  /** The periods of the measured cycles spread (bursts): the frequency is their mean (oscillation-measures.ts). */
  isIrregular?: boolean;
  lossesW: Partial<Record<DriverLossKind, number>>;
}

export interface DriverRunResult extends LadderRunResult {
  start: 'warm' | 'cold';
  /** Why a warm start fell back to a cold one (the engine's estimate failed), else null. */
  warmStartFallback: string | null;
  /** Figures over whole cycles of the final waveforms; null when fewer than one whole cycle was seen. */
  figures: DriverFigures | null;
  /** Whether the settling criterion was met (false: a fixed window, or the cycle budget ran out). */
  isSettled: boolean;
  /** Capacitor voltages the run started from (design order), V. */
  initialCapacitorVoltagesV: number[];
  /** Capacitor voltages at the end of the recorded cycles, before any discharge (design order), V. */
  finalCapacitorVoltagesV: number[];
  /** How often the slow charging mode was extrapolated (see runDriverDesign). */
  extrapolations: number;
  /** Oscillation frequency over whole cycles of the final waveforms, from the transistor's turn-on events. */
  oscillationFrequencyHz: number | null;
  /** Energy drawn from the supply, dissipated per element and stored, since the start or the last extrapolation (before any discharge). */
  energy: EnergyAccount;
  waveforms: DriverWaveforms;
}
