import { describe, expect, it } from 'vitest';
import { estimateRemainingApproach } from './cycle-settling';

describe('estimateRemainingApproach', () => {
  it('recovers the limit of a geometric approach exactly', () => {
    // m_k = 1000 − 400·0.97^k: the rest after m_k is 400·0.97^k (sum of a geometric series).
    const means = Array.from({ length: 121 }, (_, k) => 1000 - 400 * 0.97 ** k);
    const estimate = estimateRemainingApproach(means, 30, 1e-9);
    expect(estimate.windowRatio!).toBeCloseTo(0.97 ** 30, 12);
    expect(estimate.remaining!).toBeCloseTo(400 * 0.97 ** 120, 9);
  });

  it('gives no estimate for a ramp, a growing change or too few cycles', () => {
    const ramp = Array.from({ length: 100 }, (_, k) => 10 + 0.5 * k);
    expect(estimateRemainingApproach(ramp, 20, 1e-9).remaining).toBeNull();
    const growing = Array.from({ length: 100 }, (_, k) => 1.02 ** k);
    expect(estimateRemainingApproach(growing, 20, 1e-9).remaining).toBeNull();
    expect(estimateRemainingApproach([1, 2, 3], 20, 1e-9).remaining).toBeNull();
  });

  it('takes changes under the noise floor as settled to their size', () => {
    const flat = Array.from({ length: 60 }, (_, k) => 500 + (k % 2 === 0 ? 1e-6 : -1e-6));
    expect(Math.abs(estimateRemainingApproach(flat, 20, 1e-5).remaining!)).toBeLessThanOrEqual(2e-6);
  });
});
