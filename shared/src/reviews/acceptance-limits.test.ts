import { describe, expect, it } from 'vitest';
import { acceptanceLimits } from './acceptance-limits';

// Limits are this product's rule (issue 6): common practice, no source. Float tolerance 1e-9 V: exact arithmetic.
describe('acceptanceLimits', () => {
  it.each([
    ['positive output', 900, 905, { low: 814.5, high: 995.5 }],
    ['negative output', -6000, -6100, { low: -5490, high: -6710 }],
  ])('puts a ±10 %% window around the predicted mean for a %s', (_label, target, mean, expected) => {
    const limits = acceptanceLimits({ outputMeanV: mean, ripplePeakToPeakV: 1, rippleMaxV: 5, targetOutputV: target });
    expect(limits.outputLowV).toBeCloseTo(expected.low, 9);
    expect(limits.outputHighV).toBeCloseTo(expected.high, 9);
    expect(limits.rippleMaxV).toBe(5);
    expect(limits.isPredictionBelowTarget).toBe(false);
  });

  it('flags a prediction that misses the output or the ripple target', () => {
    expect(
      acceptanceLimits({ outputMeanV: 850, ripplePeakToPeakV: 1, rippleMaxV: 5, targetOutputV: 900 })
        .isPredictionBelowTarget,
    ).toBe(true);
    expect(
      acceptanceLimits({ outputMeanV: 950, ripplePeakToPeakV: 8, rippleMaxV: 5, targetOutputV: 900 })
        .isPredictionBelowTarget,
    ).toBe(true);
  });
});
