import { describe, expect, it } from 'vitest';
import type { CheckVerdict } from './check.types';
import { describeMargin, mergeCheckRows } from './check-rows';

const storedCharge = (id: string, rule: string): CheckVerdict => ({
  id,
  subject: 'output (all stored energy)',
  rule,
  verdict: 'pass',
  marginPct: 64.7,
  value: 15.9e-6,
  limit: 45e-6,
  unit: 'C',
});

describe('mergeCheckRows', () => {
  it('gives one row for one limit set by two standards, naming both', () => {
    const rows = mergeCheckRows([
      storedCharge('stored-output-iec61010', 'IEC 61010-1 (from memory): 45 µC up to 15 kV'),
      storedCharge('stored-output-iec60335', 'IEC 60335-1 8.1.4 (read): 45 µC for 450 V–15 kV'),
    ]);
    expect(rows).toHaveLength(1);
    expect(rows[0]?.ids).toEqual(['stored-output-iec61010', 'stored-output-iec60335']);
    expect(rows[0]?.standards).toEqual(['IEC 61010-1 (from memory)', 'IEC 60335-1 8.1.4 (read)']);
  });

  it('keeps checks of different subjects or limits apart', () => {
    const other = { ...storedCharge('stored-c1-iec61010', 'IEC 61010-1 (from memory): 45 µC'), subject: 'C1' };
    const lower = { ...storedCharge('x', 'IEC 60335-1: 0.1 µF'), limit: 0.1e-6 };
    expect(mergeCheckRows([storedCharge('a', 'IEC 61010-1: 45 µC'), other, lower])).toHaveLength(3);
  });
});

// Margins as plain ratios of value to limit (arithmetic, common practice, no source).
describe('describeMargin', () => {
  it('says how far above an upper limit a value is, as a multiple once it is twice the limit', () => {
    // 1093 V held against a 50 V safe level: −2086 % as a signed margin.
    expect(describeMargin({ value: 1093, limit: 50, marginPct: -2086 })).toBe('22× the limit');
    expect(describeMargin({ value: 70, limit: 50, marginPct: -40 })).toBe('40 % over the limit');
  });

  it('gives the headroom under an upper limit as a share of it', () => {
    expect(describeMargin({ value: 31, limit: 50, marginPct: 38 })).toBe('38 % below the limit');
    expect(describeMargin({ value: 49.6, limit: 50, marginPct: 0.8 })).toBe('0.8 % below the limit');
    // Far below the limit the share of the limit reached says how far: 1.28 mA against 10 A.
    expect(describeMargin({ value: 1.28e-3, limit: 10, marginPct: 99.99 })).toBe('0.013 % of the limit');
    expect(describeMargin({ value: 0.098, limit: 10, marginPct: 99.02 })).toBe('0.98 % of the limit');
    expect(describeMargin({ value: 0.1, limit: 10, marginPct: 99 })).toBe('99 % below the limit');
  });

  it('reads a lower limit (base drive must reach 1.5× the need) the other way round', () => {
    expect(describeMargin({ value: 0.0784, limit: 0.0257, marginPct: 205 })).toBe('3.1× the minimum');
    expect(describeMargin({ value: 4.2, limit: 5, marginPct: -16 })).toBe('16 % short of the minimum');
    expect(describeMargin({ value: 6, limit: 5, marginPct: 20 })).toBe('20 % above the minimum');
  });

  it('never gives a marginal check past its limit as a multiple: its state comes from its rule, not a thin margin', () => {
    // A service-condition check (trapped charge) is marginal however far the kept voltage exceeds the safe one.
    const trapped = { isServiceCondition: true, verdict: 'marginal', value: 475, limit: 50, marginPct: -850 } as const;
    expect(describeMargin(trapped)).toBe('over the limit, in service only');
    expect(describeMargin({ ...trapped, isServiceCondition: false })).toBe('over the limit, marginal by its rule');
    // A derated part between its derated figure and its rating is marginal by a small overshoot: said as such.
    expect(describeMargin({ verdict: 'marginal', value: 880, limit: 800, marginPct: -10 })).toBe('10 % over the limit');
    // The same numbers failed keep their multiple.
    expect(describeMargin({ ...trapped, verdict: 'fail' })).toBe('9.5× the limit');
  });

  it('names an unbounded value and a value at the limit', () => {
    expect(describeMargin({ value: null, limit: 60, marginPct: -100 })).toBe('unbounded');
    expect(describeMargin({ value: 60, limit: 60, marginPct: 0 })).toBe('at the limit');
  });
});
