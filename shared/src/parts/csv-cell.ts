const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Makes a value safe to open in a spreadsheet: a cell that starts with = + - @ tab or CR is prefixed
 * with ' so that it is read as text, not run as a formula (OWASP "CSV Injection", common practice).
 */
export function neutraliseCsvCell(value: string | number | null): string {
  if (value === null) return '';
  const text = String(value);
  return FORMULA_START.test(text) ? `'${text}` : text;
}
