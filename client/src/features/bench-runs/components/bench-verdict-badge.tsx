import { Badge } from '@mantine/core';
import type { BenchVerdict } from '@ladderwright/shared/bench';

// The colours and marks of the Checks' verdicts, so a bench verdict reads as the same kind of thing.
const COLOURS: Record<BenchVerdict, string> = { pass: 'verdigris', marginal: 'ember', fail: 'red' };
const MARKS: Record<BenchVerdict, string> = { pass: '✓', marginal: '!', fail: '✕' };

/** The verdict as a word and its margin as a number, so it reads without colour. */
export function BenchVerdictBadge({ verdict, marginPct }: { verdict: BenchVerdict; marginPct: number }) {
  return (
    <Badge
      color={COLOURS[verdict]}
      variant="light"
      radius="sm"
      tt="none"
      leftSection={MARKS[verdict]}
      aria-label={`${verdict}, margin ${marginPct.toFixed(1)} %`}
    >
      {verdict} · margin {marginPct.toFixed(1)} %
    </Badge>
  );
}
