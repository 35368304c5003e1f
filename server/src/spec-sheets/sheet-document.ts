import PDFDocument from 'pdfkit';
import {
  type Doc,
  FONT_FILES,
  MARGIN,
  MUTED,
  PAGE_HEIGHT,
  PAGE_WIDTH,
  printable,
  TEXT_WIDTH,
  WARN,
} from './spec-sheet-layout';

/** An A4 sheet with Inter embedded and its pages buffered, and the bytes once `doc.end()` is called. */
export function openSheetDocument(title: string, isReleased: boolean): { doc: Doc; done: Promise<Buffer> } {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: 56, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: { Title: title, Author: 'Ladderwright', Subject: isReleased ? 'Released revision' : 'NOT RELEASED' },
  });
  for (const [name, file] of Object.entries(FONT_FILES)) doc.registerFont(name, file);
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.font('regular');
  return { doc, done };
}

export interface PageMarks {
  isReleased: boolean;
  /** The banner across the top of every page of an unreleased revision. */
  banner: string;
  /** The footer of page `page` (1-based) of `count`. */
  footer: (page: number, count: number) => string;
}

/** Drawn last over the buffered pages: "NOT RELEASED" and its banner on an unreleased revision, and the footer. */
export function markSheetPages(doc: Doc, marks: PageMarks): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const previousBottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    if (!marks.isReleased) {
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
        .text(marks.banner, 0, 5, { width: PAGE_WIDTH, align: 'center', lineBreak: false });
      doc.restore();
    }
    doc.font('regular').fontSize(7).fillColor(MUTED).fillOpacity(1);
    doc.text(printable(marks.footer(i - range.start + 1, range.count)), MARGIN, PAGE_HEIGHT - 36, {
      width: TEXT_WIDTH,
      align: 'center',
      lineBreak: false,
    });
    doc.page.margins.bottom = previousBottom;
  }
}
