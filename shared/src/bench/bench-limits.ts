import type { FieldIssue } from '../errors';

/**
 * Limits of one bench data file, from the domain: a load sweep has tens of points and a scope capture a
 * record of up to some ten thousand samples, so 20,000 data rows leave room; a data line carries a few
 * numbers. Common practice, no source.
 */
export const benchLimits = {
  maxDataRows: 20_000,
  maxLineLength: 1_000,
} as const;

/**
 * The first way a bench data file's text exceeds the limits (too many lines, or a line too long), as an
 * issue on `data`, or null. One pass over the text, before any CSV parsing allocates rows and cells.
 */
export function benchTextIssue(text: string, headerAllowance = 50): FieldIssue | null {
  const maxLines = benchLimits.maxDataRows + headerAllowance;
  let lines = 1;
  let lineStart = 0;
  for (let i = 0; i <= text.length; i += 1) {
    if (i < text.length && text.charCodeAt(i) !== 10) continue;
    if (i - lineStart > benchLimits.maxLineLength) {
      return { path: 'data', message: `line ${lines} is longer than ${benchLimits.maxLineLength} characters` };
    }
    lineStart = i + 1;
    if (i < text.length) lines += 1;
    if (lines > maxLines) {
      return {
        path: 'data',
        message: `the file has more than ${maxLines} lines; a data file holds at most ${benchLimits.maxDataRows} data rows`,
      };
    }
  }
  return null;
}
