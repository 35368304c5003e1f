import { isIrregularCycles, REARM_FRACTION, TURN_ON_FRACTION, turnOnTimes } from './turn-on-events';

/**
 * Measurements of a self-oscillating converter taken as on the bench, over the whole cycles between the
 * transistor's turn-on events (turn-on-events.ts): cycles whose periods spread by more than
 * `IRREGULAR_SPREAD` of their mean are flagged irregular, and their frequency is the mean over the whole
 * cycles.
 */

/** Bench figures of the whole cycles between the first and last turn-on of a record. */
export interface OscillationFigures {
  /** Whole cycles measured. */
  cycles: number;
  fromS: number;
  toS: number;
  /** Whole cycles over their span: the mean frequency when the cycles are irregular. */
  frequencyHz: number;
  /** The periods spread by more than IRREGULAR_SPREAD of their mean (bursts, squegging; turn-on-events.ts). */
  isIrregular: boolean;
  /**
   * On-time over the period: from the ramp's start (its rise through 10 % and 50 % of the peak, extrapolated
   * linearly back to zero current) to the turn-off (the collector rising through the supply, or the
   * current falling through 50 % of the cycle's peak, whichever comes first).
   */
  dutyOnFraction: number;
  primaryCurrentPeakA: number;
  /** Peak-to-peak of `rippleOf` over the whole cycles. */
  ripplePeakToPeak: number;
  /** Time-weighted mean of `rippleOf` over the whole cycles. */
  mean: number;
}

/** Linear interpolation of a sample record at time t (held flat outside). */
function valueAt(timeS: ArrayLike<number>, values: ArrayLike<number>, t: number): number {
  let lo = 0;
  let hi = timeS.length - 1;
  if (t <= timeS[0]!) return values[0]!;
  if (t >= timeS[hi]!) return values[hi]!;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (timeS[mid]! <= t) lo = mid;
    else hi = mid;
  }
  const t0 = timeS[lo]!;
  const t1 = timeS[hi]!;
  return values[lo]! + ((values[hi]! - values[lo]!) * (t - t0)) / (t1 - t0);
}

/**
 * Frequency, duty, primary peak, and the ripple and mean of another signal (the output), over the whole
 * cycles of a record (first to last turn-on); null with fewer than one whole cycle.
 */
