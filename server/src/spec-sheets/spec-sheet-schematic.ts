import type PDFDocument from 'pdfkit';
import { layoutSchematic, type PartVerdict } from '@ladderwright/shared/schematic';
import type { SpecSheetContent } from './spec-sheet.types';

type Doc = InstanceType<typeof PDFDocument>;

const INK = '#1d2733';
const MUTED = '#5b6775';
const VERDICT_INK: Readonly<Record<PartVerdict, string>> = { pass: '#1e6b52', marginal: '#a8570f', fail: '#b3261e' };
const LINE_WIDTH = { wire: 0.7, part: 0.8, plate: 1.5, fill: 0 } as const;

/** The Inter latin subset has no Ω, ✓ or ✗: spell Ω, and let the verdict word stand for its mark. */
function printable(text: string): string {
  return text.replace(/Ω/g, 'ohm').replace(/^[✓✗] /, '');
}

/**
 * The Workbench's schematic of the whole circuit (the shared layout) drawn in vector on its own landscape-fit
 * block: the same strokes and labels, scaled to the text width, on a new page when it does not fit.
 */
export function schematicSection(doc: Doc, c: SpecSheetContent, left: number, width: number, pageBottom: number): void {
  const layout = layoutSchematic(c.document, c.report);
  const scale = Math.min(1, width / layout.width);
  const height = layout.height * scale;
  if (doc.y + height + 40 > pageBottom) doc.addPage();
  doc.moveDown(0.8).font('semibold').fontSize(12).fillColor('#1f5f8b').text('Schematic', left);
  const top = doc.y + 6;
  doc.save();
  doc.translate(left, top).scale(scale);
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
  doc.restore();
  doc.y = top + height + 4;
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
