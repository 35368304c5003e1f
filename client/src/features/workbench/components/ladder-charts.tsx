import { SimpleGrid, Text } from '@mantine/core';
import { CartesianGrid, Line, LineChart, ReferenceDot, ReferenceLine, Tooltip, XAxis, YAxis } from 'recharts';
import type { DesignReport } from '@ladderwright/shared/analysis';
import { formatQuantity } from '@ladderwright/shared/units';
import { quantityTickFormatter } from '../../../lib/tick-format';
import { ChartCard } from './chart-card';

export interface LadderChartsProps {
  report: DesignReport;
}

const axisTick = { fontSize: 11 };

/** Output vs load current (regulation) and output vs stage count with the optimum marked, from the engine's curves. */
export function LadderCharts({ report }: LadderChartsProps) {
  const curves = report.curves;
  const operatingCurrentA = report.analysis.loadCurrentA;
  const regulationCurrentTick = quantityTickFormatter([0, ...curves.regulation.map((p) => p.x)], 'A');
  const regulationVoltageTick = quantityTickFormatter(
    curves.regulation.map((p) => p.y),
    'V',
  );
  const stagesVoltageTick = quantityTickFormatter(
    curves.outputVsStages.map((p) => p.y),
    'V',
  );
  return (
    <SimpleGrid cols={{ base: 1, md: 2 }} spacing="md">
      <ChartCard
        label="Output vs load current"
        title="Output vs load current"
        method={{ subject: 'the regulation curve', method: curves.method }}
        heightPx={220}
        footer={
          <Text size="xs" c="dimmed">
            Short-circuit current {formatQuantity(curves.shortCircuitCurrentA, 'A')}
          </Text>
        }
      >
        <LineChart data={curves.regulation} margin={{ top: 8, right: 16, bottom: 16, left: 8 }}>
          <CartesianGrid strokeDasharray="2 4" />
          <XAxis
            dataKey="x"
            type="number"
            tick={axisTick}
            tickFormatter={regulationCurrentTick}
            domain={[0, 'dataMax']}
            label={{ value: 'load current', position: 'insideBottom', offset: -8, fontSize: 11 }}
          />
          <YAxis tick={axisTick} tickFormatter={regulationVoltageTick} width={64} />
          <Tooltip
            formatter={(y) => formatQuantity(Number(y), 'V')}
            labelFormatter={(x) => formatQuantity(Number(x), 'A')}
          />
          <ReferenceLine
            x={operatingCurrentA}
            stroke="var(--mantine-color-ember-7)"
            strokeDasharray="4 3"
            label={{ value: 'operating load', fontSize: 10, position: 'insideTopRight' }}
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
        </LineChart>
      </ChartCard>
      <ChartCard
        label="Output vs stage count"
        title="Output vs stage count"
        method={{ subject: 'output vs stage count', method: curves.method }}
        heightPx={220}
        footer={
          <Text size="xs" c="dimmed">
            Optimum {curves.optimumStages} stages, {formatQuantity(curves.optimumOutputV, 'V')}
          </Text>
        }
      >
        <LineChart data={curves.outputVsStages} margin={{ top: 8, right: 16, bottom: 16, left: 8 }}>
          <CartesianGrid strokeDasharray="2 4" />
          <XAxis
            dataKey="x"
            type="number"
            tick={axisTick}
            allowDecimals={false}
            domain={['dataMin', 'dataMax']}
            label={{ value: 'stages', position: 'insideBottom', offset: -8, fontSize: 11 }}
          />
          <YAxis tick={axisTick} tickFormatter={stagesVoltageTick} width={64} />
          <Tooltip formatter={(y) => formatQuantity(Number(y), 'V')} labelFormatter={(x) => `${String(x)} stages`} />
          <Line
            type="monotone"
            dataKey="y"
            name="output"
            stroke="var(--mantine-primary-color-filled)"
            strokeWidth={2}
            dot={{ r: 2 }}
            isAnimationActive={false}
          />
          <ReferenceDot
            x={curves.optimumStages}
            y={curves.optimumOutputV}
            r={5}
            fill="var(--mantine-color-ember-6)"
            stroke="none"
            label={{ value: `optimum ${curves.optimumStages}`, position: 'top', fontSize: 10 }}
          />
        </LineChart>
      </ChartCard>
    </SimpleGrid>
  );
}
