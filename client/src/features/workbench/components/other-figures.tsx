import { Group, Text } from '@mantine/core';
import type { DesignReport } from '@ladderwright/shared/analysis';
import type { MethodInfo } from '@ladderwright/shared/methods';
import { formatQuantity } from '@ladderwright/shared/units';
import { MethodNote } from './method-note';
import classes from './other-figures.module.css';

interface OtherFigure {
  label: string;
  value: string;
  method: MethodInfo | null;
}

/** The report's figures beside the Verdict strip's: no-load output, output impedance, optimum stages, closed-form ripple. */
export function OtherFigures({ report }: { report: DesignReport }) {
  const steady = report.analysis.method;
  const figures: OtherFigure[] = [
    { label: 'No-load output', value: formatQuantity(report.noLoadOutputV, 'V'), method: steady },
    { label: 'Output impedance', value: formatQuantity(report.outputImpedanceOhm, 'Ohm'), method: steady },
    { label: 'Optimum stage count', value: String(report.optimumStages), method: report.curves.method },
    {
      label: 'Ripple, closed form',
      value: report.textbookRippleV === null ? 'n/a (unequal capacitors)' : formatQuantity(report.textbookRippleV, 'V'),
      method: report.analysis.textbook.method,
    },
  ];
  return (
    <div className={classes.figures} aria-label="Other figures" role="list">
      {figures.map((figure) => (
        <div key={figure.label} role="listitem" aria-label={figure.label}>
          <Group gap={2} wrap="nowrap">
            <Text size="xs" c="dimmed">
              {figure.label}
            </Text>
            <MethodNote subject={figure.label.toLowerCase()} method={figure.method} />
          </Group>
          <Text size="sm" fw={600}>
            {figure.value}
          </Text>
        </div>
      ))}
    </div>
  );
}
