import { useMemo, useState } from 'react';
import { Button, Group, Paper, Stack, Text } from '@mantine/core';
import {
  Area,
  Brush,
  CartesianGrid,
  ComposedChart,
  Line,
  ReferenceDot,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
  type TooltipContentProps,
} from 'recharts';
import { formatQuantity } from '@ladderwright/shared/units';
import { quantityAxis, type QuantityAxis } from '../lib/tick-format';
import { ChartFrame } from './chart-frame';
import type { ChartAxis, ChartMarker, ChartSeries, QuantityChartProps } from './quantity-chart.types';

type ChartRow = Readonly<Record<string, number | undefined>>;

const tickStyle = { fontSize: 11 };
const titleStyle = { fontSize: 11, fill: 'currentColor', textAnchor: 'middle' } as const;

const axisTitle = (axis: ChartAxis, scale: QuantityAxis) =>
  scale.unitLabel === '' ? axis.title : `${axis.title} (${scale.unitLabel})`;

/** A value in the read-out: engineering notation with four figures, or the bare count. */
const readout = (value: number | undefined, axis: ChartAxis) =>
  value === undefined || !Number.isFinite(value)
    ? '—'
    : axis.unit === ''
      ? String(value)
      : formatQuantity(value, axis.unit, 4);

function valuesOf(rows: readonly ChartRow[], keys: readonly string[]): number[] {
  const values: number[] = [];
  for (const row of rows) {
    for (const key of keys) {
      const value = row[key];
      if (value !== undefined && Number.isFinite(value)) values.push(value);
    }
  }
  return values;
}

