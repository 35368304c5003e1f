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
