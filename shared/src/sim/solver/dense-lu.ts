import { DomainError } from '../../errors';

/** Solves the dense system A x = b in place (A row-major n×n is destroyed, b becomes x); Gaussian elimination with partial pivoting. */
export function solveDense(a: Float64Array, b: Float64Array, n: number): void {
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i * n + k]!) > Math.abs(a[p * n + k]!)) p = i;
    if (a[p * n + k] === 0)
      throw new DomainError('not_converged', 'singular shooting Jacobian', null, [
        { path: `state[${k}]`, message: 'zero pivot' },
      ]);
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j]!;
        a[k * n + j] = a[p * n + j]!;
        a[p * n + j] = t;
      }
      const t = b[k]!;
      b[k] = b[p]!;
      b[p] = t;
    }
    const inv = 1 / a[k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const f = a[i * n + k]! * inv;
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) a[i * n + j]! -= f * a[k * n + j]!;
      b[i]! -= f * b[k]!;
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    let s = b[k]!;
    for (let j = k + 1; j < n; j++) s -= a[k * n + j]! * b[j]!;
    b[k] = s / a[k * n + k]!;
  }
}

/**
 * LU factors of a dense row-major n×n matrix with partial pivoting, kept for many right-hand sides (the
 * chord iterations of the envelope following reuse one Jacobian over several periods).
 */
export class DenseLu {
  private readonly lu: Float64Array;
  private readonly pivot: Int32Array;

  constructor(readonly n: number) {
    this.lu = new Float64Array(n * n);
    this.pivot = new Int32Array(n);
  }

  /** Factors a copy of `a`; false when a pivot is zero (singular). */
  factor(a: Float64Array): boolean {
    const n = this.n;
    const m = this.lu;
    m.set(a);
    for (let k = 0; k < n; k++) {
      let p = k;
      for (let i = k + 1; i < n; i++) if (Math.abs(m[i * n + k]!) > Math.abs(m[p * n + k]!)) p = i;
      this.pivot[k] = p;
      if (m[p * n + k] === 0) return false;
      if (p !== k)
        for (let j = 0; j < n; j++) {
          const t = m[k * n + j]!;
          m[k * n + j] = m[p * n + j]!;
          m[p * n + j] = t;
        }
      const inv = 1 / m[k * n + k]!;
      for (let i = k + 1; i < n; i++) {
        const f = m[i * n + k]! * inv;
        m[i * n + k] = f;
        if (f === 0) continue;
        for (let j = k + 1; j < n; j++) m[i * n + j]! -= f * m[k * n + j]!;
      }
    }
    return true;
  }

  /** Solves in place with the last factors: b becomes x. */
  solve(b: Float64Array): void {
    const n = this.n;
    const m = this.lu;
    // Rows were swapped whole (multipliers too), so P·A = L·U: permute b first, then substitute.
    for (let k = 0; k < n; k++) {
      const p = this.pivot[k]!;
      if (p !== k) {
        const t = b[k]!;
        b[k] = b[p]!;
        b[p] = t;
      }
    }
    for (let k = 0; k < n; k++) {
      const bk = b[k]!;
      if (bk !== 0) for (let i = k + 1; i < n; i++) b[i]! -= m[i * n + k]! * bk;
    }
    for (let k = n - 1; k >= 0; k--) {
      let s = b[k]!;
      for (let j = k + 1; j < n; j++) s -= m[k * n + j]! * b[j]!;
      b[k] = s / m[k * n + k]!;
    }
  }
}
