import { SimpleGrid, Text } from '@mantine/core';
import type { DesignReport } from '@ladderwright/shared/analysis';
import { formatQuantity } from '@ladderwright/shared/units';
import { chartColors, QuantityChart } from '../../../components/quantity-chart';
import { MethodNote } from './method-note';

export interface LadderChartsProps {
  report: DesignReport;
}

/** Output vs load current (regulation) and output vs stage count with the optimum marked, from the engine's curves. */
export function LadderCharts({ report }: LadderChartsProps) {
  const curves = report.curves;
  const operatingCurrentA = report.analysis.loadCurrentA;
  const [outputColor = '', , designColor = ''] = chartColors.traces;
  return (
    <SimpleGrid type="container" cols={{ base: 1, '620px': 2 }} spacing="md">
      <QuantityChart
        label="Output vs load current"
        title="Output vs load current"
        actions={<MethodNote subject="the regulation curve" method={curves.method} />}
        heightPx={220}
        data={curves.regulation}
        x={{ key: 'x', title: 'Load current', unit: 'A', includesZero: true }}
        y={{ title: 'Output', unit: 'V', includesZero: true }}
        series={[{ key: 'y', name: 'output (mean)', color: outputColor }]}
        markers={[
          {
            key: 'operating',
            label: `operating load ${formatQuantity(operatingCurrentA, 'A')}`,
            x: operatingCurrentA,
            color: chartColors.mark,
          },
        ]}
        footer={
          <Text size="xs" c="dimmed">
            Short-circuit current {formatQuantity(curves.shortCircuitCurrentA, 'A')}
          </Text>
        }
      />
      <QuantityChart
        label="Output vs stage count"
        title="Output vs stage count"
        actions={<MethodNote subject="output vs stage count" method={curves.method} />}
        heightPx={220}
        data={curves.outputVsStages}
        x={{ key: 'x', title: 'Stages', unit: '', isInteger: true }}
        y={{ title: 'Output', unit: 'V' }}
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
            label: `this design ${report.analysis.stageCount} stages`,
            x: report.analysis.stageCount,
            color: designColor,
          },
        ]}
      />
    </SimpleGrid>
  );
}
