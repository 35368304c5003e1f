import { analyzeLadderReport } from '../../src/analysis/analyze-design';
import { parseCommandArguments, type CommandSyntax } from '../arguments';
import { LADDER_OPTIONS, ladderInputFromFlags, TEXT_OPTION } from '../ladder-flags';
import { reportAsText } from '../report-text';

export const ladderSyntax: CommandSyntax = {
  command: 'ladder',
  options: { ...LADDER_OPTIONS, ...TEXT_OPTION },
  positionals: [],
};
export const ladderSummary = 'report of a bare ladder given by its options';

/** `ladderwright ladder ...`: report of a bare ladder from flags. */
export function ladderCommand(argv: ReadonlyArray<string>): string {
  const { flags } = parseCommandArguments(argv, ladderSyntax);
  const { input, safeVoltageV } = ladderInputFromFlags(flags);
  const report = analyzeLadderReport(input, safeVoltageV === undefined ? {} : { safeVoltageV });
  return flags.has('text') ? reportAsText(report) : JSON.stringify(report, null, 2);
}
