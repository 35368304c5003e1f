import fc from 'fast-check';
import { lusolve } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { BandedLu } from './banded-lu';

// Reference: mathjs's dense LU solve (a general-purpose library) on the same matrix.

interface BandCase {
  n: number;
  kl: number;
  ku: number;
  entries: number[][];
  b: number[];
}

function denseFrom(c: BandCase): number[][] {
  return c.entries.map((row) => [...row]);
}

function solveBanded(c: BandCase): Float64Array {
  const lu = new BandedLu(c.n, c.kl, c.ku);
  for (let i = 0; i < c.n; i++)
    for (let j = 0; j < c.n; j++) if (c.entries[i]![j] !== 0) lu.band[lu.offsetOf(i, j)] = c.entries[i]![j]!;
  lu.factor();
  const x = new Float64Array(c.n + 1);
  x.set(c.b);
  lu.solve(x);
  return x.subarray(0, c.n);
}

function expectSameSolution(c: BandCase): void {
  const x = solveBanded(c);
  const reference = (lusolve(denseFrom(c), c.b) as number[][]).map((r) => r[0]!);
  const scale = Math.max(1, ...reference.map(Math.abs));
  reference.forEach((v, i) => expect(Math.abs(x[i]! - v)).toBeLessThan(1e-9 * scale));
}

/** A band matrix, diagonally weighted by `diagonal` (0 gives zero diagonals that force row swaps). */
const bandCase = (kl: number, ku: number, diagonal: 'strong' | 'zero-at-random' | 'weak') =>
  fc
    .record({
      n: fc.integer({ min: 1, max: 24 }),
      seed: fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 24 * 24, maxLength: 24 * 24 }),
      rhs: fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: 24, maxLength: 24 }),
      zeros: fc.array(fc.boolean(), { minLength: 24, maxLength: 24 }),
    })
    .map(({ n, seed, rhs, zeros }): BandCase => {
      const entries = Array.from({ length: n }, (_, i) =>
        Array.from({ length: n }, (_, j) => {
          if (i - j > kl || j - i > ku) return 0;
          const v = seed[i * 24 + j]!;
          if (i !== j) return v;
          if (diagonal === 'strong') return 4 + Math.abs(v);
          if (diagonal === 'weak') return 1e-5 * (1 + Math.abs(v));
          return zeros[i] ? 0 : 2 + v;
        }),
      );
      return { n, kl, ku, entries, b: rhs.slice(0, n) };
    })
    .filter((c) => Math.abs(determinantSign(c.entries)) > 1e-6);

/** |det| by dense elimination with partial pivoting, to skip (near-)singular draws. */
function determinantSign(m: number[][]): number {
  const a = m.map((r) => [...r]);
  const n = a.length;
  let det = 1;
  for (let j = 0; j < n; j++) {
    let p = j;
    for (let i = j + 1; i < n; i++) if (Math.abs(a[i]![j]!) > Math.abs(a[p]![j]!)) p = i;
    if (a[p]![j] === 0) return 0;
    if (p !== j) [a[p], a[j]] = [a[j]!, a[p]!];
    det *= a[j]![j]!;
    for (let i = j + 1; i < n; i++) {
      const f = a[i]![j]! / a[j]![j]!;
      for (let k = j; k < n; k++) a[i]![k]! -= f * a[j]![k]!;
    }
  }
  return Math.sign(det) * Math.min(1, Math.abs(det));
}

describe('BandedLu', () => {
  it.each([
    [2, 2, 'strong'],
    [2, 2, 'zero-at-random'],
    [2, 2, 'weak'],
    [1, 3, 'zero-at-random'],
    [3, 1, 'strong'],
    [4, 4, 'zero-at-random'],
  ] as const)('solves kl = %i, ku = %i band matrices (%s diagonal) as a dense LU does', (kl, ku, diagonal) => {
    fc.assert(
      fc.property(bandCase(kl, ku, diagonal), (c) => expectSameSolution(c)),
      { numRuns: 150 },
    );
  });

  it('reuses one factorization for several right-hand sides, with and without row swaps', () => {
    for (const zeroFirst of [false, true]) {
      const n = 9;
      const entries = Array.from({ length: n }, (_, i) =>
        Array.from({ length: n }, (_, j) => (Math.abs(i - j) > 2 ? 0 : i === j ? (zeroFirst && i === 0 ? 0 : 3) : 1)),
      );
      const lu = new BandedLu(n, 2, 2);
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) if (entries[i]![j]) lu.band[lu.offsetOf(i, j)] = entries[i]![j]!;
      lu.factor();
      for (const k of [0, 4, 8]) {
        const b = Array.from({ length: n }, (_, i) => (i === k ? 1 : 0));
        const x = new Float64Array(n + 1);
        x.set(b);
        lu.solve(x);
        const reference = (lusolve(entries, b) as number[][]).map((r) => r[0]!);
        reference.forEach((v, i) => expect(x[i]).toBeCloseTo(v, 12));
      }
    }
  });

  it('solves several right-hand sides stored by rows at once, as a dense LU does each', () => {
    fc.assert(
      fc.property(bandCase(2, 2, 'zero-at-random'), fc.integer({ min: 1, max: 5 }), (c, count) => {
        const lu = new BandedLu(c.n, c.kl, c.ku);
        for (let i = 0; i < c.n; i++)
          for (let j = 0; j < c.n; j++) if (c.entries[i]![j] !== 0) lu.band[lu.offsetOf(i, j)] = c.entries[i]![j]!;
        lu.factor();
        // Column k of B is the right-hand side scaled by k + 1 and shifted by k, entry (i, k) at i·count + k.
        const rhs = (k: number): number[] => c.b.map((v) => (k + 1) * v + k);
        const b = new Float64Array(c.n * count);
        for (let k = 0; k < count; k++) rhs(k).forEach((v, i) => (b[i * count + k] = v));
        lu.solveColumns(b, count);
        for (let k = 0; k < count; k++) {
          const reference = (lusolve(denseFrom(c), rhs(k)) as number[][]).map((r) => r[0]!);
          const scale = Math.max(1, ...reference.map(Math.abs));
          reference.forEach((v, i) => expect(Math.abs(b[i * count + k]! - v)).toBeLessThan(1e-9 * scale));
        }
      }),
      { numRuns: 100 },
    );
  });

  it('reports a singular matrix with the unknown it stopped at', () => {
    const lu = new BandedLu(3, 1, 1);
    lu.band[lu.offsetOf(0, 0)] = 1;
    lu.band[lu.offsetOf(1, 1)] = 1;
    expect(() => lu.factor()).toThrow(/singular circuit matrix at unknown 2/);
  });
});