export function oscillationFigures(
  timeS: ArrayLike<number>,
  primaryA: ArrayLike<number>,
  collectorOverSupplyV: ArrayLike<number>,
  rippleOf: ArrayLike<number>,
): OscillationFigures | null {
  const on = turnOnTimes(timeS, primaryA, collectorOverSupplyV);
  if (on.length < 2) return null;
  const fromS = on[0]!;
  const toS = on[on.length - 1]!;
  const cycles = on.length - 1;
  let peak = 0;
  let lo = Infinity;
  let hi = -Infinity;
  let area = 0;
  for (let i = 0; i < timeS.length; i++) {
    const t = timeS[i]!;
    if (t >= fromS && t <= toS) {
      if (collectorOverSupplyV[i]! < 0) peak = Math.max(peak, primaryA[i]!);
      lo = Math.min(lo, rippleOf[i]!);
      hi = Math.max(hi, rippleOf[i]!);
    }
    if (i === 0) continue;
    const a = Math.max(timeS[i - 1]!, fromS);
    const b = Math.min(t, toS);
    if (b > a) area += 0.5 * (valueAt(timeS, rippleOf, a) + valueAt(timeS, rippleOf, b)) * (b - a);
  }
  // On-time of each cycle: ramp start (10 %–50 % rise extrapolated to zero) to the fall through 50 %.
  let onTotalS = 0;
  for (let k = 0; k < cycles; k++) {
    const t50 = on[k]!;
    const next = on[k + 1]!;
    let cyclePeak = 0;
    let i = 0;
    while (i < timeS.length && timeS[i]! < t50) i++;
    const first = i;
    for (let j = first; j < timeS.length && timeS[j]! <= next; j++)
      if (collectorOverSupplyV[j]! < 0) cyclePeak = Math.max(cyclePeak, primaryA[j]!);
    // Rise through 10 % of the cycle's peak, searched backwards from the 50 % crossing to the last fall.
    const earliest = k > 0 ? on[k - 1]! : timeS[0]!;
    let t10 = t50;
    const level10 = REARM_FRACTION * cyclePeak;
    for (let j = first - 1; j >= 1 && timeS[j]! > earliest; j--) {
      const u = primaryA[j - 1]!;
      const v = primaryA[j]!;
      if (u < level10 && v >= level10) {
        t10 = timeS[j - 1]! + ((timeS[j]! - timeS[j - 1]!) * (level10 - u)) / (v - u);
        break;
      }
    }
    const rampStart = Math.max(earliest, t10 - ((t50 - t10) * REARM_FRACTION) / (TURN_ON_FRACTION - REARM_FRACTION));
    // Turn-off: the collector rising through the supply, or the current falling through half the peak.
    const level50 = TURN_ON_FRACTION * cyclePeak;
    let fall = next;
    for (let j = first + 1; j < timeS.length && timeS[j]! <= next; j++) {
      const u = primaryA[j - 1]!;
      const v = primaryA[j]!;
      const cu = collectorOverSupplyV[j - 1]!;
      const cv = collectorOverSupplyV[j]!;
      const dt = timeS[j]! - timeS[j - 1]!;
      if (cu < 0 && cv >= 0) {
        fall = timeS[j - 1]! + (dt * -cu) / (cv - cu);
        break;
      }
      if (u > level50 && v <= level50 && u >= v) {
        fall = timeS[j - 1]! + (dt * (u - level50)) / (u - v);
        break;
      }
    }
    onTotalS += fall - rampStart;
  }
  const spanS = toS - fromS;
  return {
    cycles,
    fromS,
    toS,
    frequencyHz: cycles / spanS,
    isIrregular: isIrregularCycles(on),
    dutyOnFraction: Math.min(1, onTotalS / spanS),
    primaryCurrentPeakA: peak,
    ripplePeakToPeak: hi - lo,
    mean: area / spanS,
  };
}

/**
 * Times at which a charging curve (time, value) first reaches 90 % of `finalV` and enters ±1 % of it for
 * good, linearly interpolated between points; values are taken in the sign of `finalV`.
 */
export function readSettlingTimes(
  timeS: ReadonlyArray<number>,
  values: ReadonlyArray<number>,
  finalV: number,
): { to90S: number | null; to1S: number | null } {
  const sign = finalV < 0 ? -1 : 1;
  const target = Math.abs(finalV);
  let to90S: number | null = null;
  let prevT = 0;
  let prevV = 0;
  for (let i = 0; i < timeS.length; i++) {
    const v = sign * values[i]!;
    if (v >= 0.9 * target) {
      to90S =
        prevV < 0.9 * target && v !== prevV
          ? prevT + ((timeS[i]! - prevT) * (0.9 * target - prevV)) / (v - prevV)
          : timeS[i]!;
      break;
    }
    prevT = timeS[i]!;
    prevV = v;
  }
  let lastOut = -1;
  for (let i = 0; i < timeS.length; i++) if (Math.abs(sign * values[i]! - target) > 0.01 * target) lastOut = i;
  let to1S: number | null = null;
  if (lastOut < timeS.length - 1) {
    if (lastOut < 0) to1S = timeS[0]!;
    else {
      const a = sign * values[lastOut]!;
      const b = sign * values[lastOut + 1]!;
      const edge = a < target ? 0.99 * target : 1.01 * target;
      const t0 = timeS[lastOut]!;
      to1S = t0 + ((timeS[lastOut + 1]! - t0) * (edge - a)) / (b - a);
    }
  }
  return { to90S, to1S };
}