/** The recharts drawing of a QuantityChart (loaded lazily through quantity-chart.tsx). */
export function QuantityChartView(props: QuantityChartProps) {
  const { data, x, y, y2, series, markers = [], bands = [], isZoomable = false, firstViewXEnd } = props;
  const rows = useMemo(() => data.map((row) => ({ ...(row as ChartRow) })), [data]);
  const firstView = useMemo(
    () => firstWindow(rows, x.key, isZoomable ? firstViewXEnd : undefined),
    [rows, x.key, isZoomable, firstViewXEnd],
  );
  const [window, setWindow] = useState<{ start: number; end: number } | null>(firstView);
  // New data (another run) starts again from its own first view.
  const [viewOf, setViewOf] = useState(firstView);
  if (viewOf !== firstView) {
    setViewOf(firstView);
    setWindow(firstView);
  }
  const visible = window ? rows.slice(window.start, window.end + 1) : rows;
  const isZoomed = window !== null && (window.start > 0 || window.end < rows.length - 1);
  const isFirstView = window?.start === firstView?.start && window?.end === firstView?.end;

  const onAxis = (side: 'left' | 'right') => series.filter((s) => (s.axis ?? 'left') === side).map((s) => s.key);
  const bandKeys = bands.flatMap((band) => [band.lowKey, band.highKey]);
  const markerValues = (side: 'left' | 'right') =>
    markers.filter((m) => m.y !== undefined && (m.axis ?? 'left') === side).map((m) => m.y as number);
  // A fixed range, else the data drawn; a time axis ends at its samples, and a zoomed axis at the window.
  const axisOver = (axis: ChartAxis, values: number[], isTime: boolean) =>
    quantityAxis(axis.range ?? values, axis.unit, {
      includesZero: axis.includesZero === true && !(isTime && isZoomed),
      isExact: isTime || axis.range !== undefined,
      isInteger: axis.isInteger,
    });
  const xScale = axisOver(x, valuesOf(visible, [x.key]), x.unit === 's');
  const yScale = axisOver(y, [...valuesOf(visible, [...onAxis('left'), ...bandKeys]), ...markerValues('left')], false);
  const y2Scale = y2 ? axisOver(y2, [...valuesOf(visible, onAxis('right')), ...markerValues('right')], false) : null;
  const axisOfSeries = (s: ChartSeries) => (s.axis === 'right' && y2 ? y2 : y);

  const csvColumns = [
    { key: x.key, header: x.unit === '' ? x.title : `${x.title} (${x.unit === 'Ohm' ? 'Ω' : x.unit})` },
    ...series.map((s) => {
      const unit = axisOfSeries(s).unit;
      return { key: s.key, header: unit === '' ? s.name : `${s.name} (${unit === 'Ohm' ? 'Ω' : unit})` };
    }),
    ...bands.flatMap((band) => [
      { key: band.lowKey, header: `${band.name}, low (${y.unit})` },
      { key: band.highKey, header: `${band.name}, high (${y.unit})` },
    ]),
  ];

  return (
    <ChartFrame
      label={props.label}
      title={props.title}
      actions={
        <>
          {props.actions}
          {!isFirstView && (
            <Button size="compact-xs" variant="subtle" onClick={() => setWindow(firstView)}>
              Reset zoom
            </Button>
          )}
          {firstView !== null && isZoomed && (
            <Button size="compact-xs" variant="subtle" onClick={() => setWindow(null)}>
              Show all
            </Button>
          )}
        </>
      }
      data={{ columns: csvColumns, rows }}
      footer={
        <Stack gap={2} mt={4}>
          <ChartKey series={series} bands={bands} markers={markers} />
          {props.footer}
        </Stack>
      }
    >
      <div style={{ width: '100%', height: props.heightPx + (isZoomable ? 30 : 0) }}>
        <ResponsiveContainer>
          <ComposedChart data={rows} margin={{ top: 8, right: y2 ? 4 : 16, bottom: 8, left: 4 }}>
            <CartesianGrid strokeDasharray="2 4" />
            <XAxis
              dataKey={x.key}
              type="number"
              domain={xScale.domain}
              ticks={xScale.ticks}
              allowDataOverflow
              tick={tickStyle}
              tickFormatter={xScale.format}
              height={40}
              label={{ value: axisTitle(x, xScale), position: 'insideBottom', offset: 2, style: titleStyle }}
            />
            <YAxis
              yAxisId="left"
              tick={tickStyle}
              tickFormatter={yScale.format}
              width={62}
              domain={yScale.domain}
              ticks={yScale.ticks}
              label={{ value: axisTitle(y, yScale), angle: -90, position: 'insideLeft', offset: 6, style: titleStyle }}
            />
            {y2 && y2Scale && (
              <YAxis
                yAxisId="right"
                orientation="right"
                tick={tickStyle}
                tickFormatter={y2Scale.format}
                width={62}
                domain={y2Scale.domain}
                ticks={y2Scale.ticks}
                label={{
                  value: axisTitle(y2, y2Scale),
                  angle: 90,
                  position: 'insideRight',
                  offset: 6,
                  style: titleStyle,
                }}
              />
            )}
            <Tooltip
              isAnimationActive={false}
              content={(tooltip: TooltipContentProps) => (
                <Readout
                  isActive={tooltip.active === true}
                  row={tooltip.payload?.[0]?.payload as ChartRow | undefined}
                  x={x}
                  series={series}
                  axisOf={axisOfSeries}
                />
              )}
            />
            {bands.map((band) => (
              <Area
                key={band.name}
                yAxisId="left"
                dataKey={(row: ChartRow) => [row[band.lowKey], row[band.highKey]]}
                name={band.name}
                stroke="none"
                fill={band.color}
                fillOpacity={0.18}
                isAnimationActive={false}
                connectNulls
              />
            ))}
            {markers.map((marker) =>
              marker.x !== undefined && marker.y !== undefined ? (
                <ReferenceDot
                  key={marker.key}
                  yAxisId={marker.axis ?? 'left'}
                  x={marker.x}
                  y={marker.y}
                  r={5}
                  fill={marker.color}
                  stroke="none"
                />
              ) : marker.x !== undefined ? (
                <ReferenceLine
                  key={marker.key}
                  yAxisId="left"
                  x={marker.x}
                  stroke={marker.color}
                  strokeWidth={marker.isDotted ? 2 : 1}
                  strokeDasharray={marker.isDotted ? dotted : dashed}
                  label={marker.tag ? markerTag(marker.tag, marker.color, tagSide(markers, marker)) : undefined}
                />
              ) : (
                <ReferenceLine
                  key={marker.key}
                  yAxisId={marker.axis ?? 'left'}
                  y={marker.y}
                  stroke={marker.color}
                  strokeDasharray="5 3"
                />
              ),
            )}
            {series.map((s) => (
              <Line
                key={s.key}
                yAxisId={s.axis === 'right' && y2 ? 'right' : 'left'}
                dataKey={s.key}
                name={s.name}
                stroke={s.kind === 'points' ? 'none' : s.color}
                strokeWidth={s.kind === 'points' ? 0 : 1.8}
                strokeDasharray={s.isDashed ? '6 3' : undefined}
                dot={s.kind === 'points' ? { r: 3.5, fill: s.color, stroke: s.color } : s.hasDots ? { r: 2 } : false}
                activeDot={{ r: 4 }}
                isAnimationActive={false}
                connectNulls={s.kind !== 'points'}
              />
            ))}
            {isZoomable && rows.length > 2 && (
              <Brush
                dataKey={x.key}
                height={22}
                travellerWidth={8}
                startIndex={window?.start ?? 0}
                endIndex={window?.end ?? rows.length - 1}
                tickFormatter={(value: number) => `${xScale.format(value)} ${xScale.unitLabel}`}
                onChange={(next) => {
                  const start = next.startIndex ?? 0;
                  const end = next.endIndex ?? rows.length - 1;
                  setWindow(start === 0 && end === rows.length - 1 ? null : { start, end });
                }}
                stroke="var(--mantine-color-gray-6)"
              />
            )}
          </ComposedChart>
        </ResponsiveContainer>
      </div>
    </ChartFrame>
  );
}

