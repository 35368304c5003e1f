import { describe, expect, it } from 'vitest';
import { fitParameters, type FitParameter } from '../../src/calibration';
import { gaussian } from './synthetic-bench';

// A decay y = a·exp(−x/τ) with seeded noise: the speculative fit (each step sent with the Jacobian's columns
// there) must take exactly the path of the plain one, only with more model runs, in fewer rounds.
describe('fitParameters with speculative Jacobians', () => {
  const xs = Array.from({ length: 15 }, (_, i) => i * 0.2);
  const normal = gaussian(11);
  const target = xs.map((x) => 2 * Math.exp(-x / 0.7) * (1 + 0.01 * normal()));
  const parameters: FitParameter[] = [
    { prior: { min: 0.5, max: 5 }, scale: 'log', initialValue: 1 },
    { prior: { min: 0.1, max: 3 }, scale: 'log', initialValue: 1.5 },
  ];
  const run = async (speculative: boolean) => {
    let rounds = 0;
    const outcome = await fitParameters(
      parameters,
      target,
      (sets) => {
        rounds += 1;
        return Promise.resolve(sets.map(([a, tau]) => xs.map((x) => a! * Math.exp(-x / tau!))));
      },
      { speculative },
    );
    return { outcome, rounds };
  };

  it('lands on the same values in the same steps, in fewer rounds of model runs', async () => {
    const plain = await run(false);
    const speculative = await run(true);
    expect(speculative.outcome.values).toEqual(plain.outcome.values);
    expect(speculative.outcome.iterations).toBe(plain.outcome.iterations);
    expect(speculative.outcome.costAfter).toBe(plain.outcome.costAfter);
    expect(speculative.rounds).toBeLessThan(plain.rounds);
    expect(speculative.outcome.evaluations).toBeGreaterThanOrEqual(plain.outcome.evaluations);
    // The fit itself: the decay's amplitude and time constant within 3 % (noise 1 %).
    expect(plain.outcome.values[0]! / 2).toBeCloseTo(1, 1);
    expect(plain.outcome.values[1]! / 0.7).toBeCloseTo(1, 1);
  });
});
