import { Group, Text } from '@mantine/core';
import type { DriverReport } from '@ladderwright/shared/driver';
import { formatQuantity } from '@ladderwright/shared/units';
import { chartColors, QuantityChart } from '../../../components/quantity-chart';
import { useCurveSpan } from './curve-span-toggle';
import { nearLoadRange } from './ladder-charts';
import { MethodNote } from './method-note';

export interface DriverOperatingCurveProps {
  operatingPoint: DriverReport['operatingPoint'];
}

/**
 * Output magnitude vs load current of the driver joined to the ladder, from the engine's operating curve:
 * the onset of the power limit and the rated-load point marked.
 */
export function DriverOperatingCurve({ operatingPoint: op }: DriverOperatingCurveProps) {
  const points = op.curve.map((p) => ({ x: p.loadCurrentA, y: p.outputV }));
  const rated = op.ratedLoad;
  const span = useCurveSpan(nearLoadRange(rated.loadCurrentA, points.at(-1)?.x ?? 0, op.powerLimitOnsetA));
  return (
    <QuantityChart
      label="Driver output vs load current"
      title="Output vs load current (driver and ladder)"
      actions={<MethodNote subject="the driver operating curve" method={op.method} />}
      heightPx={240}
      data={points}
      x={{ key: 'x', title: 'Load current', unit: 'A', includesZero: true, range: span.range }}
      y={{ title: 'Output', unit: 'V', includesZero: true }}
      series={[{ key: 'y', name: 'output (mean)', color: chartColors.traces[0] }]}
      markers={[
        ...(op.powerLimitOnsetA > 0
          ? [
              {
                key: 'onset',
                label: `power limit from ${formatQuantity(op.powerLimitOnsetA, 'A')}`,
                x: op.powerLimitOnsetA,
                color: chartColors.secondMark,
              },
            ]
          : []),
        {
          key: 'rated',
          label: `rated load ${formatQuantity(rated.loadCurrentA, 'A')}, ${formatQuantity(rated.outputV, 'V')}`,
          x: rated.loadCurrentA,
          y: rated.outputV,
          color: chartColors.mark,
        },
      ]}
      footer={
        <Group gap="xs" justify="space-between" wrap="nowrap" align="flex-start">
          <Text size="xs" c="dimmed" data-driver="power-limit-onset">
            {op.powerLimitOnsetA > 0
              ? `Ladder-limited (flyback at its clamp) up to ${formatQuantity(op.powerLimitOnsetA, 'A')}; above it the driver’s power sets the output.`
              : 'Power-limited at every load: the flyback never reaches its clamp.'}{' '}
            Rated load {formatQuantity(rated.loadCurrentA, 'A')}: {formatQuantity(rated.outputV, 'V')},{' '}
            {rated.limitedBy}
            -limited.
          </Text>
          {span.toggle}
        </Group>
      }
    />
  );
}