const dashed = '4 3';
const dotted = '1 3';

/** A vertical mark's tag at the foot of the plot (a rising trace is high by then), on the side away from its neighbour. */
const markerTag = (value: string, color: string, side: 'left' | 'right') => ({
  value,
  position: side === 'left' ? ('insideBottomRight' as const) : ('insideBottomLeft' as const),
  fill: color,
  fontSize: 11,
  fontWeight: 600,
});

/** Tags of vertical marks face apart: the earliest's to the left of its line, the others' to the right. */
function tagSide(markers: readonly ChartMarker[], marker: ChartMarker): 'left' | 'right' {
  const times = markers.filter((m) => m.x !== undefined && m.y === undefined && m.tag).map((m) => m.x as number);
  return times.length > 1 && marker.x === Math.min(...times) ? 'left' : 'right';
}

/** The rows up to `xEnd` as a zoom window (at least three samples), or null when they are all of them. */
function firstWindow(rows: readonly ChartRow[], key: string, xEnd: number | undefined) {
  if (xEnd === undefined || !Number.isFinite(xEnd)) return null;
  let end = rows.findIndex((row) => (row[key] ?? -Infinity) > xEnd);
  if (end < 0) return null;
  end = Math.max(end, Math.min(2, rows.length - 1));
  return end >= rows.length - 1 ? null : { start: 0, end };
}

/** The cursor read-out: the x value and every trace's value at it, in engineering notation. */
function Readout({
  isActive,
  row,
  x,
  series,
  axisOf,
}: {
  isActive: boolean;
  row: ChartRow | undefined;
  x: QuantityChartProps['x'];
  series: readonly ChartSeries[];
  axisOf: (s: ChartSeries) => ChartAxis;
}) {
  if (!isActive || !row) return null;
  return (
    <Paper withBorder shadow="xs" p={6} aria-label="Cursor read-out">
      <Text size="xs" fw={600}>
        {x.title} {readout(row[x.key], x)}
      </Text>
      {series.map((s) => (
        <Text size="xs" key={s.key} c={s.color}>
          {s.name}: {readout(row[s.key], axisOf(s))}
        </Text>
      ))}
    </Paper>
  );
}

/** The chart's key: every trace, band and mark with its label, in a wrapping row (never over the plot). */
function ChartKey({
  series,
  bands,
  markers,
}: Pick<QuantityChartProps, 'series'> & Required<Pick<QuantityChartProps, 'bands' | 'markers'>>) {
  if (series.length + bands.length + markers.length <= 1) return null;
  return (
    <Group gap="md" aria-label="Chart key" wrap="wrap">
      {series.map((s) => (
        <Group gap={4} key={s.key} wrap="nowrap">
          <Swatch color={s.color} shape={s.kind === 'points' ? 'dot' : s.isDashed ? 'dash' : 'line'} />
          <Text size="xs">{s.name}</Text>
        </Group>
      ))}
      {bands.map((band) => (
        <Group gap={4} key={band.name} wrap="nowrap">
          <Swatch color={band.color} shape="band" />
          <Text size="xs">{band.name}</Text>
        </Group>
      ))}
      {markers.map((marker) => (
        <Group gap={4} key={marker.key} wrap="nowrap">
          <Swatch
            color={marker.color}
            shape={marker.x !== undefined && marker.y !== undefined ? 'dot' : marker.isDotted ? 'dots' : 'dash'}
          />
          <Text size="xs">{marker.label}</Text>
        </Group>
      ))}
    </Group>
  );
}

function Swatch({ color, shape }: { color: string; shape: 'line' | 'dash' | 'dots' | 'dot' | 'band' }) {
  return (
    <svg width={18} height={10} aria-hidden="true">
      {shape === 'dot' && <circle cx={9} cy={5} r={4} fill={color} />}
      {shape === 'band' && <rect x={0} y={1} width={18} height={8} fill={color} opacity={0.3} />}
      {(shape === 'line' || shape === 'dash' || shape === 'dots') && (
        <line
          x1={0}
          x2={18}
          y1={5}
          y2={5}
          stroke={color}
          strokeWidth={2}
          strokeDasharray={shape === 'dash' ? dashed : shape === 'dots' ? dotted : undefined}
        />
      )}
    </svg>
  );
}
