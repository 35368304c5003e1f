import type { ReactNode } from 'react';
import { Group, Paper, SimpleGrid, Text } from '@mantine/core';
import type { Design } from '@ladderwright/shared/designs';
import type { DesignReport } from '@ladderwright/shared/analysis';
import type { MethodInfo } from '@ladderwright/shared/methods';
import { lowerLimitVerdict, upperLimitVerdict, type CheckVerdict } from '@ladderwright/shared/safety';
import { formatQuantity } from '@ladderwright/shared/units';
import { MethodNote } from './method-note';
import { VerdictBadge } from './verdict-badge';

export interface HeadlineFiguresProps {
  report: DesignReport;
  targets: Design['targets'];
}

interface Figure {
  key: string;
  label: string;
  value: string;
  target?: string;
  verdict?: CheckVerdict;
  method: MethodInfo | null;
}

/** The headline figures of a report, each against its target with a verdict (word and margin) where one is set. */
export function HeadlineFigures({ report, targets }: HeadlineFiguresProps) {
  const outputVerdict = lowerLimitVerdict({
    id: 'target-output',
    subject: 'output',
    rule: 'mean output at the operating load reaches the target magnitude',
    value: Math.abs(report.outputMeanV),
    limit: Math.abs(targets.outputV),
    unit: 'V',
  });
  const rippleVerdict = upperLimitVerdict({
    id: 'target-ripple',
    subject: 'ripple',
    rule: 'peak-to-peak ripple at the operating load stays below the target',
    value: report.ripplePeakToPeakV,
    limit: targets.rippleMaxV,
    unit: 'V',
  });
  const steady = report.analysis.method;
  const figures: Figure[] = [
    {
      key: 'output',
      label: 'Output (mean, loaded)',
      value: formatQuantity(report.outputMeanV, 'V'),
      target: formatQuantity(targets.outputV, 'V'),
      verdict: outputVerdict,
      method: steady,
    },
    {
      key: 'ripple',
      label: 'Ripple (peak-to-peak)',
      value: formatQuantity(report.ripplePeakToPeakV, 'V'),
      target: `≤ ${formatQuantity(targets.rippleMaxV, 'V')}`,
      verdict: rippleVerdict,
      method: steady,
    },
    { key: 'no-load', label: 'No-load output', value: formatQuantity(report.noLoadOutputV, 'V'), method: steady },
    { key: 'droop', label: 'Droop', value: formatQuantity(report.droopV, 'V'), method: steady },
    {
      key: 'impedance',
      label: 'Output impedance',
      value: formatQuantity(report.outputImpedanceOhm, 'Ohm'),
      method: steady,
    },
    {
      key: 'optimum',
      label: 'Optimum stage count',
      value: String(report.optimumStages),
      method: report.curves.method,
    },
    {
      key: 'textbook-ripple',
      label: 'Ripple, closed form',
      value: report.textbookRippleV === null ? 'n/a (unequal capacitors)' : formatQuantity(report.textbookRippleV, 'V'),
      method: report.analysis.textbook.method,
    },
    {
      key: 'energy',
      label: 'Stored energy',
      value: formatQuantity(report.storedEnergyJ, 'J'),
      method: null,
    },
  ];
  return (
    <SimpleGrid cols={{ base: 2, xl: 4 }} spacing="sm" aria-label="Headline figures" role="list">
      {figures.map((figure) => (
        <FigureCard key={figure.key} figure={figure} />
      ))}
    </SimpleGrid>
  );
}

function FigureCard({ figure }: { figure: Figure }): ReactNode {
  return (
    <Paper withBorder p="sm" role="listitem" aria-label={figure.label} data-figure={figure.key}>
      <Group justify="space-between" gap={4} wrap="nowrap">
        <Text size="xs" c="dimmed" fw={500}>
          {figure.label}
        </Text>
        <MethodNote subject={figure.label.toLowerCase()} method={figure.method} />
      </Group>
      <Text fz="xl" fw={700} lh={1.3} data-value>
        {figure.value}
      </Text>
      {figure.target && (
        <Group gap={6} mt={4} wrap="wrap">
          <Text size="xs" c="dimmed">
            target {figure.target}
          </Text>
          {figure.verdict && <VerdictBadge verdict={figure.verdict.verdict} marginPct={figure.verdict.marginPct} />}
        </Group>
      )}
    </Paper>
  );
}
