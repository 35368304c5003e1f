import { DomainError } from '../errors';
import { analyzeLadder } from '../multiplier/analyze-ladder';
import type { LadderInput } from '../multiplier/ladder.types';
import type { MethodInfo } from '../methods';
import { mulberry32, normalFrom } from './seeded-random';

export interface ToleranceSpreadRequest {
  input: LadderInput;
  /** Fractional tolerance per capacitor (one number for all, or one per capacitor). */
  capacitorTolerance: number | readonly number[];
  /** Fractional variation of the drive peak(s), e.g. 0.05 for ±5 %. */
  driveVariation: number;
  frequencyVariation?: number;
  loadVariation?: number;
  distribution?: 'uniform' | 'normal';
  trials: number;
  seed: number;
  bins?: number;
  /** Spec on magnitudes at the load terminal. */
  spec?: { outputMinV?: number; outputMaxV?: number; rippleMaxV?: number };
}

export interface HistogramBin {
  lower: number;
  upper: number;
  count: number;
}

export interface SpreadStatistics {
  mean: number;
  sd: number;
  min: number;
  max: number;
  p5: number;
  p50: number;
  p95: number;
  histogram: HistogramBin[];
}

export interface ToleranceSpreadResult {
  trials: number;
  seed: number;
  /** Magnitude of the mean load-terminal output. */
  outputV: SpreadStatistics;
  rippleV: SpreadStatistics;
  fractionWithinSpec: number;
  method: MethodInfo;
}

const SPREAD_METHOD: MethodInfo = {
  methodId: 'monte-carlo-mulberry32-v1',
  summary:
    'Seeded Monte Carlo over part tolerances and drive variation; each trial is one steady-state analysis (charge-transfer-v1).',
  assumptions: [
    'uniform: each value drawn uniformly within ±tolerance; normal: tolerance taken as 3σ, clipped at ±tolerance',
    'parts vary independently; the diode model does not vary',
    'percentiles by nearest rank on the sorted trials',
  ],
  source: 'mulberry32 PRNG (T. Ettinger, public domain); Box-Muller transform',
};

/** Mean, sample standard deviation, extremes, nearest-rank percentiles and a histogram of `bins` equal bins. */
export function spreadStatistics(values: Float64Array, bins: number): SpreadStatistics {
  const n = values.length;
  const sorted = Float64Array.from(values).sort();
  let sum = 0;
  for (const v of sorted) sum += v;
  const mean = sum / n;
  let squares = 0;
  for (const v of sorted) squares += (v - mean) ** 2;
  const sd = n > 1 ? Math.sqrt(squares / (n - 1)) : 0;
  const rank = (p: number): number => sorted[Math.min(n - 1, Math.max(0, Math.ceil(p * n) - 1))] as number;
  const min = sorted[0] as number;
  const max = sorted[n - 1] as number;
  const width = (max - min) / bins || 1;
  const histogram: HistogramBin[] = Array.from({ length: bins }, (_, i) => ({
    lower: min + i * width,
    upper: min + (i + 1) * width,
    count: 0,
  }));
  for (const v of sorted) {
    const bin = histogram[Math.min(bins - 1, Math.floor((v - min) / width))];
    if (bin) bin.count += 1;
  }
  return { mean, sd, min, max, p5: rank(0.05), p50: rank(0.5), p95: rank(0.95), histogram };
}

/**
 * Seeded, reproducible Monte Carlo spread of output and ripple over capacitor tolerances and drive,
 * frequency and load variation. Same request and seed → identical result.
 */
export function toleranceSpread(request: ToleranceSpreadRequest): ToleranceSpreadResult {
  const { input, trials } = request;
  if (!Number.isInteger(trials) || trials < 2)
    throw new DomainError('invalid_argument', 'trials must be an integer ≥ 2', 'trials');
  const tolerances = input.capacitorsF.map((_, i) =>
    typeof request.capacitorTolerance === 'number' ? request.capacitorTolerance : (request.capacitorTolerance[i] ?? 0),
  );
  tolerances.forEach((t, i) => {
    if (!(t >= 0 && t < 1))
      throw new DomainError('invalid_argument', 'tolerance must lie in [0, 1)', `capacitorTolerance[${i}]`);
  });
  const random = mulberry32(request.seed);
  const draw = (tolerance: number): number => {
    if (tolerance === 0) return 1;
    if (request.distribution === 'normal')
      return 1 + Math.max(-tolerance, Math.min(tolerance, (normalFrom(random) * tolerance) / 3));
    return 1 + tolerance * (2 * random() - 1);
  };
  const outputs = new Float64Array(trials);
  const ripples = new Float64Array(trials);
  let within = 0;
  const spec = request.spec ?? {};
  for (let t = 0; t < trials; t += 1) {
    const capacitorsF = input.capacitorsF.map((c, i) => c * draw(tolerances[i] as number));
    const driveScale = draw(request.driveVariation);
    const frequencyScale = draw(request.frequencyVariation ?? 0);
    const loadScale = draw(request.loadVariation ?? 0);
    const d = input.drive;
    const drive =
      d.kind === 'sine'
        ? { ...d, peakV: d.peakV * driveScale, frequencyHz: d.frequencyHz * frequencyScale }
        : {
            ...d,
            forwardPeakV: d.forwardPeakV * driveScale,
            flybackPeakV: d.flybackPeakV * driveScale,
            frequencyHz: d.frequencyHz * frequencyScale,
          };
    const load =
      input.load === null
        ? null
        : input.load.kind === 'current'
          ? { kind: 'current' as const, currentA: input.load.currentA * loadScale }
          : { kind: 'resistance' as const, resistanceOhm: input.load.resistanceOhm / loadScale };
    const r = analyzeLadder({ ...input, capacitorsF, drive, load });
    const out = Math.abs(r.outputMeanV);
    outputs[t] = out;
    ripples[t] = r.ripplePeakToPeakV;
    const ok =
      (spec.outputMinV === undefined || out >= spec.outputMinV) &&
      (spec.outputMaxV === undefined || out <= spec.outputMaxV) &&
      (spec.rippleMaxV === undefined || r.ripplePeakToPeakV <= spec.rippleMaxV);
    if (ok) within += 1;
  }
  const bins = request.bins ?? 20;
  return {
    trials,
    seed: request.seed,
    outputV: spreadStatistics(outputs, bins),
    rippleV: spreadStatistics(ripples, bins),
    fractionWithinSpec: within / trials,
    method: SPREAD_METHOD,
  };
}
