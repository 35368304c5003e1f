import { join } from 'node:path';
import type PDFDocument from 'pdfkit';
import { formatQuantity } from '@ladderwright/shared/units';

/** The pdfkit document every section draws on. */
export type Doc = InstanceType<typeof PDFDocument>;

/** pdfkit embeds the .woff files; the .woff2 ones crash at doc.end() (STACK.md). */
const FONT_DIR = join(require.resolve('@fontsource/inter/package.json'), '..', 'files');
export const FONT_FILES = {
  regular: join(FONT_DIR, 'inter-latin-400-normal.woff'),
  semibold: join(FONT_DIR, 'inter-latin-600-normal.woff'),
  bold: join(FONT_DIR, 'inter-latin-700-normal.woff'),
} as const;

export const INK = '#1d2733';
export const MUTED = '#5b6775';
export const RULE = '#c9d1da';
export const ACCENT = '#1f5f8b';
export const WARN = '#b3261e';
export const PAGE_WIDTH = 595;
export const PAGE_HEIGHT = 842;
export const MARGIN = 48;
export const TEXT_WIDTH = PAGE_WIDTH - 2 * MARGIN;
export const PAGE_BOTTOM = PAGE_HEIGHT - 64;

/** The Inter latin subset has no Ω, ≤ or ≥: spell them so no glyph is lost. */
export function printable(text: string): string {
  return text.replace(/Ω/g, 'ohm').replace(/≤/g, '<=').replace(/≥/g, '>=');
}

/** A quantity in engineering notation, or a dash when there is none. */
export function q(value: number | null | undefined, unit: Parameters<typeof formatQuantity>[1], figures = 3): string {
  return value === null || value === undefined || !Number.isFinite(value)
    ? '—'
    : printable(formatQuantity(value, unit, figures));
}

export function pct(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : `${value.toFixed(0)} %`;
}

/** The one date format of the product: `2026-12-04 21:30 UTC`. */
export function date(iso: string | Date): string {
  return (typeof iso === 'string' ? iso : iso.toISOString()).slice(0, 16).replace('T', ' ') + ' UTC';
}

export function ensureRoom(doc: Doc, height: number): void {
  if (doc.y + height > PAGE_BOTTOM) doc.addPage();
}

export function heading(doc: Doc, text: string): void {
  ensureRoom(doc, 60);
  doc.moveDown(0.8).font('semibold').fontSize(12).fillColor(ACCENT).text(text, MARGIN);
  const y = doc.y + 2;
  doc
    .moveTo(MARGIN, y)
    .lineTo(PAGE_WIDTH - MARGIN, y)
    .lineWidth(0.6)
    .strokeColor(RULE)
    .stroke();
  doc.y = y + 6;
  doc.font('regular').fontSize(9).fillColor(INK);
}

/** A small muted paragraph across the text width. */
export function note(doc: Doc, text: string, colour = MUTED): void {
  doc.font('regular').fontSize(8).fillColor(colour).text(printable(text), MARGIN, doc.y, { width: TEXT_WIDTH });
  doc.fontSize(9).fillColor(INK);
}

export interface Column {
  title: string;
  width: number;
}

/** The text cut with an ellipsis to fit the width at the current font (pdfkit's own ellipsis still wraps words). */
export function fitted(doc: Doc, text: string, width: number): string {
  if (doc.widthOfString(text) <= width) return text;
  let end = text.length;
  while (end > 1 && doc.widthOfString(`${text.slice(0, end).trimEnd()}…`) > width) end -= 1;
  return `${text.slice(0, end).trimEnd()}…`;
}

/** The most lines a table cell wraps to; a longer text is cut with an ellipsis on the last one. */
const MAX_CELL_LINES = 3;

/** A cell's text wrapped at word boundaries to the width, at most MAX_CELL_LINES lines (the last cut to fit). */
export function wrappedLines(doc: Doc, text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/).filter((w) => w.length > 0)) {
    const candidate = line ? `${line} ${word}` : word;
    if (!line || doc.widthOfString(candidate) <= width) line = candidate;
    else {
      lines.push(line);
      line = word;
    }
  }
  if (line) lines.push(line);
  if (lines.length > MAX_CELL_LINES) {
    const kept = lines.slice(0, MAX_CELL_LINES);
    kept[MAX_CELL_LINES - 1] = fitted(
      doc,
      `${kept[MAX_CELL_LINES - 1]} ${lines.slice(MAX_CELL_LINES).join(' ')}`,
      width,
    );
    return kept.map((l) => fitted(doc, l, width));
  }
  return lines.map((l) => fitted(doc, l, width));
}

/**
 * A table with fixed column widths; a long cell wraps (up to three lines) and its row grows to hold it. Repeats
 * the header after a page break.
 */
export function table(doc: Doc, columns: Column[], rows: string[][]): void {
  const rowHeight = 15;
  const lineHeight = 10.5;
  const drawHeader = () => {
    let x = MARGIN;
    const top = doc.y;
    doc.font('semibold').fontSize(8).fillColor(MUTED);
    for (const column of columns) {
      doc.text(fitted(doc, column.title, column.width - 4), x + 2, top, { width: column.width - 4, lineBreak: false });
      x += column.width;
    }
    doc.y = top + rowHeight - 2;
    doc.font('regular').fontSize(8.5).fillColor(INK);
  };
  ensureRoom(doc, rowHeight * 3);
  drawHeader();
  rows.forEach((row, index) => {
    const cells = row.map((cell, i) => wrappedLines(doc, printable(cell), (columns[i]?.width ?? 60) - 4));
    const lineCount = Math.max(1, ...cells.map((lines) => lines.length));
    const height = rowHeight + (lineCount - 1) * lineHeight;
    if (doc.y + height > PAGE_BOTTOM) {
      doc.addPage();
      drawHeader();
    }
    const top = doc.y;
    if (index % 2 === 0)
      doc
        .rect(MARGIN, top - 3, TEXT_WIDTH, height)
        .fill('#f1f4f7')
        .fillColor(INK);
    let x = MARGIN;
    cells.forEach((lines, i) => {
      const width = columns[i]?.width ?? 60;
      lines.forEach((line, k) => doc.text(line, x + 2, top + k * lineHeight, { width: width - 4, lineBreak: false }));
      x += width;
    });
    doc.y = top + height;
  });
  doc.x = MARGIN;
}

/** Label and value pairs in two columns; a long value wraps in its own column. */
export function keyValues(doc: Doc, pairs: [string, string][], labelWidth = 190): void {
  for (const [label, value] of pairs) {
    ensureRoom(doc, 14);
    const top = doc.y;
    doc
      .font('regular')
      .fontSize(9)
      .fillColor(MUTED)
      .text(printable(label), MARGIN, top, { width: labelWidth - 8 });
    const afterLabel = doc.y;
    doc.fillColor(INK).text(printable(value), MARGIN + labelWidth, top, { width: TEXT_WIDTH - labelWidth });
    doc.y = Math.max(afterLabel, doc.y) + 2;
  }
  doc.x = MARGIN;
}
