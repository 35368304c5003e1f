/** A point of the drawing, in drawing units (1 unit = 1 CSS pixel on screen, 1 point on the spec sheet scaled). */
export interface Point {
  x: number;
  y: number;
}

/** An axis-aligned box: left, top, width, height. */
export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

/**
 * One stroke of the drawing as SVG path data (M, L, A, Z only), so a browser and a PDF writer draw the same
 * geometry: `wire` thin, `part` a symbol's body, `plate` a capacitor plate or a diode bar (heavier), `fill` a
 * filled shape (junction dots, winding dots, arrow heads).
 */
export interface SchematicStroke {
  d: string;
  style: 'wire' | 'part' | 'plate' | 'fill';
  /** The part the stroke belongs to (C3, D3, Q1 …), for a verdict colour; absent for wires. */
  partId?: string;
}

export type PartVerdict = 'pass' | 'marginal' | 'fail';

/** One line of text with the box it takes, computed from the layout (an estimate of Inter's advance widths). */
export interface SchematicLabel {
  text: string;
  /** The anchor point on the baseline. */
  x: number;
  y: number;
  anchor: 'start' | 'middle' | 'end';
  sizePx: number;
  isBold?: boolean;
  role: 'part' | 'value' | 'node-voltage' | 'verdict' | 'title';
  partId?: string;
  verdict?: PartVerdict;
  box: Box;
}

/** The worst verdict of one part over its checks, with the check that set it. */
export interface PartCheck {
  partId: string;
  verdict: PartVerdict;
  /** The verdict as words and a number, e.g. "pass 42 %", "fail 2.1× limit". */
  text: string;
}

export interface SchematicLayout {
  width: number;
  height: number;
  strokes: SchematicStroke[];
  labels: SchematicLabel[];
  /** Every part drawn, with its worst verdict where a check covers it. */
  partChecks: PartCheck[];
}
