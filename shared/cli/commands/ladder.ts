import { analyzeLadderReport } from '../../src/analysis/analyze-design';
import { ladderInputFromFlags, parseArguments } from '../ladder-flags';
import { reportAsText } from '../report-text';

export const ladderHelp = 'ladder --topology ... --peak V --freq F --cap C ...   analyse a bare ladder (flags below)';

/** `ladderwright ladder ...`: report of a bare ladder from flags. */
export function ladderCommand(argv: ReadonlyArray<string>): string {
  const { flags } = parseArguments(argv);
  const { input, safeVoltageV } = ladderInputFromFlags(flags);
  const report = analyzeLadderReport(input, safeVoltageV === undefined ? {} : { safeVoltageV });
  return flags.has('text') ? reportAsText(report) : JSON.stringify(report, null, 2);
}
