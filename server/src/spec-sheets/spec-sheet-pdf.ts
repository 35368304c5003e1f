import PDFDocument from 'pdfkit';
import { checksSection } from './spec-sheet-checks';
import { bomSection } from './spec-sheet-bom';
import { benchRunsSection } from './spec-sheet-bench-runs';
import { performanceSection, titleBlock, windingSection } from './spec-sheet-front';
import {
  type Doc,
  FONT_FILES,
  MARGIN,
  MUTED,
  PAGE_BOTTOM,
  PAGE_HEIGHT,
  PAGE_WIDTH,
  printable,
  TEXT_WIDTH,
  WARN,
} from './spec-sheet-layout';
import { outputVsLoadPlot } from './spec-sheet-plot';
import { safetySection } from './spec-sheet-safety';
import { schematicSection } from './spec-sheet-schematic';
import type { SpecSheetContent } from './spec-sheet.types';

/** Marks and footers on every page, drawn last over the buffered pages. */
function decoratePages(doc: Doc, c: SpecSheetContent): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const previousBottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    if (!c.isReleased) {
      doc.save();
      doc.rotate(-35, { origin: [PAGE_WIDTH / 2, PAGE_HEIGHT / 2] });
      doc
        .font('bold')
        .fontSize(64)
        .fillColor(WARN)
        .fillOpacity(0.14)
        .text('NOT RELEASED', 40, 390, { width: 515, align: 'center', lineBreak: false });
      doc.restore();
      doc.save();
      doc.rect(0, 0, PAGE_WIDTH, 18).fill(WARN);
      doc
        .font('bold')
        .fontSize(8.5)
        .fillColor('#ffffff')
        .text(`NOT RELEASED: ${c.state} revision, not for manufacture`, 0, 5, {
          width: PAGE_WIDTH,
          align: 'center',
          lineBreak: false,
        });
      doc.restore();
    }
    doc.font('regular').fontSize(7).fillColor(MUTED).fillOpacity(1);
    doc.text(
      printable(
        `${c.designName} · revision ${c.revisionNumber} (${c.state}) · page ${i - range.start + 1} of ${range.count} · High voltage can kill: the standard, local codes and licensed practice govern.`,
      ),
      MARGIN,
      PAGE_HEIGHT - 36,
      { width: TEXT_WIDTH, align: 'center', lineBreak: false },
    );
    doc.page.margins.bottom = previousBottom;
  }
}

/** Which Checks rest on the stored simulation's figures, when one is current. */
function checksNote(c: SpecSheetContent): string | null {
  if (c.headline.source === 'estimate')
    return 'Every check rests on the estimate (no current full simulation of this revision).';
  return c.headline.simulatedKeys.includes('discharge')
    ? 'The discharge-time check rests on the simulated discharge; the others on the estimate.'
    : 'Every check rests on the estimate; the simulation gives no figure that a check tests.';
}

/** Renders the supplier spec sheet (A4 PDF, Inter embedded, vector plot). */
export async function renderSpecSheetPdf(c: SpecSheetContent): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: 56, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: {
      Title: `Spec sheet: ${c.designName}, revision ${c.revisionNumber}`,
      Author: 'Ladderwright',
      Subject: c.isReleased ? 'Released revision' : 'NOT RELEASED',
    },
  });
  for (const [name, file] of Object.entries(FONT_FILES)) doc.registerFont(name, file);
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.font('regular');
  titleBlock(doc, c);
  windingSection(doc, c);
  bomSection(doc, c);
  performanceSection(doc, c);
  schematicSection(doc, c, MARGIN, TEXT_WIDTH, PAGE_BOTTOM);
  outputVsLoadPlot(doc, c);
  benchRunsSection(doc, c);
  checksSection(doc, c.headline.report.checks, checksNote(c));
  safetySection(doc, c);
  decoratePages(doc, c);
  doc.end();
  return done;
}
