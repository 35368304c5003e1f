import { readDesignFile } from '../design-file';
import { DomainError } from '../../src/errors';
import { analyzeDesign } from '../../src/analysis/analyze-design';
import { parseCommandArguments, type CommandSyntax } from '../arguments';
import { TEXT_OPTION } from '../ladder-flags';
import { reportAsText } from '../report-text';

export const analyzeSyntax: CommandSyntax = { command: 'analyze', options: TEXT_OPTION, positionals: ['DESIGN.json'] };
export const analyzeSummary = 'full report of a design document (JSON, or a table with --text)';

/** `ladderwright analyze DESIGN.json [--text]`. */
export function analyzeCommand(argv: ReadonlyArray<string>): string {
  const { positional, flags } = parseCommandArguments(argv, analyzeSyntax);
  const path = positional[0];
  if (!path) throw new DomainError('invalid_argument', 'a design file is required', 'DESIGN.json');
  const report = analyzeDesign(readDesignFile(path));
  if (flags.has('text')) return reportAsText(report);
  // A driver design also carries the estimate under the names `simulate` gives its measured figures.
  return JSON.stringify(report.driver ? { ...report.driver.benchFigures, ...report } : report, null, 2);
}
