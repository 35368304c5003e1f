import { readFileSync } from 'node:fs';
import { DomainError } from '../../src/errors';
import { validateDesign } from '../../src/designs/validate-design';
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
  let parsed: unknown;
  try {
    parsed = JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    throw new DomainError('invalid_design', `cannot read ${path} as JSON: ${(error as Error).message}`, 'DESIGN.json');
  }
  const report = analyzeDesign(validateDesign(parsed));
  return flags.has('text') ? reportAsText(report) : JSON.stringify(report, null, 2);
}
