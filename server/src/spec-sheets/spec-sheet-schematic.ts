import type PDFDocument from 'pdfkit';
import { layoutSchematic, type PartVerdict, type SchematicLayout } from '@ladderwright/shared/schematic';
import type { SpecSheetContent } from './spec-sheet.types';

type Doc = InstanceType<typeof PDFDocument>;

const INK = '#1d2733';
const MUTED = '#5b6775';
const VERDICT_INK: Readonly<Record<PartVerdict, string>> = { pass: '#1e6b52', marginal: '#a8570f', fail: '#b3261e' };
const LINE_WIDTH = { wire: 0.7, part: 0.8, plate: 1.5, fill: 0 } as const;
/**
 * The smallest scale at which the drawing's labels (11 px) still read on paper, about 7 pt; a wider drawing is cut
 * into bands read left to right, one under another, each overlapping the previous by BAND_OVERLAP drawing units.
 */
export const SCHEMATIC_MIN_SCALE = 0.62;
const BAND_OVERLAP = 40;
const BAND_GAP = 14;

/** The Inter latin subset has no Ω, ✓ or ✗: spell Ω, and let the verdict word stand for its mark. */
function printable(text: string): string {
  return text.replace(/Ω/g, 'ohm').replace(/^[✓✗] /, '');
}

function drawLayout(doc: Doc, layout: SchematicLayout): void {
  for (const stroke of layout.strokes) {
    doc.path(stroke.d);
    if (stroke.style === 'fill') doc.fillColor(INK).fill();
    else doc.lineWidth(LINE_WIDTH[stroke.style]).strokeColor(INK).lineCap('round').lineJoin('round').stroke();
  }
  for (const label of layout.labels) {
    const text = printable(label.text);
    doc.font(label.isBold ? 'semibold' : 'regular').fontSize(label.sizePx);
    const textWidth = doc.widthOfString(text);
    const x =
      label.anchor === 'start' ? label.x : label.anchor === 'middle' ? label.x - textWidth / 2 : label.x - textWidth;
    // pdfkit places text by its top; the layout gives the baseline.
    doc
      .fillColor(label.verdict ? VERDICT_INK[label.verdict] : INK)
      .text(text, x, label.y - label.sizePx * 0.97, { lineBreak: false });
  }
}

/**
 * The horizontal ranges (drawing units) of the bands a drawing of this width is cut into at this scale: as few as
 * fit, spread evenly, each overlapping the next by at least BAND_OVERLAP.
 */
export function schematicBands(layoutWidth: number, width: number, scale: number): { from: number; to: number }[] {
  const span = width / scale;
  if (layoutWidth <= span) return [{ from: 0, to: layoutWidth }];
  const count = Math.ceil((layoutWidth - BAND_OVERLAP) / (span - BAND_OVERLAP));
  const step = (layoutWidth - span) / (count - 1);
  return Array.from({ length: count }, (_, k) => ({ from: k * step, to: k * step + span }));
}

/**
 * The Workbench's schematic of the whole circuit (the shared layout) drawn in vector: the same strokes and labels,
 * scaled to the text width but never below SCHEMATIC_MIN_SCALE; a longer ladder continues in bands below, each
 * on a new page when it does not fit.
 */
export function schematicSection(doc: Doc, c: SpecSheetContent, left: number, width: number, pageBottom: number): void {
  const layout = layoutSchematic(c.document, c.report);
  const scale = Math.max(SCHEMATIC_MIN_SCALE, Math.min(1, width / layout.width));
  const bands = schematicBands(layout.width, width, scale);
  const bandHeight = layout.height * scale;
  if (doc.y + bandHeight + 40 > pageBottom) doc.addPage();
  doc.moveDown(0.8).font('semibold').fontSize(12).fillColor('#1f5f8b').text('Schematic', left);
  let top = doc.y + 6;
  bands.forEach((band, index) => {
    if (index > 0 && top + bandHeight > pageBottom) {
      doc.addPage();
      top = doc.y;
    }
    if (bands.length > 1) {
      doc
        .font('regular')
        .fontSize(7)
        .fillColor(MUTED)
        .text(
          `Part ${index + 1} of ${bands.length}${index > 0 ? ', continued from the right of the part above' : ''}`,
          left,
          top,
          {
            lineBreak: false,
          },
        );
      top += 10;
    }
    doc.save();
    doc.rect(left, top, (band.to - band.from) * scale, bandHeight).clip();
    doc.translate(left - band.from * scale, top).scale(scale);
    drawLayout(doc, layout);
    doc.restore();
    top += bandHeight + BAND_GAP;
  });
  doc.y = top - BAND_GAP + 4;
  doc
    .font('regular')
    .fontSize(7.5)
    .fillColor(MUTED)
    .text(
      'Node voltages are cycle means to the 0 V return; each part carries its worst check (pass, marginal or fail) with its margin.',
      left,
      doc.y,
      { width },
    );
  doc.fillColor(INK).fontSize(9);
}
