import { Paper, Text } from '@mantine/core';
import { capacitorOfTrace, TRACE_NAMES, type WaveformTrace } from '@ladderwright/shared/api';
import { formatQuantity } from '@ladderwright/shared/units';
import { chartColors, QuantityChart } from '../../../components/quantity-chart';
import type { ChartSeries } from '../../../components/quantity-chart.types';

/** Trace names of a driver run's steady state besides the output. */
export const collectorTrace = TRACE_NAMES.collector;
export const secondaryTrace = TRACE_NAMES.secondary;
export const primaryCurrentTrace = TRACE_NAMES.primaryCurrent;
const traceLabels: Readonly<Record<string, string>> = {
  [collectorTrace]: `collector ${collectorTrace}`,
  [secondaryTrace]: `secondary ${secondaryTrace}`,
  [primaryCurrentTrace]: `primary ${primaryCurrentTrace}`,
  [TRACE_NAMES.output]: `ladder top ${TRACE_NAMES.output}`,
  [TRACE_NAMES.loadTerminal]: `load terminal ${TRACE_NAMES.loadTerminal}`,
};

/** The name a trace goes by on a plot: the node's role and the simulator's name, e.g. "C3 voltage V(C3)". */
export function traceLabel(name: string): string {
  const capacitor = capacitorOfTrace(name);
  return traceLabels[name] ?? (capacitor ? `${capacitor} ${name}` : name);
}

/** The traces moved to start at 0 s from `startS`. */
export function fromTime(traces: WaveformTrace[], startS: number): WaveformTrace[] {
  return traces.map((trace) => ({ ...trace, timeS: trace.timeS.map((t) => t - startS) }));
}

/** The traces less their own mean (as a scope's AC coupling shows a ripple), with the means removed. */
export function aboutMean(traces: WaveformTrace[]): { traces: WaveformTrace[]; meansV: number[] } {
  const meansV = traces.map((trace) => trace.values.reduce((sum, v) => sum + v, 0) / Math.max(1, trace.values.length));
  return {
    traces: traces.map((trace, i) => ({ ...trace, values: trace.values.map((v) => v - (meansV[i] ?? 0)) })),
    meansV,
  };
}

/** First sample time over the traces. */
export function startOf(traces: readonly WaveformTrace[]): number {
  return Math.min(...traces.map((trace) => trace.timeS[0] ?? Infinity));
}

/** The samples of the last period of each trace (ripple is read over one cycle). */
export function lastCycle(traces: WaveformTrace[], frequencyHz: number): WaveformTrace[] {
  const periodS = 1 / frequencyHz;
  return traces.map((trace) => {
    const endS = trace.timeS[trace.timeS.length - 1] ?? 0;
    const keep = trace.timeS.map((t) => t >= endS - periodS);
    return {
      ...trace,
      timeS: trace.timeS.filter((_, i) => keep[i]),
      values: trace.values.filter((_, i) => keep[i]),
    };
  });
}

/** Rows on the union of the traces' sample times; a trace without a sample at a time leaves it empty. */
function rowsOf(traces: readonly WaveformTrace[]): Record<string, number>[] {
  const rows = new Map<number, Record<string, number>>();
  for (const trace of traces) {
    trace.timeS.forEach((t, i) => {
      const row = rows.get(t) ?? { t };
      row[trace.name] = trace.values[i] ?? NaN;
      rows.set(t, row);
    });
  }
  return [...rows.values()].sort((a, b) => (a.t ?? 0) - (b.t ?? 0));
}

