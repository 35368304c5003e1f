import { formatQuantity } from '../units';
import type { Box, PartCheck, SchematicLabel, SchematicStroke } from './schematic.types';

/** Label type size (px) and the advance width an Inter glyph takes at most on average, as a fraction of it. */
export const LABEL_SIZE_PX = 10;
const ADVANCE_EM = 0.62;
const BOLD_ADVANCE_EM = 0.66;
const LINE_PX = 13;
/** Horizontal pitch between neighbouring ladder nodes; rows of a ladder and their spacing. */
export const HALF_WAVE_PITCH = 120;
export const FULL_WAVE_PITCH = 300;
export const ROW_GAP = 150;
export const MARGIN = 16;

/** The box a line of text takes: Inter's advance widths estimated from above, the ascent and descent of its size. */
export function labelBox(
  text: string,
  x: number,
  y: number,
  anchor: SchematicLabel['anchor'],
  sizePx: number,
  isBold = false,
): Box {
  const width = [...text].length * sizePx * (isBold ? BOLD_ADVANCE_EM : ADVANCE_EM);
  const left = anchor === 'start' ? x : anchor === 'middle' ? x - width / 2 : x - width;
  // Inter's ascent and descent (0.97 and 0.24 em): what a browser's getBBox gives for a line of it.
  return { x: left, y: y - sizePx * 0.97, width, height: sizePx * 1.21 };
}

/** The strokes and labels of a drawing, and the parts' worst verdicts that the labels show. */
export class Sheet {
  readonly strokes: SchematicStroke[] = [];
  readonly labels: SchematicLabel[] = [];
  constructor(readonly checks: Map<string, PartCheck>) {}

  add(strokes: SchematicStroke | SchematicStroke[]): void {
    this.strokes.push(...(Array.isArray(strokes) ? strokes : [strokes]));
  }

  text(
    text: string,
    x: number,
    y: number,
    anchor: SchematicLabel['anchor'],
    role: SchematicLabel['role'],
    partId?: string,
    verdict?: PartCheck['verdict'],
  ): void {
    const isBold = role === 'part' || role === 'title';
    this.labels.push({
      text,
      x,
      y,
      anchor,
      sizePx: LABEL_SIZE_PX,
      isBold,
      role,
      ...(partId ? { partId } : {}),
      ...(verdict ? { verdict } : {}),
      box: labelBox(text, x, y, anchor, LABEL_SIZE_PX, isBold),
    });
  }

  /**
   * A part's label block: its name (and value), further lines, then its worst verdict, `LINE_PX` apart; the first
   * baseline at `y` (`direction` 1, below a part) or the last one at `y` (−1, above a part).
   */
  block(
    partId: string,
    lines: string[],
    x: number,
    y: number,
    anchor: SchematicLabel['anchor'],
    direction: 1 | -1 = 1,
  ): void {
    const check = this.checks.get(partId);
    const all: { text: string; role: SchematicLabel['role'] }[] = [
      { text: lines[0] ?? partId, role: 'part' },
      ...lines.slice(1).map((text) => ({ text, role: 'value' as const })),
      ...(check ? [{ text: `${verdictGlyph[check.verdict]} ${check.text}`, role: 'verdict' as const }] : []),
    ];
    // Read from the top: the first line at `y` going down, or the last line at `y` going up.
    const firstY = direction === 1 ? y : y - (all.length - 1) * LINE_PX;
    all.forEach((line, i) => {
      const verdict = line.role === 'verdict' ? check?.verdict : undefined;
      this.text(line.text, x, firstY + i * LINE_PX, anchor, line.role, partId, verdict);
    });
  }
}

const verdictGlyph = { pass: '✓', marginal: '!', fail: '✗' } as const;

/** A quantity as the drawing writes it: three significant figures with its unit. */
export const fq = (value: number, unit: Parameters<typeof formatQuantity>[1]) => formatQuantity(value, unit, 3);
