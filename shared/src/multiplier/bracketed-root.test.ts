import { describe, expect, it } from 'vitest';
import { bracketedRoot } from './bracketed-root';

describe('bracketedRoot', () => {
  it('finds the real root of x³ − 2x − 5 (Wallis’s example, 2.0945514815423265; from memory) in far fewer calls than bisection', () => {
    let calls = 0;
    const f = (x: number) => {
      calls += 1;
      return x ** 3 - 2 * x - 5;
    };
    const root = bracketedRoot(f, 2, 3, f(2), f(3), 1e-14);
    // 1e-13: the requested resolution plus rounding of the cubic near its root.
    expect(Math.abs(root - 2.0945514815423265)).toBeLessThan(1e-13);
    expect(calls).toBeLessThan(15); // bisection needs 47 for the same resolution
  });

  it('stays inside the bracket on a function with a kink and a flat part', () => {
    const f = (x: number) => (x < 0.7 ? 1 - x / 0.7 : -Math.min(1, (x - 0.7) * 10));
    const root = bracketedRoot(f, 0, 5, f(0), f(5), 1e-12);
    expect(Math.abs(root - 0.7)).toBeLessThan(1e-11);
  });

  it('returns an end where the function is zero', () => {
    expect(bracketedRoot((x) => x, 0, 1, 0, 1, 1e-9)).toBe(0);
  });
});
