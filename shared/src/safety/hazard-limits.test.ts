import { describe, expect, it } from 'vitest';
import { deratedVerdict, HV_CAUTION, lowerLimitVerdict, upperLimitVerdict } from './hazard-limits';

const base = { id: 'x', subject: 's', rule: 'r', unit: 'V' };

describe('verdict thresholds', () => {
  it('upper limit: pass with ≥ 20 % margin, marginal 0–20 %, fail above', () => {
    expect(upperLimitVerdict({ ...base, value: 79, limit: 100 }).verdict).toBe('pass');
    expect(upperLimitVerdict({ ...base, value: 81, limit: 100 }).verdict).toBe('marginal');
    expect(upperLimitVerdict({ ...base, value: 101, limit: 100 }).verdict).toBe('fail');
    expect(upperLimitVerdict({ ...base, value: 101, limit: 100 }).marginPct).toBeCloseTo(-1, 12);
    expect(upperLimitVerdict({ ...base, value: null, limit: 100 }).verdict).toBe('fail');
  });

  it('lower limit: the value must reach the limit', () => {
    expect(lowerLimitVerdict({ ...base, value: 12.5, limit: 10 }).verdict).toBe('pass');
    expect(lowerLimitVerdict({ ...base, value: 11, limit: 10 }).verdict).toBe('marginal');
    expect(lowerLimitVerdict({ ...base, value: 9, limit: 10 }).verdict).toBe('fail');
  });

  it('derated rating: pass up to rating × factor, marginal up to the rating, fail beyond; limit reports the derated figure', () => {
    expect(deratedVerdict({ ...base, value: 800 }, 1000, 0.8)).toMatchObject({
      verdict: 'pass',
      limit: 800,
      marginPct: 0,
    });
    expect(deratedVerdict({ ...base, value: 900 }, 1000, 0.8).verdict).toBe('marginal');
    expect(deratedVerdict({ ...base, value: 1001 }, 1000, 0.8).verdict).toBe('fail');
  });

  it('the high-voltage caution names what governs', () => {
    expect(HV_CAUTION).toMatch(/standard that applies to the equipment, local codes and licensed practice govern/);
  });
});
