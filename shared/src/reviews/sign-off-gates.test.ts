import { describe, expect, it } from 'vitest';
import { gateReasons, overrideReasonProblem } from './sign-off-gates';

// The gate rules are this product's Sign-off policy: common practice, no source.
const clear = { checks: [], openThreadCount: 0, engineVersion: '1.1.0', currentEngineVersion: '1.1.0' };

describe('gateReasons', () => {
  it('holds nothing back when every Check passes or is marginal, no thread is open and the engine matches', () => {
    const checks = [
      { id: 'c1-voltage', subject: 'C1', verdict: 'pass' as const },
      { id: 'd1-piv', subject: 'D1', verdict: 'marginal' as const },
    ];
    expect(gateReasons({ ...clear, checks })).toEqual([]);
  });

  it('names each failing Check, the open threads and the stale engine, in that order', () => {
    const reasons = gateReasons({
      checks: [
        { id: 'c1-voltage', subject: 'C1', verdict: 'fail' },
        { id: 'd2-piv', subject: 'D2', verdict: 'fail' },
      ],
      openThreadCount: 1,
      engineVersion: '1.0.0',
      currentEngineVersion: '1.1.0',
    });
    expect(reasons.map((reason) => reason.code)).toEqual(['failing_checks', 'open_threads', 'stale_results']);
    expect(reasons[0]).toMatchObject({ checkIds: ['c1-voltage', 'd2-piv'] });
    expect(reasons[0]?.message).toBe('2 Checks fail: c1-voltage (C1), d2-piv (D2)');
    expect(reasons[1]?.message).toBe('1 comment thread is still open');
  });
});

describe('overrideReasonProblem', () => {
  it.each([
    ['x'.repeat(19), 'override.reason must be at least 20 characters (it has 19)'],
    [`  ${'x'.repeat(19)}  `, 'override.reason must be at least 20 characters (it has 19)'],
    ['x'.repeat(20), null],
  ])('%j -> %s', (reason, expected) => {
    expect(overrideReasonProblem(reason)).toBe(expected);
  });
});
