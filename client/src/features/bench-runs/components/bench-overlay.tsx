import { Stack, Table, Text } from '@mantine/core';
import {
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { BenchRunDetail } from '@ladderwright/shared/api';
import { formatQuantity } from '@ladderwright/shared/units';
import { BenchVerdictBadge } from './bench-verdict-badge';

const percent = (value: number | null) => (value === null ? 'not compared' : `${(value * 100).toFixed(2)} %`);

/** Measured on predicted: a load sweep over the regulation curve, or a capture's mean and ripple; deviation per point. */
export function BenchOverlay({ run }: { run: BenchRunDetail }) {
  const { comparison } = run;
  const heading = (
    <Text size="sm">
      Worst deviation {percent(run.worstDeviation)} against ±{(run.tolerance * 100).toFixed(1)} %{' '}
      <BenchVerdictBadge verdict={run.verdict} marginPct={run.marginPct} />
    </Text>
  );
  if (run.kind === 'scope-capture') {
    const samples = run.points.map((point) => ({ timeMs: point.x * 1e3, outputV: Math.abs(point.y) }));
    return (
      <Stack gap="sm" aria-label="Bench overlay">
        {heading}
        <ResponsiveContainer width="100%" height={260}>
          <ComposedChart data={samples}>
            <CartesianGrid strokeDasharray="3 3" />
            <XAxis dataKey="timeMs" type="number" unit=" ms" domain={['dataMin', 'dataMax']} />
            <YAxis unit=" V" domain={['auto', 'auto']} />
            <Tooltip />
            <Line dataKey="outputV" name="measured output" dot={false} stroke="var(--mantine-color-indigo-6)" />
          </ComposedChart>
        </ResponsiveContainer>
        <Table aria-label="Capture against prediction">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Figure</Table.Th>
              <Table.Th ta="right">Measured</Table.Th>
              <Table.Th ta="right">Predicted</Table.Th>
              <Table.Th ta="right">Deviation</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {comparison.figures.map((figure) => (
              <Table.Tr key={figure.key}>
                <Table.Td>{figure.key === 'outputMeanV' ? 'Mean output' : 'Ripple, peak-to-peak'}</Table.Td>
                <Table.Td ta="right">{formatQuantity(figure.measured, 'V')}</Table.Td>
                <Table.Td ta="right">{formatQuantity(figure.predicted, 'V')}</Table.Td>
                <Table.Td ta="right">{percent(figure.deviation)}</Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      </Stack>
    );
  }
  // One data set on a numeric current axis: predicted rows carry predictedV, measured rows measuredV.
  const rows = [
    ...comparison.predictedCurve.map((point) => ({ currentUa: point.x * 1e6, predictedV: point.y })),
    ...comparison.points.map((point) => ({ currentUa: point.x * 1e6, measuredV: point.measuredV })),
  ].sort((a, b) => a.currentUa - b.currentUa);
  return (
    <Stack gap="sm" aria-label="Bench overlay">
      {heading}
      <ResponsiveContainer width="100%" height={280}>
        <ComposedChart data={rows}>
          <CartesianGrid strokeDasharray="3 3" />
          <XAxis
            dataKey="currentUa"
            type="number"
            unit=" µA"
            domain={[0, 'dataMax']}
            tickFormatter={(value: number) => value.toPrecision(3)}
          />
          <YAxis unit=" V" domain={['auto', 'auto']} />
          <Tooltip />
          <Legend />
          <Line
            dataKey="predictedV"
            name="predicted output"
            dot={false}
            connectNulls
            stroke="var(--mantine-color-gray-6)"
            isAnimationActive={false}
          />
          <Scatter
            dataKey="measuredV"
            name="measured output"
            fill="var(--mantine-color-indigo-6)"
            isAnimationActive={false}
          />
        </ComposedChart>
      </ResponsiveContainer>
      <Table aria-label="Deviation per point">
        <Table.Thead>
          <Table.Tr>
            <Table.Th ta="right">Load current</Table.Th>
            <Table.Th ta="right">Measured</Table.Th>
            <Table.Th ta="right">Predicted</Table.Th>
            <Table.Th ta="right">Deviation</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {comparison.points.map((point, i) => (
            <Table.Tr key={i}>
              <Table.Td ta="right">{formatQuantity(point.x, 'A')}</Table.Td>
              <Table.Td ta="right">{formatQuantity(point.measuredV, 'V')}</Table.Td>
              <Table.Td ta="right">{point.predictedV === null ? '—' : formatQuantity(point.predictedV, 'V')}</Table.Td>
              <Table.Td ta="right">{percent(point.deviation)}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Stack>
  );
}
