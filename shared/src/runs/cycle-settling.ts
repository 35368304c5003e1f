/** Remaining approach of a charging output to its final value, from its per-cycle means. */
export interface SettlingEstimate {
  /** Estimated final value less the last cycle mean (same unit); null when the trend is not yet a decay. */
  remaining: number | null;
  /** Ratio of the change over the last window to the change over the window before it (0..1 for a decay). */
  windowRatio: number | null;
}

/**
 * Estimates how far a charging output still has to go from its cycle means m₀ … m_k. Late in the
 * charge-up a ladder's approach is close to exponential in its slowest mode, so the changes over
 * successive windows of w cycles, D₁ = m_k − m_{k−w} and D₀ = m_{k−w} − m_{k−2w}, shrink geometrically
 * by ρ = D₁/D₀ and the rest of the geometric series is D₁·ρ/(1 − ρ) (Aitken's Δ² extrapolation,
 * A. C. Aitken, Proc. R. Soc. Edinburgh 46, 1926, from memory). A ratio outside 0..0.98 is no decay yet
 * (or no trend at all): remaining is null unless both changes are below `noiseFloor`, where the rest is
 * taken as their size.
 */
export function estimateRemainingApproach(
  cycleMeans: ReadonlyArray<number>,
  window: number,
  noiseFloor: number,
): SettlingEstimate {
  const k = cycleMeans.length - 1;
  if (k < 2 * window) return { remaining: null, windowRatio: null };
  const d1 = cycleMeans[k]! - cycleMeans[k - window]!;
  const d0 = cycleMeans[k - window]! - cycleMeans[k - 2 * window]!;
  if (Math.abs(d1) <= noiseFloor && Math.abs(d0) <= noiseFloor)
    return { remaining: Math.max(Math.abs(d1), Math.abs(d0)) * Math.sign(d1), windowRatio: null };
  const ratio = d0 !== 0 ? d1 / d0 : Infinity;
  if (!(ratio >= 0 && ratio < 0.98)) return { remaining: null, windowRatio: Number.isFinite(ratio) ? ratio : null };
  return { remaining: (d1 * ratio) / (1 - ratio), windowRatio: ratio };
}
