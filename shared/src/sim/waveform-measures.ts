/** Time-weighted (trapezoidal) mean of a sampled signal over [fromS, toS]. */
export function windowMean(timeS: ArrayLike<number>, values: ArrayLike<number>, fromS: number, toS: number): number {
  let area = 0;
  let span = 0;
  for (let i = 1; i < timeS.length; i++) {
    const a = Math.max(timeS[i - 1]!, fromS);
    const b = Math.min(timeS[i]!, toS);
    if (b <= a) continue;
    const t0 = timeS[i - 1]!;
    const dt = timeS[i]! - t0;
    const va = values[i - 1]! + ((values[i]! - values[i - 1]!) * (a - t0)) / dt;
    const vb = values[i - 1]! + ((values[i]! - values[i - 1]!) * (b - t0)) / dt;
    area += ((va + vb) / 2) * (b - a);
    span += b - a;
  }
  return span > 0 ? area / span : NaN;
}

/** Largest and smallest sample within [fromS, toS]. */
export function windowExtremes(
  timeS: ArrayLike<number>,
  values: ArrayLike<number>,
  fromS: number,
  toS: number,
): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < timeS.length; i++) {
    const t = timeS[i]!;
    if (t < fromS || t > toS) continue;
    min = Math.min(min, values[i]!);
    max = Math.max(max, values[i]!);
  }
  return { min, max };
}

/** Peak-to-peak of the samples within [fromS, toS]. */
export function windowPeakToPeak(
  timeS: ArrayLike<number>,
  values: ArrayLike<number>,
  fromS: number,
  toS: number,
): number {
  const { min, max } = windowExtremes(timeS, values, fromS, toS);
  return max - min;
}

/** Times (linearly interpolated) at which the signal rises through `level`, after fromS. */
export function risingCrossings(
  timeS: ArrayLike<number>,
  values: ArrayLike<number>,
  level: number,
  fromS = -Infinity,
): number[] {
  const out: number[] = [];
  for (let i = 1; i < timeS.length; i++) {
    if (timeS[i]! < fromS) continue;
    const a = values[i - 1]!;
    const b = values[i]!;
    if (a < level && b >= level) out.push(timeS[i - 1]! + ((timeS[i]! - timeS[i - 1]!) * (level - a)) / (b - a));
  }
  return out;
}

/** First time after fromS at which the signal falls to `level` or below (interpolated); NaN if never. */
export function firstFallTo(
  timeS: ArrayLike<number>,
  values: ArrayLike<number>,
  level: number,
  fromS = -Infinity,
): number {
  for (let i = 1; i < timeS.length; i++) {
    if (timeS[i]! < fromS) continue;
    const a = values[i - 1]!;
    const b = values[i]!;
    if (a > level && b <= level) return timeS[i - 1]! + ((timeS[i]! - timeS[i - 1]!) * (a - level)) / (a - b);
  }
  return NaN;
}

/**
 * Downsampling for plotting that keeps every peak: the samples are cut into `bucketCount` equal time
 * buckets and each bucket keeps its minimum and its maximum, in time order (at most 2·bucketCount points).
 */
export function downsampleMinMax(
  timeS: ArrayLike<number>,
  values: ArrayLike<number>,
  bucketCount: number,
): { timeS: number[]; values: number[] } {
  const n = timeS.length;
  if (n <= 2 * bucketCount) return { timeS: Array.from(timeS), values: Array.from(values) };
  const t0 = timeS[0]!;
  const span = timeS[n - 1]! - t0 || 1;
  const outT: number[] = [];
  const outV: number[] = [];
  let i = 0;
  for (let b = 0; b < bucketCount && i < n; b++) {
    const end = t0 + ((b + 1) * span) / bucketCount;
    let iMin = i;
    let iMax = i;
    for (; i < n && (timeS[i]! <= end || b === bucketCount - 1); i++) {
      if (values[i]! < values[iMin]!) iMin = i;
      if (values[i]! > values[iMax]!) iMax = i;
    }
    for (const k of iMin <= iMax ? [iMin, iMax] : [iMax, iMin]) {
      if (outT.length > 0 && outT[outT.length - 1] === timeS[k]) continue;
      outT.push(timeS[k]!);
      outV.push(values[k]!);
    }
  }
  return { timeS: outT, values: outV };
}
