import { windowMean } from '../../src/sim/waveform-measures';

/** Mean of each whole period [c·T, (c + 1)·T] of a sampled signal. */
export function cycleMeans(timeS: Float64Array, values: Float64Array, periodS: number, cycles: number): Float64Array {
  const out = new Float64Array(cycles);
  let start = 0;
  let end = 0;
  for (let c = 0; c < cycles; c++) {
    const from = c * periodS;
    const to = (c + 1) * periodS;
    while (start + 1 < timeS.length && timeS[start + 1]! <= from) start++;
    while (end + 1 < timeS.length && timeS[end]! < to) end++;
    out[c] = windowMean(timeS.subarray(start, end + 1), values.subarray(start, end + 1), from, to);
  }
  return out;
}

/** First cycle count c after which every cycle mean stays within `within` of `target`; −1 if none. */
export function settledFrom(means: Float64Array, target: number, within: number): number {
  let c = means.length;
  while (c > 0 && Math.abs(means[c - 1]! / target - 1) <= within) c--;
  return c === means.length ? -1 : c + 1;
}
