/**
 * Text copied from a spreadsheet as rows of cells: rows split on line breaks (CR LF, LF or CR), cells on tabs;
 * the line break a spreadsheet adds after the last row is dropped.
 */
export function splitPastedCells(text: string): string[][] {
  const rows = text.replace(/\r\n?/g, '\n').replace(/\n$/, '').split('\n');
  return rows.map((row) => row.split('\t'));
}

/** True when the text is more than one cell (a column, a row or a block), so it should fill cells, not one field. */
export function isCellBlock(text: string): boolean {
  const rows = splitPastedCells(text);
  return rows.length > 1 || (rows[0]?.length ?? 0) > 1;
}
