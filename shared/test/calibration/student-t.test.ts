import { inv } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { fitParameters, fitStatistics, invertMatrix, studentTCritical } from '../../src/calibration';

describe('studentTCritical', () => {
  // Two-sided 95 % critical values of Student's t (NIST/SEMATECH e-Handbook of Statistical Methods,
  // §1.3.6.7.2, table of t upper critical values at α = 0.025; from memory). Three decimals as printed.
  it.each([
    [1, 12.706],
    [2, 4.303],
    [5, 2.571],
    [10, 2.228],
    [30, 2.042],
    [100, 1.984],
  ])('at %i degrees of freedom is %f', (dof, expected) => {
    expect(studentTCritical(0.95, dof)).toBeCloseTo(expected, 3);
  });
});

describe('invertMatrix', () => {
  it('agrees with mathjs inv on a symmetric positive-definite matrix (to 1e-12)', () => {
    const a = [
      [4, 1, 0.5],
      [1, 3, 0.2],
      [0.5, 0.2, 2],
    ];
    const ours = invertMatrix(a)!;
    const theirs = inv(a) as number[][];
    ours.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(theirs[i]![j]!, 12)));
  });

  it('gives null for a singular matrix', () => {
    expect(
      invertMatrix([
        [1, 2],
        [2, 4],
      ]),
    ).toBeNull();
  });
});

describe('fitParameters and fitStatistics on a straight line', () => {
  // Ordinary least squares of y = a + b·x has the closed form b = Sxy/Sxx, a = ȳ − b·x̄, and standard
  // errors se(b) = s/√Sxx, se(a) = s·√(1/n + x̄²/Sxx) with s² = SSR/(n − 2) (any regression text, e.g.
  // Montgomery & Runger, Applied Statistics and Probability for Engineers, §11.3; from memory).
  const xs = [0, 1, 2, 3, 4, 5, 6, 7];
  const ys = [1.1, 2.9, 5.2, 6.8, 9.1, 11.2, 12.8, 15.1];
  const n = xs.length;
  const xBar = xs.reduce((s, x) => s + x, 0) / n;
  const yBar = ys.reduce((s, y) => s + y, 0) / n;
  const sxx = xs.reduce((s, x) => s + (x - xBar) ** 2, 0);
  const sxy = xs.reduce((s, x, i) => s + (x - xBar) * (ys[i]! - yBar), 0);
  const b = sxy / sxx;
  const a = yBar - b * xBar;
  const ssr = xs.reduce((s, x, i) => s + (ys[i]! - a - b * x) ** 2, 0);
  const sigma = Math.sqrt(ssr / (n - 2));

  it('finds the closed-form estimates and standard errors (to 1e-6 relative)', async () => {
    const parameters = [
      { prior: { min: -10, max: 10 }, scale: 'linear' as const, initialValue: 0 },
      { prior: { min: -10, max: 10 }, scale: 'linear' as const, initialValue: 1 },
    ];
    const outcome = await fitParameters(parameters, ys, async (sets) =>
      sets.map(([intercept, slope]) => xs.map((x) => intercept! + slope! * x)),
    );
    expect(outcome.values[0]).toBeCloseTo(a, 6);
    expect(outcome.values[1]).toBeCloseTo(b, 6);
    const residuals = ys.map((y, i) => y - outcome.prediction[i]!);
    const statistics = fitStatistics(outcome.jacobian, residuals, 2, 0.95);
    // Standard errors come out in u (20 units per u over the prior −10..10).
    expect(statistics.classicalStandardErrors[1]! * 20).toBeCloseTo(sigma / Math.sqrt(sxx), 6);
    expect(statistics.classicalStandardErrors[0]! * 20).toBeCloseTo(sigma * Math.sqrt(1 / n + xBar ** 2 / sxx), 6);
    // HC3 of the slope of a straight line: Σ (xᵢ − x̄)²·eᵢ²/(1 − hᵢᵢ)² / Sxx², leverage hᵢᵢ = 1/n + (xᵢ − x̄)²/Sxx
    // (MacKinnon & White 1985; Long & Ervin, The American Statistician 54 (2000) 217; from memory).
    const hc3Slope = Math.sqrt(
      xs.reduce((sum, x, i) => {
        const leverage = 1 / n + (x - xBar) ** 2 / sxx;
        return sum + ((x - xBar) ** 2 * (ys[i]! - a - b * x) ** 2) / (1 - leverage) ** 2;
      }, 0) /
        sxx ** 2,
    );
    expect(statistics.robustStandardErrors[1]! * 20).toBeCloseTo(hc3Slope, 6);
    // An interval uses the wider of the two.
    expect(statistics.standardErrors[1]).toBe(
      Math.max(statistics.classicalStandardErrors[1]!, statistics.robustStandardErrors[1]!),
    );
    expect(statistics.degreesOfFreedom).toBe(6);
    expect(statistics.correlatedPairs).toEqual([]);
  });
});
