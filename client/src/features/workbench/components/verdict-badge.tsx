import { Badge, type BadgeProps } from '@mantine/core';
import type { CheckVerdict } from '@ladderwright/shared/safety';

const verdictColors: Record<CheckVerdict['verdict'], string> = { pass: 'verdigris', marginal: 'ember', fail: 'red' };
const verdictMarks: Record<CheckVerdict['verdict'], string> = { pass: '✓', marginal: '!', fail: '✕' };

/** Signed margin in percent, one decimal: "+23.5 %", "−4.0 %". */
export function formatMarginPct(marginPct: number): string {
  if (!Number.isFinite(marginPct)) return marginPct > 0 ? '+∞ %' : '−∞ %';
  const sign = marginPct > 0 ? '+' : marginPct < 0 ? '−' : '±';
  return `${sign}${Math.abs(marginPct).toFixed(1)} %`;
}

export interface VerdictBadgeProps extends Partial<Pick<CheckVerdict, 'marginPct'>> {
  verdict: CheckVerdict['verdict'];
  /** The margin in words (describeMargin), shown instead of the signed percentage. */
  margin?: string;
  size?: BadgeProps['size'];
}

/** A verdict as word, mark and margin; the colour only repeats what the text says. */
export function VerdictBadge({ verdict, marginPct, margin, size }: VerdictBadgeProps) {
  const number = margin ?? (marginPct === undefined ? '' : formatMarginPct(marginPct));
  return (
    <Badge
      color={verdictColors[verdict]}
      variant="light"
      radius="sm"
      tt="none"
      size={size}
      leftSection={verdictMarks[verdict]}
      styles={{
        root: { maxWidth: '100%', height: 'auto', minHeight: 'var(--badge-height)', overflow: 'visible' },
        label: { overflow: 'visible', whiteSpace: 'normal', lineHeight: 1.25 },
      }}
    >
      {verdict}
      {number ? ` · ${number}` : ''}
    </Badge>
  );
}
