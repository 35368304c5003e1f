/**
 * The limits a supplier's own acceptance test checks a built unit against. The output window is the predicted
 * spread of the output over part tolerances (a normal approximation: mean ± k·σ, k the coverage factor for the
 * stated coverage probability, JCGM 100:2008 (GUM) Table G.1), widened by a bench allowance for meter and
 * set-up error, and always stretched to contain the design target. The ripple limit is the design target.
 */
export const ACCEPTANCE_COVERAGES = [0.9, 0.95, 0.99] as const;
export type AcceptanceCoverage = (typeof ACCEPTANCE_COVERAGES)[number];

/** Coverage factor k of a normal distribution per coverage probability (GUM Table G.1). */
export const COVERAGE_FACTORS: Record<AcceptanceCoverage, number> = { 0.9: 1.645, 0.95: 1.96, 0.99: 2.576 };

/** What a lead sets per project: the coverage of the window and the bench allowance (fraction of the target). */
export interface AcceptanceSettings {
  coverage: AcceptanceCoverage;
  benchAllowanceFraction: number;
}

/** Bench allowance bounds: 0 to 10 % of the target (a meter class and a divider's tolerance; common practice, no source). */
export const BENCH_ALLOWANCE_MAX = 0.1;

export const DEFAULT_ACCEPTANCE_SETTINGS: AcceptanceSettings = { coverage: 0.95, benchAllowanceFraction: 0.01 };

export function isAcceptanceCoverage(value: unknown): value is AcceptanceCoverage {
  return typeof value === 'number' && (ACCEPTANCE_COVERAGES as readonly number[]).includes(value);
}

export interface AcceptanceInput {
  /** The design's target output (V, signed). */
  targetOutputV: number;
  /** Predicted mean output magnitude over the tolerance spread (V). */
  spreadMeanV: number;
  /** Standard deviation of the output magnitude over the tolerance spread (V). */
  spreadSdV: number;
  /** Predicted ripple, peak-to-peak (V). */
  ripplePeakToPeakV: number;
  /** The design's ripple target (V peak-to-peak). */
  rippleMaxV: number;
  settings: AcceptanceSettings;
}

export interface AcceptanceLimits {
  /** Signed output window at the rated load: lowV ≤ output ≤ highV in magnitude, with the target's sign. */
  outputLowV: number;
  outputHighV: number;
  coverage: AcceptanceCoverage;
  coverageFactor: number;
  benchAllowanceFraction: number;
  /** Whether the window had to be stretched to reach the target (the predicted spread misses it). */
  isStretchedToTarget: boolean;
  /** Ripple the unit may show at the rated load, peak-to-peak (V). */
  rippleMaxV: number;
  /** Whether the prediction already misses the target: the sheet must say so rather than hide it. */
  isPredictionBelowTarget: boolean;
}

/** The acceptance window from the targets and the predicted spread; it always contains the target. */
export function acceptanceLimits(input: AcceptanceInput): AcceptanceLimits {
  const { settings } = input;
  const k = COVERAGE_FACTORS[settings.coverage];
  const targetV = Math.abs(input.targetOutputV);
  const allowanceV = settings.benchAllowanceFraction * targetV;
  const spreadLowV = input.spreadMeanV - k * input.spreadSdV - allowanceV;
  const spreadHighV = input.spreadMeanV + k * input.spreadSdV + allowanceV;
  const lowV = Math.max(0, Math.min(spreadLowV, targetV));
  const highV = Math.max(spreadHighV, targetV);
  const sign = input.targetOutputV < 0 ? -1 : 1;
  return {
    outputLowV: sign * lowV,
    outputHighV: sign * highV,
    coverage: settings.coverage,
    coverageFactor: k,
    benchAllowanceFraction: settings.benchAllowanceFraction,
    isStretchedToTarget: targetV < spreadLowV || targetV > spreadHighV,
    rippleMaxV: Math.max(input.rippleMaxV, 0),
    isPredictionBelowTarget: input.spreadMeanV < targetV || input.ripplePeakToPeakV > input.rippleMaxV,
  };
}
