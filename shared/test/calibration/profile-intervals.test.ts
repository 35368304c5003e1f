import { describe, expect, it } from 'vitest';
import { fitParameters, fitStatistics, profileIntervals, type FitParameter } from '../../src/calibration';
import { gaussian } from './synthetic-bench';

/** Fits `parameters` to `target` through `model` (one set at a time) and returns the fit with both intervals. */
async function fitWithIntervals(
  parameters: FitParameter[],
  target: number[],
  predict: (values: number[]) => number[],
  stepU = 1e-3,
) {
  const model = (sets: number[][]) => Promise.resolve(sets.map(predict));
  const outcome = await fitParameters(parameters, target, model, { stepU });
  const residuals = target.map((y, i) => y - outcome.prediction[i]!);
  const statistics = fitStatistics(outcome.jacobian, residuals, parameters.length, 0.95);
  const profile = await profileIntervals({
    parameters,
    target,
    model,
    u: outcome.u,
    cost: outcome.costAfter,
    residualVariance: statistics.residualVariance,
    tCritical: statistics.tCritical,
    halfWidthGuessesU: statistics.classicalStandardErrors.map((se) => (se === null ? null : statistics.tCritical * se)),
    stepU,
    skip: statistics.insensitive,
  });
  return { outcome, statistics, profile };
}

describe('profile-likelihood intervals', () => {
  // A straight line y = a + b·x: the profile t of a linear model is linear in the parameter, so the profile
  // interval is the classical one, b̂ ± t·s/√Sxx (closed-form least squares, any regression text).
  it('equal the closed-form interval of a straight line', async () => {
    const xs = Array.from({ length: 12 }, (_, i) => i);
    const normal = gaussian(7);
    const ys = xs.map((x) => 1 + 0.5 * x + 0.2 * normal());
    const parameters: FitParameter[] = [
      { prior: { min: -5, max: 5 }, scale: 'linear', initialValue: 0 },
      { prior: { min: -2, max: 2 }, scale: 'linear', initialValue: 0 },
    ];
    const { profile, statistics } = await fitWithIntervals(parameters, ys, ([a, b]) => xs.map((x) => a! + b! * x));
    const n = xs.length;
    const mx = xs.reduce((s, x) => s + x, 0) / n;
    const my = ys.reduce((s, y) => s + y, 0) / n;
    const sxx = xs.reduce((s, x) => s + (x - mx) ** 2, 0);
    const slope = xs.reduce((s, x, i) => s + (x - mx) * (ys[i]! - my), 0) / sxx;
    const intercept = my - slope * mx;
    const ssr = xs.reduce((s, x, i) => s + (ys[i]! - intercept - slope * x) ** 2, 0);
    const half = statistics.tCritical * Math.sqrt(ssr / (n - 2) / sxx);
    expect(profile[1]!.low).toBeCloseTo(slope - half, 3);
    expect(profile[1]!.high).toBeCloseTo(slope + half, 3);
    const halfIntercept = statistics.tCritical * Math.sqrt((ssr / (n - 2)) * (1 / n + mx ** 2 / sxx));
    expect(profile[0]!.low).toBeCloseTo(intercept - halfIntercept, 3);
    expect(profile[0]!.high).toBeCloseTo(intercept + halfIntercept, 3);
  });

  // A scope-like capture: a pulse of amplitude a whose rising edge θ, one and a half samples wide, moves past
  // the samples (40 over the period, noise 5 % of the amplitude, seeded). The cost in θ has a kink each time
  // the edge's end passes a sample, so it is not the quadratic the Jacobian's interval assumes; the profile
  // reads the cost itself, with the amplitude refitted at each θ. Over 200 seeds its 95 % interval held the
  // true edge in 92.5 %: the F threshold is exact only for a model linear in its parameters (Bates & Watts
  // §6.1, from memory), and a kinked cost is far from that; it stays within a few points of the claim.
  const samples = Array.from({ length: 40 }, (_, i) => i / 40);
  const edgeWidth = 1.5 / 40;
  const pulse = (amplitude: number, edge: number) =>
    samples.map((x) => amplitude * Math.min(1, Math.max(0, (x - edge) / edgeWidth)) * (x < 0.8 ? 1 : 0));

  it('cover a moving edge, its amplitude refitted, about as often as they claim', async () => {
    const normal = gaussian(20251205);
    const truth = [1, 0.3012];
    const replicates = 200;
    let hits = 0;
    for (let r = 0; r < replicates; r += 1) {
      const ys = pulse(truth[0]!, truth[1]!).map((y) => y + 0.05 * normal());
      const parameters: FitParameter[] = [
        { prior: { min: 0.5, max: 2 }, scale: 'linear', initialValue: 1.1 },
        { prior: { min: 0.2, max: 0.4 }, scale: 'linear', initialValue: 0.3 },
      ];
      const { profile } = await fitWithIntervals(parameters, ys, ([a, e]) => pulse(a!, e!));
      const interval = profile[1];
      if (interval && interval.low <= truth[1]! && truth[1]! <= interval.high) hits += 1;
    }
    // Binomial standard error of a coverage near 0.95 over 200 seeds: 0.015.
    expect(hits / replicates).toBeGreaterThan(0.9);
    expect(hits / replicates).toBeLessThan(0.99);
  }, 120_000);
});
