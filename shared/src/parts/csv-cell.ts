/**
 * A cell a spreadsheet may run as a formula: one that starts, after any spaces, with = + - or @ (or their
 * full-width forms ＝ ＋ － ＠, which some spreadsheets fold to ASCII), or with a tab or CR.
 */
const FORMULA_START = /^[\t\r]|^\s*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20]/u;
/** A formula start right after a separator that other locales split on (`;`, tab); commas are quoted anyway. */
const FORMULA_AFTER_SEPARATOR = /([;\t]\s*)(?=[=+\-@\uFF1D\uFF0B\uFF0D\uFF20])/gu;

/**
 * Makes a value safe to open in a spreadsheet (OWASP "CSV Injection", common practice): a cell that starts
 * as a formula is prefixed with ' so that it is read as text; so is every formula start that follows a
 * separator inside the cell (`x;=…` becomes `x;'=…`), since a spreadsheet set to split on ; would make it a
 * cell of its own.
 */
export function neutraliseCsvCell(value: string | number | null): string {
  if (value === null) return '';
  const text = String(value).replace(FORMULA_AFTER_SEPARATOR, "$1'");
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Whether to quote a cell beyond RFC 4180's needs: one holding ; or a tab stays one cell in every locale. */
export function csvCellNeedsQuotes(value: unknown): boolean {
  return typeof value === 'string' && /[;\t]/.test(value);
}
