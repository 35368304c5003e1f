import { describe, expect, it } from 'vitest';
import { fitParameters, secantJacobian, type FitOptions, type FitParameter } from '../../src/calibration';
import { gaussian } from './synthetic-bench';

// A decay y = a·exp(−x/τ) with seeded noise, fitted with the model counting its batches (a batch is one round
// of model runs for a pool at least as wide as the batch). The least-squares optimum does not depend on how
// the steps are scheduled, so every schedule must land on the plain fit's values.
describe('fitParameters schedules of model runs', () => {
  const xs = Array.from({ length: 15 }, (_, i) => i * 0.2);
  const normal = gaussian(11);
  const target = xs.map((x) => 2 * Math.exp(-x / 0.7) * (1 + 0.01 * normal()));
  const parameters: FitParameter[] = [
    { prior: { min: 0.5, max: 5 }, scale: 'log', initialValue: 1 },
    { prior: { min: 0.1, max: 3 }, scale: 'log', initialValue: 1.5 },
  ];
  const run = async (options: FitOptions) => {
    const batches: number[] = [];
    const outcome = await fitParameters(
      parameters,
      target,
      (sets) => {
        batches.push(sets.length);
        return Promise.resolve(sets.map(([a, tau]) => xs.map((x) => a! * Math.exp(-x / tau!))));
      },
      options,
    );
    return { outcome, batches };
  };
  /** Rounds of a pool of `workers` equal workers: each batch takes ⌈size / workers⌉. */
  const rounds = (batches: number[], workers: number) =>
    batches.reduce((sum, size) => sum + Math.ceil(size / workers), 0);

  // Both stop on a step that gains less than 1e-6 of the cost: near the optimum a step on the secant Jacobian
  // cannot gain 1e-9 (the default), so there the fit would end on eight refused steps instead.
  it('lands on the plain fit values when each step goes out with the Jacobian, in fewer rounds', async () => {
    const plain = await run({ relativeTolerance: 1e-6 });
    const overlapped = await run({ overlapJacobian: true, relativeTolerance: 1e-6 });
    overlapped.outcome.values.forEach((v, j) => expect(v / plain.outcome.values[j]! - 1).toBeCloseTo(0, 5));
    expect(overlapped.outcome.costAfter / plain.outcome.costAfter - 1).toBeCloseTo(0, 6);
    // p + 1 = 3 workers: the plain fit needs a round for the Jacobian and one for the step; overlapped, one.
    expect(rounds(overlapped.batches, 3)).toBeLessThan(rounds(plain.batches, 3));
    // Steps on the secant Jacobian take a few more iterations, each p + 1 runs (here 26 runs against 22).
    expect(overlapped.outcome.evaluations).toBeLessThan(1.5 * plain.outcome.evaluations);
    // The fit itself: the decay's amplitude and time constant within 3 % (noise 1 %).
    expect(plain.outcome.values[0]! / 2).toBeCloseTo(1, 1);
    expect(plain.outcome.values[1]! / 0.7).toBeCloseTo(1, 1);
  });

  it('takes the one-at-a-time path when it tries several damping values at once', async () => {
    // Started far off (a at 5, τ at 0.1), where steps are refused and the damping climbs.
    const far: FitParameter[] = [
      { ...parameters[0]!, initialValue: 5 },
      { ...parameters[1]!, initialValue: 0.1 },
    ];
    const fit = (dampingTrials: number) =>
      fitParameters(
        far,
        target,
        (sets) => Promise.resolve(sets.map(([a, tau]) => xs.map((x) => a! * Math.exp(-x / tau!)))),
        {
          dampingTrials,
        },
      );
    const one = await fit(1);
    const three = await fit(3);
    expect(three.values).toEqual(one.values);
    expect(three.iterations).toBe(one.iterations);
    expect(three.costAfter).toBe(one.costAfter);
  });

  // Ended on refused steps (the default tolerance): one damping value a batch, or a ladder of 3 after a refusal.
  it('runs the tail of refused steps in fewer rounds with a damping ladder, on the same optimum', async () => {
    const plain = await run({});
    const single = await run({ overlapJacobian: true });
    const ladder = await run({ overlapJacobian: true, dampingTrials: 3 });
    ladder.outcome.values.forEach((v, j) => expect(v / plain.outcome.values[j]! - 1).toBeCloseTo(0, 5));
    expect(ladder.outcome.costAfter / plain.outcome.costAfter - 1).toBeCloseTo(0, 6);
    expect(rounds(ladder.batches, 3)).toBeLessThan(rounds(single.batches, 3));
    // A step's first try is one damping value: the first step, from the first Jacobian, goes out alone.
    expect(ladder.batches[1]).toBe(1);
  });

  // This fit ends on refused steps, so the central Jacobian at the optimum meets the forward columns there.
  it('never runs the model twice at one point', async () => {
    const sets: string[] = [];
    const outcome = await fitParameters(
      parameters,
      target,
      (batch) => {
        sets.push(...batch.map((values) => values.join(' ')));
        return Promise.resolve(batch.map(([a, tau]) => xs.map((x) => a! * Math.exp(-x / tau!))));
      },
      { overlapJacobian: true, dampingTrials: 3 },
    );
    expect(new Set(sets).size).toBe(sets.length);
    expect(outcome.evaluations).toBe(sets.length);
  });

  it('gives the first round the design value and its Jacobian together', async () => {
    const { batches } = await run({});
    expect(batches[0]).toBe(1 + parameters.length);
  });
});

describe('secantJacobian', () => {
  // Broyden (1965), from memory: the update maps the step onto the change it caused (the secant condition) and
  // leaves J unchanged along every direction orthogonal to the step.
  const jacobian = [
    [1, 2],
    [3, -1],
    [0.5, 4],
  ];
  const step = [0.2, -0.1];
  const change = [0.1, 0.9, -0.3];
  const updated = secantJacobian({ jacobian, step, change });
  const times = (matrix: number[][], v: number[]) => matrix.map((row) => row[0]! * v[0]! + row[1]! * v[1]!);

  it('maps the step onto the change of the prediction', () => {
    times(updated, step).forEach((value, i) => expect(value).toBeCloseTo(change[i]!, 12));
  });

  it('keeps the Jacobian along a direction orthogonal to the step', () => {
    const orthogonal = [0.1, 0.2];
    const before = times(jacobian, orthogonal);
    times(updated, orthogonal).forEach((value, i) => expect(value).toBeCloseTo(before[i]!, 12));
  });
});
