import type { BandedLu } from '../solver/banded-lu';

/** Registers a reactive quantity (charge or flux) with the system; returns its index. */
export type AddReactive = (
  name: string,
  a: number,
  b: number,
  grad: ReadonlyArray<[number, number]>,
  q0: number,
) => number;

/** Band offsets of a two-terminal element between unknowns a and b: aa, ab, ba, bb. */
export function junctionOffsets(lu: BandedLu, a: number, b: number): Int32Array {
  return new Int32Array([lu.offsetOf(a, a), lu.offsetOf(a, b), lu.offsetOf(b, a), lu.offsetOf(b, b)]);
}

/** Linearized two-terminal element: current gEq·(Va − Vb) + iEq from a to b. */
export function stampJunction(
  band: Float64Array,
  rhs: Float64Array,
  o: Int32Array,
  a: number,
  b: number,
  gEq: number,
  iEq: number,
): void {
  band[o[0]!]! += gEq;
  band[o[1]!]! -= gEq;
  band[o[2]!]! -= gEq;
  band[o[3]!]! += gEq;
  rhs[a]! -= iEq;
  rhs[b]! += iEq;
}
