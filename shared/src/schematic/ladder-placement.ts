import type { buildLadderNetwork } from '../multiplier';
import { FULL_WAVE_PITCH, HALF_WAVE_PITCH } from './schematic-sheet';
import type { Point } from './schematic.types';

/** The heights (px) of a ladder's rows: the top and bottom columns and the middle (smoothing) row between them. */
export interface LadderRows {
  top: number;
  mid: number;
  bottom: number;
}

export interface LadderPlacement {
  /** Where each network node sits. */
  nodeAt: Point[];
  /** Which row each node is on: its labels go above a top row and below a bottom one. */
  rowOf: ('top' | 'mid' | 'bottom')[];
  /** The hot end(s) of the secondary and the grounded node(s) the ladder stands on. */
  right: number;
}

/**
 * Node positions of a ladder drawn left to right: half-wave nodes alternate between the oscillating (top) and
 * smoothing (bottom) rows one pitch apart; a full-wave cascade has its two oscillating columns above and below
 * the smoothing one; the bridge doubler stacks its two capacitors on the midpoint.
 */
export function placeLadder(
  net: ReturnType<typeof buildLadderNetwork>,
  rows: LadderRows,
  x0: number,
  isBridge: boolean,
): LadderPlacement {
  const nodeAt: Point[] = [];
  const rowOf: LadderPlacement['rowOf'] = [];
  const set = (i: number, p: Point, row: LadderPlacement['rowOf'][number]) => {
    nodeAt[i] = p;
    rowOf[i] = row;
  };
  if (isBridge) {
    // mid (0), winding end (1), top T (2), return B (3).
    const xWinding = x0 + 60;
    const x = xWinding + 120;
    set(0, { x, y: rows.mid }, 'mid');
    set(1, { x: xWinding, y: rows.top - 30 }, 'top');
    set(2, { x, y: rows.top - 30 }, 'top');
    set(3, { x, y: rows.bottom + 30 }, 'bottom');
    return { nodeAt, rowOf, right: x + 150 };
  }
  if (net.topology === 'full-wave') {
    const s = FULL_WAVE_PITCH;
    set(0, { x: x0, y: rows.mid }, 'mid');
    set(1, { x: x0 - s / 2, y: rows.top }, 'top');
    set(2, { x: x0 - s / 2, y: rows.bottom }, 'bottom');
    for (let j = 1; j <= net.stageCount; j += 1) {
      set(3 * j, { x: x0 + (j - 0.5) * s, y: rows.top }, 'top');
      set(3 * j + 1, { x: x0 + (j - 0.5) * s, y: rows.bottom }, 'bottom');
      set(3 * j + 2, { x: x0 + j * s, y: rows.mid }, 'mid');
    }
    return { nodeAt, rowOf, right: x0 + net.stageCount * s };
  }
  // Half-wave: node N_i at x0 + i·pitch on its column's row; the hot end and the return are N_−1 and N_0.
  const p = HALF_WAVE_PITCH;
  const k = net.capTop.length;
  const isEven = k % 2 === 0;
  set(isEven ? 1 : 0, { x: x0 - p, y: isEven ? rows.top : rows.bottom }, isEven ? 'top' : 'bottom');
  set(isEven ? 0 : 1, { x: x0, y: isEven ? rows.bottom : rows.top }, isEven ? 'bottom' : 'top');
  for (let c = 0; c < k; c += 1) {
    const column = net.capColumn[c];
    const isTop = column === 'oscillating';
    set(net.capTop[c] as number, { x: x0 + (c + 1) * p, y: isTop ? rows.top : rows.bottom }, isTop ? 'top' : 'bottom');
  }
  return { nodeAt, rowOf, right: x0 + k * p };
}
