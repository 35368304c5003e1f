import { Badge } from '@mantine/core';
import type { CheckVerdict } from '@ladderwright/shared/safety';

const verdictColors: Record<CheckVerdict['verdict'], string> = { pass: 'verdigris', marginal: 'ember', fail: 'red' };
const verdictMarks: Record<CheckVerdict['verdict'], string> = { pass: '✓', marginal: '!', fail: '✕' };

/** Signed margin in percent, one decimal: "+23.5 %", "−4.0 %". */
export function formatMarginPct(marginPct: number): string {
  if (!Number.isFinite(marginPct)) return marginPct > 0 ? '+∞ %' : '−∞ %';
  const sign = marginPct > 0 ? '+' : marginPct < 0 ? '−' : '±';
  return `${sign}${Math.abs(marginPct).toFixed(1)} %`;
}

/** A verdict as word, mark and margin; the colour only repeats what the text says. */
export function VerdictBadge({ verdict, marginPct }: Pick<CheckVerdict, 'verdict' | 'marginPct'>) {
  return (
    <Badge
      color={verdictColors[verdict]}
      variant="light"
      radius="sm"
      tt="none"
      leftSection={verdictMarks[verdict]}
      styles={{ root: { maxWidth: 'none', overflow: 'visible' }, label: { overflow: 'visible' } }}
    >
      {verdict} {formatMarginPct(marginPct)}
    </Badge>
  );
}
