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
import type { ChartAxis, ChartSeries, QuantityChartProps } from './quantity-chart.types';

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
  const { data, x, y, y2, series, markers = [], bands = [], isZoomable = false } = props;
  const rows = useMemo(() => data.map((row) => ({ ...(row as ChartRow) })), [data]);
  const [window, setWindow] = useState<{ start: number; end: number } | null>(null);
  const visible = window ? rows.slice(window.start, window.end + 1) : rows;
  const isZoomed = window !== null && (window.start > 0 || window.end < rows.length - 1);

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
          {isZoomed && (
            <Button size="compact-xs" variant="subtle" onClick={() => setWindow(null)}>
              Reset zoom
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
                  strokeDasharray="4 3"
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
          <Swatch color={marker.color} shape={marker.x !== undefined && marker.y !== undefined ? 'dot' : 'dash'} />
          <Text size="xs">{marker.label}</Text>
        </Group>
      ))}
    </Group>
  );
}

function Swatch({ color, shape }: { color: string; shape: 'line' | 'dash' | 'dot' | 'band' }) {
  return (
    <svg width={18} height={10} aria-hidden="true">
      {shape === 'dot' && <circle cx={9} cy={5} r={4} fill={color} />}
      {shape === 'band' && <rect x={0} y={1} width={18} height={8} fill={color} opacity={0.3} />}
      {(shape === 'line' || shape === 'dash') && (
        <line
          x1={0}
          x2={18}
          y1={5}
          y2={5}
          stroke={color}
          strokeWidth={2}
          strokeDasharray={shape === 'dash' ? '4 3' : undefined}
        />
      )}
    </svg>
  );
}
