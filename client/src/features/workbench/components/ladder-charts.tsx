import { Group, SimpleGrid, Text } from '@mantine/core';
import type { DesignReport } from '@ladderwright/shared/analysis';
import { formatQuantity } from '@ladderwright/shared/units';
import { chartColors, QuantityChart } from '../../../components/quantity-chart';
import { useCurveSpan } from './curve-span-toggle';
import { MethodNote } from './method-note';

export interface LadderChartsProps {
  report: DesignReport;
}

/** The smallest of 1, 2, 5 × 10ⁿ at or above `value` (> 0). */
function roundUpToSeries(value: number): number {
  const decade = 10 ** Math.floor(Math.log10(value));
  return ([1, 2, 5, 10].find((step) => step * decade >= value * (1 - 1e-9)) ?? 10) * decade;
}

/**
 * The load-current range that shows the operating load clear of the y-axis (a fifth to a third of the way across), or
 * undefined when the whole curve already does. Supplies of this kind run far below their short-circuit current, so
 * drawn to its end the load would sit on the axis. A mark that belongs beside the load (the driver's power-limit
 * onset, `alsoShowA`) is kept inside the range with a quarter of its value to spare.
 */
export function nearLoadRange(loadA: number, curveEndA: number, alsoShowA = 0): readonly [number, number] | undefined {
  if (!(loadA > 0) || !(curveEndA > 0)) return undefined;
  const endA = roundUpToSeries(Math.max(3 * loadA, 1.25 * alsoShowA));
  return endA < 0.5 * curveEndA ? [0, endA] : undefined;
}

/** The output-vs-load plot: the supply's own curve for a driver design, else the ladder's at its fixed drive. */
export function loadCurveOf(report: DesignReport) {
  const curves = report.curves;
  const driver = report.driver;
  if (!driver) {
    return {
      title: 'Output vs load current',
      method: curves.method,
      subject: 'the regulation curve',
      data: curves.regulation,
      seriesName: 'output (mean)',
      loadA: report.analysis.loadCurrentA,
      loadLabel: `operating load ${formatQuantity(report.analysis.loadCurrentA, 'A')}`,
      range: undefined,
      nearRange: nearLoadRange(report.analysis.loadCurrentA, curves.regulation.at(-1)?.x ?? 0),
      footer: `Short-circuit current ${formatQuantity(curves.shortCircuitCurrentA, 'A')}`,
    };
  }
  // With a driver the drive itself falls as the load grows past the power limit: each load's output comes from the
  // driver and the ladder solved together, so a load beyond what the supply delivers is drawn beyond the curve's end
  // instead of as the ladder at the collapsed drive of its last point.
  const op = driver.operatingPoint;
  const data = op.curve.map((point) => ({ x: point.loadCurrentA, y: point.outputV }));
  const capacity = driver.loadCapacity;
  const loadA = capacity?.loadCurrentA ?? report.analysis.loadCurrentA;
  const endA = data.at(-1)?.x ?? 0;
  const isBeyond = capacity?.isLoadBeyond === true;
  return {
    title: 'Output vs load current (driver and ladder)',
    method: op.method,
    subject: 'the driver operating curve',
    data,
    seriesName: 'output (mean), driver and ladder',
    loadA,
    loadLabel: `${isBeyond ? 'this design’s load, beyond the supply,' : 'operating load'} ${formatQuantity(loadA, 'A')}`,
    range: loadA > endA ? ([0, loadA * 1.05] as const) : undefined,
    nearRange: loadA > endA ? undefined : nearLoadRange(loadA, endA),
    footer:
      capacity !== undefined
        ? `The supply holds an output up to ${formatQuantity(capacity.maxLoadCurrentA, 'A')} of load`
        : `Short-circuit current ${formatQuantity(curves.shortCircuitCurrentA, 'A')}`,
  };
}

/**
 * Output vs load current (the regulation of the ladder at its drive, or of the whole supply with a driver) and
 * output vs stage count with the optimum marked, from the engine's curves.
 */
export function LadderCharts({ report }: LadderChartsProps) {
  const curves = report.curves;
  const load = loadCurveOf(report);
  const span = useCurveSpan(load.nearRange, load.range);
  const [outputColor = '', , designColor = ''] = chartColors.traces;
  // The curves are magnitudes; a negative supply says so on its axes rather than plotting −6 kV as 6 kV unnamed.
  const outputTitle = report.analysis.outputMeanV < 0 ? 'Output magnitude' : 'Output';
  return (
    <SimpleGrid type="container" cols={{ base: 1, '620px': 2 }} spacing="md">
      <QuantityChart
        label="Output vs load current"
        title={load.title}
        actions={<MethodNote subject={load.subject} method={load.method} />}
        heightPx={220}
        data={load.data}
        x={{
          key: 'x',
          title: 'Load current',
          unit: 'A',
          includesZero: true,
          range: span.range,
        }}
        y={{ title: outputTitle, unit: 'V', includesZero: true }}
        series={[{ key: 'y', name: load.seriesName, color: outputColor }]}
        markers={[{ key: 'operating', label: load.loadLabel, x: load.loadA, color: chartColors.mark }]}
        footer={
          <Group gap="xs" justify="space-between" wrap="wrap">
            <Text size="xs" c="dimmed">
              {load.footer}
            </Text>
            {span.toggle}
          </Group>
        }
      />
      <QuantityChart
        label="Output vs stage count"
        title="Output vs stage count"
        actions={<MethodNote subject="output vs stage count" method={curves.method} />}
        heightPx={220}
        data={curves.outputVsStages}
        x={{ key: 'x', title: 'Stages', unit: '', isInteger: true }}
        y={{ title: outputTitle, unit: 'V' }}
        series={[{ key: 'y', name: 'output (mean) at the operating load', color: outputColor, hasDots: true }]}
        markers={[
          {
            key: 'optimum',
            label: `optimum ${curves.optimumStages} stages, ${formatQuantity(curves.optimumOutputV, 'V')}`,
            x: curves.optimumStages,
            y: curves.optimumOutputV,
            color: chartColors.mark,
          },
          {
            key: 'design',
            label: designStagesLabel(report.analysis.stageCount, report.analysis.cellCount),
            x: report.analysis.stageCount,
            color: designColor,
          },
        ]}
      />
    </SimpleGrid>
  );
}

/** A ladder of an odd cell count (a tripler) has a half stage: name its cells too, so "1.5 stages" reads plainly. */
function designStagesLabel(stageCount: number, cellCount: number): string {
  const stages = `this design ${stageCount} ${stageCount === 1 ? 'stage' : 'stages'}`;
  return Number.isInteger(stageCount) ? stages : `${stages} (${cellCount} cells)`;
}
