import type { TransformerSection, TransformerWinding } from '@ladderwright/shared/transformer';
import { type Doc, ensureRoom, INK, MARGIN, MUTED, printable, TEXT_WIDTH } from './spec-sheet-layout';

const COIL_HUMPS = 4;
const HUMP_HEIGHT = 11;
const PIN_RADIUS = 7;
const BLOCK_GAP = 22;

/** One winding's coil with its leads, pins, start dot and label, on the left or the right of the core. */
function drawWinding(doc: Doc, winding: TransformerWinding, side: 'left' | 'right', coreX: number, top: number): void {
  const toward = side === 'left' ? 1 : -1;
  const coilX = coreX - toward * 34;
  const pinX = coreX - toward * 96;
  const height = COIL_HUMPS * HUMP_HEIGHT;
  doc.lineWidth(1.1).strokeColor(INK);
  doc.moveTo(coilX, top);
  for (let i = 0; i < COIL_HUMPS; i++) {
    const y = top + i * HUMP_HEIGHT;
    const bulge = coilX + toward * 9;
    doc.bezierCurveTo(bulge, y, bulge, y + HUMP_HEIGHT, coilX, y + HUMP_HEIGHT);
  }
  doc.stroke();
  // Leads from the coil ends out to the pins.
  for (const [y, pin] of [
    [top, winding.startPin],
    [top + height, winding.endPin],
  ] as const) {
    doc
      .moveTo(coilX, y)
      .lineTo(pinX + toward * PIN_RADIUS, y)
      .stroke();
    doc.circle(pinX, y, PIN_RADIUS).lineWidth(0.9).stroke();
    doc
      .font('semibold')
      .fontSize(7.5)
      .fillColor(INK)
      .text(String(pin), pinX - PIN_RADIUS, y - 4, { width: 2 * PIN_RADIUS, align: 'center', lineBreak: false });
  }
  // The dot marks the start of the winding (its dotted end), beside the coil on the lead's side.
  doc
    .circle(coilX - toward * 6, top + 5, 2.4)
    .fill(INK)
    .fillColor(INK);
  const labelWidth = 118;
  const labelX = side === 'left' ? pinX - PIN_RADIUS - 6 - labelWidth : pinX + PIN_RADIUS + 6;
  const name = winding.name ?? winding.role;
  doc
    .font('semibold')
    .fontSize(8.5)
    .fillColor(INK)
    .text(printable(name), labelX, top + height / 2 - 14, {
      width: labelWidth,
      align: side === 'left' ? 'right' : 'left',
    });
  doc
    .font('regular')
    .fontSize(7.5)
    .fillColor(MUTED)
    .text(`${winding.turns} turns, ${winding.wire.code}`, labelX, doc.y, {
      width: labelWidth,
      align: side === 'left' ? 'right' : 'left',
    });
}

/**
 * The windings as a circuit drawing: the core between them, primary and feedback on the left, the secondary on
 * the right, each coil with its start (dot) and finish pins numbered as the bobbin is.
 */
export function windingDrawing(doc: Doc, section: TransformerSection): void {
  const left = section.windings.filter((w) => w.role !== 'secondary');
  const right = section.windings.filter((w) => w.role === 'secondary');
  const blockHeight = COIL_HUMPS * HUMP_HEIGHT + BLOCK_GAP;
  const height = Math.max(left.length, right.length) * blockHeight + 10;
  ensureRoom(doc, height + 30);
  const top = doc.y + 10;
  const coreX = MARGIN + TEXT_WIDTH / 2;
  doc
    .moveTo(coreX - 3, top - 6)
    .lineTo(coreX - 3, top + height - BLOCK_GAP + 6)
    .moveTo(coreX + 3, top - 6)
    .lineTo(coreX + 3, top + height - BLOCK_GAP + 6)
    .lineWidth(1.2)
    .strokeColor(INK)
    .stroke();
  left.forEach((winding, i) => drawWinding(doc, winding, 'left', coreX, top + i * blockHeight));
  right.forEach((winding, i) => drawWinding(doc, winding, 'right', coreX, top + i * blockHeight));
  doc.x = MARGIN;
  doc.y = top + height;
  doc
    .font('regular')
    .fontSize(8)
    .fillColor(MUTED)
    .text(
      'Dots mark the start of each winding. Wind every winding in the same direction, from its dotted (start) pin to its finish pin.',
      MARGIN,
      doc.y,
      { width: TEXT_WIDTH },
    );
  doc.fontSize(9).fillColor(INK);
}
