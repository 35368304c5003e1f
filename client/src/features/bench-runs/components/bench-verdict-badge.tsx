import { Badge } from '@mantine/core';
import type { BenchVerdict } from '@ladderwright/shared/bench';

const COLOURS: Record<BenchVerdict, string> = { pass: 'teal', marginal: 'yellow', fail: 'red' };

/** The verdict as a word and its margin as a number, so it reads without colour. */
export function BenchVerdictBadge({ verdict, marginPct }: { verdict: BenchVerdict; marginPct: number }) {
  return (
    <Badge color={COLOURS[verdict]} variant="light" aria-label={`${verdict}, margin ${marginPct.toFixed(1)} %`}>
      {verdict} · margin {marginPct.toFixed(1)} %
    </Badge>
  );
}