export interface TraceChartProps {
  title: string;
  traces: WaveformTrace[];
  /** Traces drawn against a second axis on the right (another scale or unit), e.g. the secondary beside the collector. */
  rightTraces?: WaveformTrace[];
  /** The level a discharge must reach, drawn as a line (with the traces' sign). */
  safeVoltageV?: number;
  /** Start the time axis at 0 s (start-up, discharge) rather than at the first sample (a cycle cut out of a run). */
  isTimeFromZero?: boolean;
  /** Time of the run the plotted 0 s stands for (a window cut out of a run and moved to 0), named in the axis title. */
  timeOriginS?: number;
  /** Title of the left axis when it is not the trace's name (e.g. "Ripple": the axis is short, so a word or two). */
  valueTitle?: string;
  /** Series names when they are not the traces' own. */
  names?: readonly string[];
  /** Moments drawn as vertical lines (e.g. the times to 90 % and to within 1 % of a start-up), s on the plotted axis. */
  timeMarks?: readonly TimeMark[];
  /** The plot first shows the run up to this time (s on the plotted axis); the rest is a zoom-out away. */
  firstViewEndS?: number;
}

/** A moment drawn as a vertical line, with its full label in the key and a short tag on the plot. */
export interface TimeMark {
  key: string;
  label: string;
  tag: string;
  timeS: number;
  /** The second mark of a plot: another colour and a dotted line. */
  isLater?: boolean;
}

/** The chart colours in turn. */
const colorOf = (i: number) => chartColors.traces[i % chartColors.traces.length] ?? '';
const unitOf = (traces: readonly WaveformTrace[]) => traces[0]?.unit ?? 'V';
const quantityName = (unit: 'V' | 'A') => (unit === 'A' ? 'Current' : 'Voltage');

/** One time plot of a run's traces, zoomable, in the shared chart frame. */
export function TraceChart({
  title,
  traces,
  rightTraces = [],
  safeVoltageV,
  isTimeFromZero = false,
  timeOriginS = 0,
  valueTitle,
  names,
  timeMarks = [],
  firstViewEndS,
}: TraceChartProps) {
  if (traces.length + rightTraces.length === 0) {
    return (
      <Paper withBorder p="sm" role="figure" aria-label={title}>
        <Text size="sm" fw={600} mb={4}>
          {title}
        </Text>
        <Text size="sm" c="dimmed">
          This run has no trace for this phase.
        </Text>
      </Paper>
    );
  }
  const all = [...traces, ...rightTraces];
  const series: ChartSeries[] = all.map((trace, i) => ({
    key: trace.name,
    name: names?.[i] ?? traceLabel(trace.name),
    color: colorOf(i),
    axis: i < traces.length ? 'left' : 'right',
  }));
  const isNegative = traces.some((trace) => trace.values.length > 0 && trace.values.every((v) => v <= 0));
  const leftName = traces.length === 1 ? (series[0]?.name ?? '') : quantityName(unitOf(traces));
  const rightName = rightTraces.length === 1 ? (series[traces.length]?.name ?? '') : quantityName(unitOf(rightTraces));
  return (
    <QuantityChart
      label={title}
      title={title}
      heightPx={220}
      data={rowsOf(all)}
      x={{
        key: 't',
        title: timeOriginS > 0 ? `Time after ${formatQuantity(timeOriginS, 's', 4)}` : 'Time',
        unit: 's',
        includesZero: isTimeFromZero,
      }}
      y={{ title: valueTitle ?? capitalised(leftName), unit: unitOf(traces), includesZero: isTimeFromZero }}
      y2={rightTraces.length > 0 ? { title: capitalised(rightName), unit: unitOf(rightTraces) } : undefined}
      series={series}
      markers={[
        ...(safeVoltageV === undefined
          ? []
          : [
              {
                key: 'safe',
                label: `safe level ${formatQuantity(isNegative ? -safeVoltageV : safeVoltageV, 'V')}`,
                y: isNegative ? -safeVoltageV : safeVoltageV,
                color: chartColors.mark,
              },
            ]),
        ...timeMarks.map((mark) => ({
          key: mark.key,
          label: mark.label,
          tag: mark.tag,
          x: mark.timeS,
          color: mark.isLater ? chartColors.laterMark : chartColors.mark,
          isDotted: mark.isLater === true,
        })),
      ]}
      isZoomable
      {...(firstViewEndS === undefined ? {} : { firstViewXEnd: firstViewEndS })}
    />
  );
}

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
