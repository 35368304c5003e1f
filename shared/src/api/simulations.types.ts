import type { SimulatedFigures } from '../analysis';
import type { Design } from '../designs';
import type { SpreadStatistics } from '../sizing';

/**
 * What a simulation job computes: the start-up from empty capacitors, the periodic steady state with its
 * ripple, the discharge through the bleeder after the drive stops, or all three in one run.
 */
export type SimulationKind = 'startup' | 'steady-state' | 'discharge' | 'full';

export type SimulationJobStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';

export interface SimulationOptions {
  /** Time steps per drive period at least (the largest step is the period divided by this; 8 … 5000, default 100). */
  maxStepPerPeriod?: number;
  /** Drive periods of the start-up transient (1 … 20000); without it the run goes on until the output settles. */
  cycles?: number;
  /** Driver designs: length of the push-button start-up from an empty ladder (s, 1e-4 … 0.1, default 2e-3). */
  startUpWindowS?: number;
}

/**
 * POST /api/projects/:projectId/simulations body: either a design `document`, or a stored revision by
 * `designId` and `revisionNumber`.
 */
export interface StartSimulationRequest {
  kind: SimulationKind;
  document?: Design;
  designId?: string;
  revisionNumber?: number;
  options?: SimulationOptions;
}

/** 202 answer to StartSimulationRequest. */
export interface StartSimulationResponse {
  jobId: string;
  status: 'queued';
}

export type WaveformPhase = 'startup' | 'steady-state' | 'discharge';

/**
 * One trace of the Waveforms, downsampled for plotting: each time bucket keeps its minimum and maximum
 * sample, so the peaks of the full-resolution trace are always among `values`.
 */
export interface WaveformTrace {
  /**
   * 'V(top)' for the ladder output voltage; 'V(C3)' for the voltage across capacitor C3 (discharge); for a
   * driver design also 'V(col)' collector, 'V(s)' secondary and 'I(Lp)' primary current (steady state).
   */
  name: string;
  phase: WaveformPhase;
  unit: 'V' | 'A';
  timeS: number[];
  values: number[];
}

/** Headline figures of a run; a figure the kind does not compute is null. */
export interface SimulationSummary {
  /** The engine version that ran it (absent in runs stored before it was recorded). */
  engineVersion?: string;
  outputMeanV: number | null;
  ripplePeakToPeakV: number | null;
  timeToSteadyStateS: number | null;
  dischargeTimeS: number | null;
  /** Level the discharge ran down to (the design's discharge rule, magnitude); null when the kind has no discharge. */
  safeVoltageV: number | null;
  cyclesSimulated: number;
  /** How the steady-state figures were obtained. */
  method: 'transient' | 'periodic-steady-state';
  /** Driver designs: the blocking oscillator's frequency at steady state (Hz); absent for a sine or pulse drive. */
  oscillationFrequencyHz?: number | null;
  /**
   * Driver designs: the steady-state cycles spread by more than 20 % in length (the transistor turns on in
   * bursts), so `oscillationFrequencyHz` is their mean; absent in runs stored before it was recorded.
   */
  isOscillationIrregular?: boolean | null;
  /**
   * Driver designs: the whole cycles `oscillationFrequencyHz` was measured over (an irregular oscillation is
   * counted until its mean holds still, at most 512); absent in runs stored before it was recorded.
   */
  oscillationCyclesMeasured?: number | null;
  /**
   * Time to within 1 % of the settled output (s), from which it stays there: a driver design's cold start, a
   * ladder's start-up by envelope following; null when it did not settle (or a ladder transient, which does not time it).
   */
  timeTo1PercentS?: number | null;
  /** Ladder runs: how the start-up was computed (envelope following over the cycle-to-cycle map, or every cycle). */
  startUpMethod?: 'envelope-following' | 'transient';
  /**
   * The simulated time within which the output did not settle (s), else null: a driver design's cold start,
   * or a ladder run whose transient ended before its estimated remaining drift fell within 0.02 %.
   */
  notSettledWithinS?: number | null;
  /** Ladder runs: estimated change of the output mean still to come after outputMeanV (V); null when unknown. */
  remainingDriftV?: number | null;
  /** Driver designs over whole cycles at steady state: power drawn, power into the load (W), their ratio. */
  inputPowerW?: number | null;
  outputPowerW?: number | null;
  efficiency?: number | null;
}

export interface SimulationResult {
  summary: SimulationSummary;
  waveforms: WaveformTrace[];
}

export interface SimulationJobError {
  code: string;
  message: string;
}

/** GET /api/projects/:projectId/simulations/:jobId answer. `result` only when succeeded, `error` only when failed. */
export interface SimulationJob {
  id: string;
  projectId: string;
  kind: SimulationKind;
  status: SimulationJobStatus;
  progressPct: number;
  designId: string | null;
  revisionNumber: number | null;
  requestedBy: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  error?: SimulationJobError;
  result?: SimulationResult;
}

/**
 * GET /api/projects/:projectId/designs/:designId/revisions/:revisionNumber/simulated-figures answer: the newest
 * succeeded full simulation of the revision that is current (same document, same engine version as its report),
 * or null. Headline figures, Checks and the spec sheet use it in place of the estimate where it exists.
 */
export interface CurrentSimulationResponse {
  simulation: SimulatedFigures | null;
  jobId: string | null;
}

/** A batch's members: one value per member of a number in the document, or seeded draws of the part tolerances. */
export type SimulationBatchKind = 'sweep' | 'monte-carlo';

/**
 * POST /api/projects/:projectId/simulation-batches body: the base design (a `document`, or a stored revision by
 * `designId` and `revisionNumber`), the simulation each member runs (`simulationKind`, `options`), and either
 * `sweep` (the number at `path` takes each of `values`) or `monteCarlo` (`trials` designs whose capacitors are
 * drawn within their tolerance from `seed`). Each member is a simulation job on the shared queue, so every app
 * instance with simulation workers takes a share.
 */
export interface StartSimulationBatchRequest {
  simulationKind: SimulationKind;
  document?: Design;
  designId?: string;
  revisionNumber?: number;
  options?: SimulationOptions;
  sweep?: { path: string; values: number[] };
  monteCarlo?: { trials: number; seed: number };
}

/** 202 answer to StartSimulationBatchRequest. */
export interface StartSimulationBatchResponse {
  batchId: string;
  status: 'running';
  memberCount: number;
}

/** One member's outcome: its varied numbers by field path, and its run's summary once it succeeded. */
export interface SimulationBatchMember {
  index: number;
  jobId: string;
  status: SimulationJobStatus;
  variant: Record<string, number>;
  summary: SimulationSummary | null;
  error?: SimulationJobError;
}

/** Mean, sample standard deviation, extremes and nearest-rank percentiles of one figure over the succeeded members. */
export type SimulationBatchFigureSpread = Omit<SpreadStatistics, 'histogram'> & { count: number };

/** GET /api/projects/:projectId/simulation-batches/:batchId answer. */
export interface SimulationBatch {
  id: string;
  projectId: string;
  kind: SimulationBatchKind;
  simulationKind: SimulationKind;
  /** running while any member is queued or running; then succeeded when any member succeeded, else failed. */
  status: SimulationJobStatus;
  progressPct: number;
  memberCount: number;
  membersEnded: number;
  createdAt: string;
  finishedAt: string | null;
  members: SimulationBatchMember[];
  /** Over the succeeded members, once the batch has ended. */
  spread: {
    outputMeanV: SimulationBatchFigureSpread | null;
    ripplePeakToPeakV: SimulationBatchFigureSpread | null;
  } | null;
}
