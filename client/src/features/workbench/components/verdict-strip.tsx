import { memo } from 'react';
import { Group, Paper, Text } from '@mantine/core';
import type { Design } from '@ladderwright/shared/designs';
import { simulationSourceLabel, type DesignReport, type HeadlineSource } from '@ladderwright/shared/analysis';
import { verdictStripFigures, type StripFigure } from '../verdict-strip-figures';
import { MethodNote } from './method-note';
import { VerdictBadge } from './verdict-badge';
import classes from './verdict-strip.module.css';

export interface VerdictStripProps {
  report: DesignReport;
  targets: Design['targets'];
  /** A current stored simulation of the revision shown: its figures stand for the estimate's. */
  headline?: HeadlineSource | null;
}

/**
 * The Verdict strip: the eight figures an engineer watches while editing (output, ripple, droop, driver
 * efficiency, battery life, stored energy, discharge time, worst check), each with its target and a verdict
 * in words and a number, and where each comes from (the revision's stored simulation or the estimate). It stays in
 * view beside or above the form.
 */
export const VerdictStrip = memo(function VerdictStrip({ report, targets, headline = null }: VerdictStripProps) {
  return (
    <div className={classes.strip} aria-label="Verdict strip" role="list">
      {verdictStripFigures(report, targets, headline).map((figure) => (
        <FigureCell
          key={figure.key}
          figure={figure}
          simulationLabel={headline?.source === 'simulation' ? simulationSourceLabel(headline) : null}
        />
      ))}
    </div>
  );
});

function sameMethod(a: StripFigure['method'], b: StripFigure['method']): boolean {
  if (a === b) return true;
  if (!a || !b) return false;
  return (
    a.methodId === b.methodId &&
    a.summary === b.summary &&
    a.source === b.source &&
    a.assumptions.length === b.assumptions.length &&
    a.assumptions.every((assumption, i) => assumption === b.assumptions[i])
  );
}

/** True when two figures read the same: a new report that leaves a figure as it was does not render its cell. */
function sameFigure(a: StripFigure, b: StripFigure): boolean {
  return (
    a.key === b.key &&
    a.label === b.label &&
    a.value === b.value &&
    a.target === b.target &&
    a.verdict === b.verdict &&
    a.margin === b.margin &&
    a.source === b.source &&
    a.difference?.text === b.difference?.text &&
    a.difference?.exceedsTolerance === b.difference?.exceedsTolerance &&
    sameMethod(a.method, b.method)
  );
}

/**
 * `simulationLabel`: some figures come from the stored simulation, so each one says where it comes from
 * ("from simulation", with "not settled within …" when the run did not settle); null when none does.
 */
const FigureCell = memo(
  function FigureCell({ figure, simulationLabel }: { figure: StripFigure; simulationLabel: string | null }) {
    return (
      <Paper
        withBorder
        p={8}
        role="listitem"
        aria-label={figure.label}
        data-figure={figure.key}
        data-verdict={figure.verdict ?? 'none'}
        data-source={figure.source ?? 'none'}
      >
        <Group justify="space-between" gap={2} wrap="nowrap">
          <Text size="xs" c="dimmed" fw={500} lh={1.2}>
            {figure.label}
          </Text>
          <MethodNote subject={figure.label.toLowerCase()} method={figure.method} />
        </Group>
        <Text
          fz={figure.key === 'worst' ? 'sm' : 'md'}
          fw={700}
          lh={1.3}
          data-value
          className={classes.value}
          lineClamp={figure.key === 'worst' ? undefined : 1}
          title={figure.value}
        >
          {figure.value}
        </Text>
        <Text size="xs" c="dimmed" lh={1.25} lineClamp={2} title={figure.target} data-figure-target>
          {targetLine(figure)}
        </Text>
        {figure.verdict && (
          <Group gap={4} mt={2} wrap="wrap">
            <VerdictBadge verdict={figure.verdict} margin={figure.margin ?? undefined} size="sm" />
          </Group>
        )}
        {simulationLabel !== null && figure.source && (
          <Text
            fz={11}
            c={figure.source === 'simulation' ? 'verdigris.8' : 'dimmed'}
            fw={figure.source === 'simulation' ? 600 : 400}
            lh={1.3}
            mt={2}
            data-figure-source={figure.source}
          >
            {figure.source === 'simulation' ? simulationLabel : 'estimate'}
          </Text>
        )}
        {figure.difference && (figure.difference.exceedsTolerance || figure.source === 'simulation') && (
          <Text
            fz={11}
            lh={1.25}
            c={figure.difference.exceedsTolerance ? 'ember.8' : 'dimmed'}
            data-figure-difference={figure.difference.exceedsTolerance ? 'beyond' : 'within'}
          >
            {figure.difference.text}
          </Text>
        )}
      </Paper>
    );
  },
  (previous, next) => previous.simulationLabel === next.simulationLabel && sameFigure(previous.figure, next.figure),
);

/** "target ≤ 20 V" for a figure with a target; a phrase that says there is none ("no target set") as it is. */
function targetLine(figure: StripFigure): string {
  return figure.key === 'worst' || figure.target.startsWith('no ') ? figure.target : `target ${figure.target}`;
}
