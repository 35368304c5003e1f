import { describe, expect, it } from 'vitest';
import { acceptanceLimits, COVERAGE_FACTORS } from './acceptance-limits';

// Coverage factors of a normal distribution: JCGM 100:2008 (GUM) Table G.1 (90 % -> 1.645, 95 % -> 1.960,
// 99 % -> 2.576). The window rule (mean ± kσ plus a bench allowance, stretched to the target) is this product's:
// common practice, no source. Float tolerance 1e-9 V: exact arithmetic on the inputs.
const settings = { coverage: 0.95 as const, benchAllowanceFraction: 0.01 };

describe('acceptanceLimits', () => {
  it('uses the GUM coverage factors', () => {
    expect(COVERAGE_FACTORS).toEqual({ 0.9: 1.645, 0.95: 1.96, 0.99: 2.576 });
  });

  it('puts mean ± k·σ plus the allowance around a prediction that meets the target', () => {
    // 905 ± 1.96 × 10 ± 9 V -> 876.4 .. 933.6 V; the 900 V target lies inside.
    const limits = acceptanceLimits({
      targetOutputV: 900,
      spreadMeanV: 905,
      spreadSdV: 10,
      ripplePeakToPeakV: 1,
      rippleMaxV: 5,
      settings,
    });
    expect(limits.outputLowV).toBeCloseTo(876.4, 9);
    expect(limits.outputHighV).toBeCloseTo(933.6, 9);
    expect(limits.isStretchedToTarget).toBe(false);
    expect(limits.isPredictionBelowTarget).toBe(false);
  });

  it('stretches the window to a target the spread misses, keeping the sign of a negative ladder', () => {
    // The 1.5 kV case: spread 1353 ± 1.96 × 20 ± 15 V ends at 1407.2 V, so the window is stretched to 1500 V.
    const limits = acceptanceLimits({
      targetOutputV: -1500,
      spreadMeanV: 1353,
      spreadSdV: 20,
      ripplePeakToPeakV: 1,
      rippleMaxV: 5,
      settings,
    });
    expect(limits.outputLowV).toBeCloseTo(-(1353 - 39.2 - 15), 9);
    expect(limits.outputHighV).toBe(-1500);
    expect(limits.isStretchedToTarget).toBe(true);
    expect(limits.isPredictionBelowTarget).toBe(true);
  });

  it('contains the target for any coverage, spread and allowance', () => {
    for (const coverage of [0.9, 0.95, 0.99] as const) {
      for (const [mean, sd] of [
        [100, 0],
        [1600, 50],
        [1400, 5],
      ] as const) {
        const limits = acceptanceLimits({
          targetOutputV: 1500,
          spreadMeanV: mean,
          spreadSdV: sd,
          ripplePeakToPeakV: 0,
          rippleMaxV: 1,
          settings: { coverage, benchAllowanceFraction: 0 },
        });
        expect(limits.outputLowV).toBeLessThanOrEqual(1500);
        expect(limits.outputHighV).toBeGreaterThanOrEqual(1500);
      }
    }
  });
});
