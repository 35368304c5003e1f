import type { MeasuredPoint } from '../bench/bench.types';

/** The uncertain parameters the engine declares (see `uncertainParameters`). */
export type CalibrationParameterId =
  | 'couplingCoefficient'
  | 'transistorGain'
  | 'cellInternalResistance'
  | 'secondaryResistance'
  | 'secondarySelfCapacitance'
  | 'driveSourceResistance'
  | 'diodeSaturationCurrent'
  | 'diodeSeriesResistance'
  | 'ladderStrayCapacitance'
  | 'capacitanceScale'
  | 'bleederResistance';

/**
 * How a bench run is read for a fit: which curve it is and which model predicts it. The waveforms are scope
 * captures in steady state of the collector or of the secondary's dot end, each to ground, fitted sample by
 * sample after alignment in time (`waveform-model.ts`).
 */
export type CalibrationDataUse = 'load-sweep' | 'start-up' | 'discharge' | 'collector-waveform' | 'secondary-waveform';

/** Where a curve's prediction comes from: the engine's instant estimate or the circuit simulator. */
export type CalibrationModelKind = 'estimate' | 'simulator';

/** A prior range in the parameter's own unit; the fit stays inside it. */
export interface PriorRange {
  min: number;
  max: number;
}

/** One parameter chosen for a fit, with the prior range to search (within the declared one). */
export interface ChosenParameter {
  id: CalibrationParameterId;
  prior: PriorRange;
}

/**
 * One bench run's data as the fit reads it: SI units, x = load current (A) or time (s), y = output (V, read
 * as a magnitude) or, for a waveform, the probe's voltage (V, signed).
 */
export interface CalibrationDataset {
  benchRunId: string;
  /** The run's title (or a short label) to name it in errors and tables. */
  label: string;
  use: CalibrationDataUse;
  points: MeasuredPoint[];
}

/** A fitted parameter with its confidence interval (same unit as the value). */
export interface FittedParameter {
  id: CalibrationParameterId;
  label: string;
  unit: string;
  prior: PriorRange;
  initialValue: number;
  value: number;
  /** Two-sided interval at `confidence`; null when the parameter is not identifiable from these data. */
  interval: { low: number; high: number } | null;
  /**
   * How the interval was found: from the Jacobian at the optimum (±t·se), or from the cost itself (profile
   * likelihood, for a fit with a waveform). Absent in results stored before profiles were read.
   */
  intervalMethod?: 'linearized' | 'profile';
  /** The fitted value lies on a bound of its prior range. */
  isAtBound: boolean;
}

/** Residual figures of one dataset before (the design's values) and after the fit, in the data's unit (V). */
export interface DatasetResidual {
  benchRunId: string;
  label: string;
  use: CalibrationDataUse;
  model: CalibrationModelKind;
  pointCount: number;
  rmsBeforeV: number;
  rmsAfterV: number;
}

/** A pair of parameters the data cannot separate, or a parameter the data do not see. */
export interface IdentifiabilityWarning {
  kind: 'correlated' | 'insensitive' | 'near-singular';
  parameterIds: CalibrationParameterId[];
  /** The correlation for a correlated pair, else null. */
  correlation: number | null;
  message: string;
}

/** One curve of the overlay: measured, predicted by the design as it is, and by the calibrated model. */
export interface CalibrationCurve {
  benchRunId: string;
  label: string;
  use: CalibrationDataUse;
  x: number[];
  measuredV: number[];
  predictedV: number[];
  calibratedV: number[];
}

export interface CalibrationResult {
  parameters: FittedParameter[];
  /** Correlation matrix of the fitted parameters, in the order of `parameters` (NaN where undefined). */
  correlation: number[][];
  warnings: IdentifiabilityWarning[];
  residuals: DatasetResidual[];
  curves: CalibrationCurve[];
  /** Sum of squared normalized residuals before and after; normalized by each dataset's largest |y|. */
  costBefore: number;
  costAfter: number;
  /** Points minus parameters. */
  degreesOfFreedom: number;
  confidence: number;
  iterations: number;
  evaluations: number;
  /** True when the fit stopped on its convergence test, false when it ran out of iterations. */
  isConverged: boolean;
}
