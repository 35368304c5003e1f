import { describe, expect, it } from 'vitest';
import { fitStatistics } from '../../src/calibration';
import { gaussian } from './synthetic-bench';

// Coverage of the reported 95 % interval when each point's noise is a share of its reading, as a bench
// instrument's is: y = θ·x at x = 1…10 with 0.3 % relative noise, fitted by ordinary least squares (closed
// form θ̂ = Σxy/Σx², Jacobian column x). The classical interval s·t/√Σx² pools the noise over all points, while
// the slope is decided by the large, noisy ones: its true variance Σx⁴σ²θ²/(Σx²)² is 1.7 times what the
// classical formula assumes on average (n·Σx⁴/(Σx²)² for x = 1…10; arithmetic), so it covers the true value
// less often than it claims. The HC3 interval does not assume equal noise (MacKinnon & White 1985, from memory).
describe('fitStatistics under noise proportional to the reading', () => {
  const xs = Array.from({ length: 10 }, (_, i) => i + 1);
  const theta = 2;
  const sxx = xs.reduce((s, x) => s + x * x, 0);
  const replicates = 4000;

  it('covers the true value about as often as it claims (95 %), where the classical interval does not', () => {
    const normal = gaussian(20251205);
    let classicalHits = 0;
    let reportedHits = 0;
    for (let r = 0; r < replicates; r += 1) {
      const ys = xs.map((x) => theta * x * (1 + 0.003 * normal()));
      const estimate = xs.reduce((s, x, i) => s + x * ys[i]!, 0) / sxx;
      const residuals = ys.map((y, i) => y - estimate * xs[i]!);
      const statistics = fitStatistics(
        xs.map((x) => [x]),
        residuals,
        1,
        0.95,
      );
      const covers = (se: number | null) => se !== null && Math.abs(estimate - theta) <= statistics.tCritical * se;
      if (covers(statistics.classicalStandardErrors[0]!)) classicalHits += 1;
      if (covers(statistics.standardErrors[0]!)) reportedHits += 1;
    }
    // Binomial standard error of a coverage near 0.95 over 4000 replicates: 0.0034.
    expect(classicalHits / replicates).toBeLessThan(0.935);
    expect(reportedHits / replicates).toBeGreaterThan(0.94);
  });
});
