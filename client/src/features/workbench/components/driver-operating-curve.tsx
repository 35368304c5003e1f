import { Text } from '@mantine/core';
import { CartesianGrid, Line, LineChart, ReferenceDot, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import type { DriverReport } from '@ladderwright/shared/driver';
import { formatQuantity } from '@ladderwright/shared/units';
import { quantityTickFormatter } from '../../../lib/tick-format';
import { ChartCard } from './chart-card';

export interface DriverOperatingCurveProps {
  operatingPoint: DriverReport['operatingPoint'];
}

const axisTick = { fontSize: 11 };

/**
 * Output magnitude vs load current of the driver joined to the ladder, from the engine's operating curve:
 * the onset of the power limit and the rated-load point marked.
 */
export function DriverOperatingCurve({ operatingPoint: op }: DriverOperatingCurveProps) {
  const points = op.curve.map((p) => ({ x: p.loadCurrentA, y: p.outputV, limitedBy: p.limitedBy }));
  const currentTick = quantityTickFormatter(
    points.map((p) => p.x),
    'A',
  );
  const voltageTick = quantityTickFormatter(
    points.map((p) => p.y),
    'V',
  );
  const rated = op.ratedLoad;
  return (
    <ChartCard
      label="Driver output vs load current"
      title="Output vs load current (driver and ladder)"
      method={{ subject: 'the driver operating curve', method: op.method }}
      heightPx={240}
      footer={
        <Text size="xs" c="dimmed" data-driver="power-limit-onset">
          {op.powerLimitOnsetA > 0
            ? `Ladder-limited (flyback at its clamp) up to ${formatQuantity(op.powerLimitOnsetA, 'A')}; above it the driver’s power sets the output.`
            : 'Power-limited at every load: the flyback never reaches its clamp.'}{' '}
          Rated load {formatQuantity(rated.loadCurrentA, 'A')}: {formatQuantity(rated.outputV, 'V')}, {rated.limitedBy}
          -limited.
        </Text>
      }
    >
      <LineChart data={points} margin={{ top: 24, right: 24, bottom: 16, left: 8 }}>
        <CartesianGrid strokeDasharray="2 4" />
        <XAxis
          dataKey="x"
          type="number"
          tick={axisTick}
          tickFormatter={currentTick}
          domain={[0, 'dataMax']}
          label={{ value: 'load current', position: 'insideBottom', offset: -8, fontSize: 11 }}
        />
        <YAxis tick={axisTick} tickFormatter={voltageTick} width={64} />
        <Tooltip
          formatter={(y) => formatQuantity(Number(y), 'V')}
          labelFormatter={(x) => formatQuantity(Number(x), 'A')}
        />
        <ReferenceLine
          x={op.powerLimitOnsetA}
          stroke="var(--mantine-color-ember-7)"
          strokeDasharray="4 3"
          label={{ value: 'power limit from here', fontSize: 10, position: 'top' }}
        />
        <Line
          type="monotone"
          dataKey="y"
          name="output"
          stroke="var(--mantine-primary-color-filled)"
          strokeWidth={2}
          dot={false}
          isAnimationActive={false}
        />
        <ReferenceDot
          x={rated.loadCurrentA}
          y={rated.outputV}
          r={5}
          fill="var(--mantine-color-ember-6)"
          stroke="none"
          label={{ value: 'rated load', position: 'bottom', fontSize: 10 }}
        />
      </LineChart>
    </ChartCard>
  );
}
