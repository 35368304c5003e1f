import { DomainError } from '../../errors';

/**
 * Banded LU with partial pivoting (the unblocked LAPACK dgbtf2 scheme, column-major band storage with
 * kl extra rows for pivoting fill). Cost per factorization is O(n · kl · (kl + ku)), linear in n for a
 * fixed bandwidth, which a ladder keeps once its unknowns are ordered (see node-ordering.ts).
 * Storage is allocated once; entries are addressed through offsetOf(row, col), computed once per stamp.
 */
export class BandedLu {
  readonly size: number;
  readonly lowerBandwidth: number;
  readonly upperBandwidth: number;
  /** Leading dimension of one stored column: 2·kl + ku + 1. */
  readonly columnStride: number;
  /**
   * Band storage: entry (i, j) lives at j·columnStride + kl + ku + i − j. One extra slot at the end,
   * `groundOffset`, absorbs stamps into the ground row or column, so device code needs no branches.
   */
  readonly band: Float64Array;
  readonly groundOffset: number;
  private readonly pivots: Int32Array;
  /** Reciprocal of each pivot of U, from the last factorization (the solve multiplies, never divides). */
  private readonly inversePivots: Float64Array;
  private readonly diagonalRow: number;

  constructor(size: number, lowerBandwidth: number, upperBandwidth: number) {
    this.size = size;
    this.lowerBandwidth = lowerBandwidth;
    this.upperBandwidth = upperBandwidth;
    this.columnStride = 2 * lowerBandwidth + upperBandwidth + 1;
    this.diagonalRow = lowerBandwidth + upperBandwidth;
    this.groundOffset = size * this.columnStride;
    this.band = new Float64Array(this.groundOffset + 1);
    this.pivots = new Int32Array(size);
    this.inversePivots = new Float64Array(size);
  }

  /** Offset of matrix entry (row, col) in `band`; `groundOffset` when either index is the ground (≥ size). */
  offsetOf(row: number, col: number): number {
    if (row >= this.size || col >= this.size) return this.groundOffset;
    const d = row - col;
    if (d > this.lowerBandwidth || -d > this.upperBandwidth) {
      throw new DomainError('invalid_argument', `entry (${row}, ${col}) lies outside the band`);
    }
    return col * this.columnStride + this.diagonalRow + d;
  }

  /** Factors `band` in place. Throws not_converged with the column when the matrix is singular. */
  factor(): void {
    const n = this.size;
    const kl = this.lowerBandwidth;
    const ku = this.upperBandwidth;
    const ld = this.columnStride;
    const kv = this.diagonalRow;
    const a = this.band;
    let ju = 0;
    for (let j = 0; j < n; j++) {
      const km = Math.min(kl, n - 1 - j);
      const colJ = j * ld + kv;
      let jp = 0;
      let best = Math.abs(a[colJ]!);
      for (let t = 1; t <= km; t++) {
        const v = Math.abs(a[colJ + t]!);
        if (v > best) {
          best = v;
          jp = t;
        }
      }
      this.pivots[j] = j + jp;
      if (best === 0) {
        throw new DomainError('not_converged', `singular circuit matrix at unknown ${j}`, null, [
          { path: `unknown[${j}]`, message: 'zero pivot: a floating node or a loop of voltage sources' },
        ]);
      }
      ju = Math.max(ju, Math.min(j + ku + jp, n - 1));
      if (jp !== 0) {
        for (let c = j; c <= ju; c++) {
          const p = c * ld + kv + j - c;
          const tmp = a[p]!;
          a[p] = a[p + jp]!;
          a[p + jp] = tmp;
        }
      }
      const inv = 1 / a[colJ]!;
      this.inversePivots[j] = inv;
      // Row j's entry moves by ld − 1 from one column to the next.
      const stride = ld - 1;
      if (km === 2) {
        // The common ladder band (two sub-diagonals), unrolled: the loop overhead is most of the work.
        const l1 = (a[colJ + 1]! *= inv);
        const l2 = (a[colJ + 2]! *= inv);
        for (let c = j + 1, p = colJ + stride; c <= ju; c++, p += stride) {
          const f = a[p]!;
          if (f !== 0) {
            a[p + 1]! -= l1 * f;
            a[p + 2]! -= l2 * f;
          }
        }
        continue;
      }
      for (let t = 1; t <= km; t++) a[colJ + t]! *= inv;
      for (let c = j + 1, p = colJ + stride; c <= ju; c++, p += stride) {
        const f = a[p]!;
        if (f !== 0) {
          for (let t = 1; t <= km; t++) a[p + t]! -= a[colJ + t]! * f;
        }
      }
    }
  }

  /** Solves A x = b in place (b becomes x), using the last factorization. */
  solve(b: Float64Array): void {
    const n = this.size;
    const kl = this.lowerBandwidth;
    const ld = this.columnStride;
    const kv = this.diagonalRow;
    const kvU = this.lowerBandwidth + this.upperBandwidth;
    const a = this.band;
    const inverse = this.inversePivots;
    for (let j = 0; j < n; j++) {
      const p = this.pivots[j]!;
      const bj = b[p]!;
      if (p !== j) {
        b[p] = b[j]!;
        b[j] = bj;
      }
      if (bj !== 0) {
        const km = Math.min(kl, n - 1 - j);
        const colJ = j * ld + kv;
        if (km === 2) {
          b[j + 1]! -= a[colJ + 1]! * bj;
          b[j + 2]! -= a[colJ + 2]! * bj;
        } else for (let t = 1; t <= km; t++) b[j + t]! -= a[colJ + t]! * bj;
      }
    }
    for (let j = n - 1; j >= 0; j--) {
      const colJ = j * ld + kv;
      const xj = b[j]! * inverse[j]!;
      b[j] = xj;
      if (xj !== 0) {
        const i0 = Math.max(0, j - kvU);
        for (let i = i0, q = colJ + i0 - j; i < j; i++, q++) b[i]! -= a[q]! * xj;
      }
    }
  }
}
