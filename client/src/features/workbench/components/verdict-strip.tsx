import { memo } from 'react';
import { Group, Paper, Text } from '@mantine/core';
import type { Design } from '@ladderwright/shared/designs';
import type { DesignReport, HeadlineSource } from '@ladderwright/shared/analysis';
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
        <FigureCell key={figure.key} figure={figure} hasSimulatedFigures={headline?.source === 'simulation'} />
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
    a.difference?.brief === b.difference?.brief &&
    a.difference?.exceedsTolerance === b.difference?.exceedsTolerance &&
    sameMethod(a.method, b.method)
  );
}

/**
 * `hasSimulatedFigures`: some figures come from the stored simulation, so each one says where it comes from in one
 * short line ("from simulation" or "estimate"; whether the run settled is said once, in the summary's status), and a
 * simulated figure gives the estimate beside it briefly, the whole sentence in its title. The lines stay short so
 * that the summary does not push the result tabs below the fold.
 */
const FigureCell = memo(
  function FigureCell({ figure, hasSimulatedFigures }: { figure: StripFigure; hasSimulatedFigures: boolean }) {
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
          <MethodNote subject={figure.label.toLowerCase()} method={figure.method} note={figure.difference?.text} />
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
        <Text size="xs" c="dimmed" lh={1.25} lineClamp={3} title={figure.target} data-figure-target>
          {targetLine(figure)}
        </Text>
        {figure.verdict && (
          <Group gap={4} mt={2} wrap="wrap">
            <VerdictBadge verdict={figure.verdict} margin={figure.margin ?? undefined} size="sm" />
          </Group>
        )}
        {hasSimulatedFigures && figure.source && (
          <Text
            fz={11}
            c={figure.source === 'simulation' ? 'verdigris.8' : 'dimmed'}
            fw={figure.source === 'simulation' ? 600 : 400}
            lh={1.3}
            mt={2}
            data-figure-source={figure.source}
          >
            {figure.source === 'simulation' ? 'from simulation' : 'estimate'}
          </Text>
        )}
        {figure.difference && (figure.difference.exceedsTolerance || figure.source === 'simulation') && (
          <Text
            fz={11}
            lh={1.25}
            c={figure.difference.exceedsTolerance ? 'ember.8' : 'dimmed'}
            fw={figure.difference.exceedsTolerance ? 600 : 400}
            title={figure.difference.text}
            data-figure-difference={figure.difference.exceedsTolerance ? 'beyond' : 'within'}
          >
            {figure.difference.exceedsTolerance ? `! ${figure.difference.brief}` : figure.difference.brief}
          </Text>
        )}
      </Paper>
    );
  },
  (previous, next) =>
    previous.hasSimulatedFigures === next.hasSimulatedFigures && sameFigure(previous.figure, next.figure),
);

/** "target ≤ 20 V" for a figure with a target; a phrase that says there is none ("no target set") as it is. */
function targetLine(figure: StripFigure): string {
  return figure.key === 'worst' || figure.target.startsWith('no ') ? figure.target : `target ${figure.target}`;
}
