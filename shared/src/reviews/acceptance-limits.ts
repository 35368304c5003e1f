/**
 * The limits a supplier's own acceptance test checks a built unit against, from the revision's stored
 * report and the design targets. The output window is the predicted mean ± OUTPUT_BAND (common practice,
 * no source: component tolerances and meter error of a supplier bench); the ripple limit is the design
 * target, never looser than the prediction.
 */
export const OUTPUT_ACCEPTANCE_BAND = 0.1;

export interface AcceptanceInput {
  /** Predicted mean output at the rated load (V, signed). */
  outputMeanV: number;
  /** Predicted ripple, peak-to-peak (V). */
  ripplePeakToPeakV: number;
  /** The design's ripple target (V peak-to-peak). */
  rippleMaxV: number;
  /** The design's target output (V, signed). */
  targetOutputV: number;
}

export interface AcceptanceLimits {
  /** Signed output window at the rated load: lowV ≤ output ≤ highV (|lowV| ≤ |highV| for either polarity). */
  outputLowV: number;
  outputHighV: number;
  bandFraction: number;
  /** Ripple the unit may show at the rated load, peak-to-peak (V). */
  rippleMaxV: number;
  /** Whether the prediction already misses the target: the sheet must say so rather than hide it. */
  isPredictionBelowTarget: boolean;
}

export function acceptanceLimits(input: AcceptanceInput): AcceptanceLimits {
  const a = input.outputMeanV * (1 - OUTPUT_ACCEPTANCE_BAND);
  const b = input.outputMeanV * (1 + OUTPUT_ACCEPTANCE_BAND);
  const [outputLowV, outputHighV] = Math.abs(a) <= Math.abs(b) ? [a, b] : [b, a];
  return {
    outputLowV,
    outputHighV,
    bandFraction: OUTPUT_ACCEPTANCE_BAND,
    rippleMaxV: Math.max(input.rippleMaxV, 0),
    isPredictionBelowTarget:
      Math.abs(input.outputMeanV) < Math.abs(input.targetOutputV) || input.ripplePeakToPeakV > input.rippleMaxV,
  };
}
