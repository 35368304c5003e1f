import { readDesignFile } from '../design-file';
import { DomainError } from '../../src/errors';
import { analyzeDesign } from '../../src/analysis/analyze-design';
import { parseArguments } from '../ladder-flags';
import { reportAsText } from '../report-text';

export const analyzeHelp =
  'analyze DESIGN.json [--text]     full report of a design document (JSON, or a table with --text)';

/** `ladderwright analyze DESIGN.json [--text]`. */
export function analyzeCommand(argv: ReadonlyArray<string>): string {
  const { positional, flags } = parseArguments(argv);
  const path = positional[0];
  if (!path) throw new DomainError('invalid_argument', 'a design file is required', 'DESIGN.json');
  const report = analyzeDesign(readDesignFile(path));
  return flags.has('text') ? reportAsText(report) : JSON.stringify(report, null, 2);
}
