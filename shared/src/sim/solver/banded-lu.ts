import { DomainError } from '../../errors';

/** Smallest diagonal, relative to the largest entry below it in its column, kept as the pivot. */
const PIVOT_THRESHOLD = 1e-3;

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
  /** Widest reach of a row of U beyond its diagonal in the last factorization (ku, up to kl + ku after swaps). */
  private upperExtent = 0;
  /** Whether the last factorization swapped any rows. */
  private hasSwaps = false;

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

  /** Factors `band` and solves A x = b in place (b becomes x): the forward substitution rides along. */
  factorAndSolve(b: Float64Array): void {
    this.factor(b);
    this.backSubstitute(b);
  }

  /**
   * Factors `band` in place; with `b`, also applies the row swaps and L⁻¹ to it (the forward substitution
   * of solve). Throws not_converged with the column when the matrix is singular.
   */
  factor(b: Float64Array | null = null): void {
    const n = this.size;
    const kl = this.lowerBandwidth;
    const ku = this.upperBandwidth;
    const ld = this.columnStride;
    const kv = this.diagonalRow;
    const a = this.band;
    const pivots = this.pivots;
    const inverse = this.inversePivots;
    const stride = ld - 1;
    let ju = 0;
    let extent = 0;
    let swapped = false;
    let j = 0;
    if (kl === 2 && ku === 2) {
      // The ladder's own band (two sub- and two super-diagonals) in its own order: the columns before the
      // last two as the unrolled branch below takes them, without its bookkeeping per column, for as long as
      // no row swap is needed; the loop below goes on from the first column that needs one.
      for (let colJ = kv; j < n - 2 && this.keepsDiagonal(colJ); j++, colJ += ld) {
        this.eliminateTwoBelow(j, colJ, b);
        this.updateNextTwoColumns(colJ);
      }
      if (j > 0) {
        ju = j + 1;
        extent = 2;
      }
    }
    for (; j < n; j++) {
      const km = Math.min(kl, n - 1 - j);
      const colJ = j * ld + kv;
      // The common ladder band (two sub-diagonals) with the diagonal good enough and no earlier swap
      // reaching this row: no search, no swap, the update unrolled (the loop overhead is most of the work).
      if (km === 2 && ju <= j + ku && this.keepsDiagonal(colJ)) {
        this.eliminateTwoBelow(j, colJ, b);
        ju = Math.min(j + ku, n - 1);
        if (ju - j > extent) extent = ju - j;
        if (ju === j + 2) {
          // Two super-diagonals as well (the ladder's own band): both column updates unrolled.
          this.updateNextTwoColumns(colJ);
          continue;
        }
        const l1 = a[colJ + 1]!;
        const l2 = a[colJ + 2]!;
        for (let c = j + 1, p = colJ + stride; c <= ju; c++, p += stride) {
          const f = a[p]!;
          if (f !== 0) {
            a[p + 1]! -= l1 * f;
            a[p + 2]! -= l2 * f;
          }
        }
        continue;
      }
      let jp = 0;
      let best = Math.abs(a[colJ]!);
      for (let t = 1; t <= km; t++) {
        const v = Math.abs(a[colJ + t]!);
        if (v > best) {
          best = v;
          jp = t;
        }
      }
      // Threshold pivoting: keep the diagonal unless it is below PIVOT_THRESHOLD of the column's largest
      // entry (the relative threshold of K. Kundert's Sparse, 1e-3). A circuit matrix is then factored in
      // its own order, with no row swaps and no fill beyond the upper band, except at a zero or tiny
      // diagonal such as a voltage source's branch row.
      if (jp !== 0 && Math.abs(a[colJ]!) >= PIVOT_THRESHOLD * best) jp = 0;
      pivots[j] = j + jp;
      if (best === 0) {
        throw new DomainError('not_converged', `singular circuit matrix at unknown ${j}`, null, [
          { path: `unknown[${j}]`, message: 'zero pivot: a floating node or a loop of voltage sources' },
        ]);
      }
      ju = Math.max(ju, Math.min(j + ku + jp, n - 1));
      if (ju - j > extent) extent = ju - j;
      if (jp !== 0) {
        swapped = true;
        if (b) {
          const tmp = b[j]!;
          b[j] = b[j + jp]!;
          b[j + jp] = tmp;
        }
        for (let c = j; c <= ju; c++) {
          const p = c * ld + kv + j - c;
          const tmp = a[p]!;
          a[p] = a[p + jp]!;
          a[p + jp] = tmp;
        }
      }
      const inv = 1 / a[colJ]!;
      inverse[j] = inv;
      // Row j's entry moves by ld − 1 from one column to the next.
      for (let t = 1; t <= km; t++) a[colJ + t]! *= inv;
      if (b) {
        const bj = b[j]!;
        for (let t = 1; t <= km; t++) b[j + t]! -= a[colJ + t]! * bj;
      }
      for (let c = j + 1, p = colJ + stride; c <= ju; c++, p += stride) {
        const f = a[p]!;
        if (f !== 0) {
          for (let t = 1; t <= km; t++) a[p + t]! -= a[colJ + t]! * f;
        }
      }
    }
    this.upperExtent = extent;
    this.hasSwaps = swapped;
  }

  /** Whether the diagonal at colJ stays the pivot against the two entries below it (threshold pivoting). */
  private keepsDiagonal(colJ: number): boolean {
    const a = this.band;
    const ad = Math.abs(a[colJ]!);
    return ad !== 0 && ad >= PIVOT_THRESHOLD * Math.abs(a[colJ + 1]!) && ad >= PIVOT_THRESHOLD * Math.abs(a[colJ + 2]!);
  }

  /**
   * Column j (its diagonal at colJ) of a band with two sub-diagonals, the diagonal kept as the pivot: the
   * pivot's reciprocal, the two multipliers stored in place of the entries below it and, with b, their
   * forward substitution.
   */
  private eliminateTwoBelow(j: number, colJ: number, b: Float64Array | null): void {
    const a = this.band;
    this.pivots[j] = j;
    const inv = 1 / a[colJ]!;
    this.inversePivots[j] = inv;
    const l1 = a[colJ + 1]! * inv;
    const l2 = a[colJ + 2]! * inv;
    a[colJ + 1] = l1;
    a[colJ + 2] = l2;
    if (b) {
      const bj = b[j]!;
      b[j + 1]! -= l1 * bj;
      b[j + 2]! -= l2 * bj;
    }
  }

  /** Rows j + 1 and j + 2 of the next two columns, less column j's multipliers (diagonal at colJ) times row j. */
  private updateNextTwoColumns(colJ: number): void {
    const a = this.band;
    const l1 = a[colJ + 1]!;
    const l2 = a[colJ + 2]!;
    const p1 = colJ + this.columnStride - 1;
    const p2 = p1 + this.columnStride - 1;
    const f1 = a[p1]!;
    const f2 = a[p2]!;
    a[p1 + 1]! -= l1 * f1;
    a[p1 + 2]! -= l2 * f1;
    a[p2 + 1]! -= l1 * f2;
    a[p2 + 2]! -= l2 * f2;
  }

  /** Solves A x = b in place (b becomes x), using the last factorization. */
  solve(b: Float64Array): void {
    const n = this.size;
    const kl = this.lowerBandwidth;
    const ld = this.columnStride;
    const kv = this.diagonalRow;
    const a = this.band;
    if (kl === 2 && !this.hasSwaps && n >= 3) {
      // Two sub-diagonals and no row swaps (a ladder in its own order): unrolled.
      for (let j = 0, colJ = kv; j < n - 2; j++, colJ += ld) {
        const bj = b[j]!;
        b[j + 1]! -= a[colJ + 1]! * bj;
        b[j + 2]! -= a[colJ + 2]! * bj;
      }
      b[n - 1]! -= a[(n - 2) * ld + kv + 1]! * b[n - 2]!;
    } else {
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
          for (let t = 1; t <= km; t++) b[j + t]! -= a[colJ + t]! * bj;
        }
      }
    }
    this.backSubstitute(b);
  }

  /**
   * Solves A X = B in place for `count` right-hand sides at once, using the last factorization. B is stored
   * by rows, entry (i, c) at i·count + c (rows past the size are left alone): each elimination step then
   * runs over a contiguous row, where column-by-column solves would walk the band once per column.
   */
  solveColumns(b: Float64Array, count: number): void {
    const n = this.size;
    const kl = this.lowerBandwidth;
    const ld = this.columnStride;
    const kv = this.diagonalRow;
    const a = this.band;
    for (let j = 0; j < n; j++) {
      const rowJ = j * count;
      const p = this.pivots[j]!;
      if (p !== j) {
        for (let c = 0, rowP = p * count; c < count; c++) {
          const t = b[rowP + c]!;
          b[rowP + c] = b[rowJ + c]!;
          b[rowJ + c] = t;
        }
      }
      const km = Math.min(kl, n - 1 - j);
      const colJ = j * ld + kv;
      for (let t = 1; t <= km; t++) {
        const l = a[colJ + t]!;
        if (l === 0) continue;
        for (let c = 0, rowT = (j + t) * count; c < count; c++) b[rowT + c]! -= l * b[rowJ + c]!;
      }
    }
    const kvU = this.upperExtent;
    const inverse = this.inversePivots;
    for (let j = n - 1; j >= 0; j--) {
      const rowJ = j * count;
      const d = inverse[j]!;
      for (let c = 0; c < count; c++) b[rowJ + c]! *= d;
      const i0 = Math.max(0, j - kvU);
      for (let i = i0, q = j * ld + kv + i0 - j; i < j; i++, q++) {
        const u = a[q]!;
        if (u === 0) continue;
        for (let c = 0, rowI = i * count; c < count; c++) b[rowI + c]! -= u * b[rowJ + c]!;
      }
    }
  }

  /** x = U⁻¹·b in place. */
  private backSubstitute(b: Float64Array): void {
    const n = this.size;
    const ld = this.columnStride;
    const kv = this.diagonalRow;
    // Rows of U reach at most upperExtent columns right of the diagonal (ku without row swaps).
    const kvU = this.upperExtent;
    const a = this.band;
    const inverse = this.inversePivots;
    if (kvU === 2 && n >= 3) {
      // Back substitution by rows: U(j, j + 1) and U(j, j + 2) sit ld − 1 and 2·(ld − 1) past U(j, j).
      const s1 = ld - 1;
      const s2 = 2 * s1;
      const last = (n - 2) * ld + kv;
      let x1 = (b[n - 1]! *= inverse[n - 1]!);
      let x0 = (b[n - 2] = (b[n - 2]! - a[last + s1]! * x1) * inverse[n - 2]!);
      for (let j = n - 3, colJ = j * ld + kv; j >= 0; j--, colJ -= ld) {
        const xj = (b[j]! - a[colJ + s1]! * x0 - a[colJ + s2]! * x1) * inverse[j]!;
        b[j] = xj;
        x1 = x0;
        x0 = xj;
      }
      return;
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
