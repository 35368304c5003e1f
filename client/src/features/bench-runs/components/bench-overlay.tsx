import { Stack, Table, Text } from '@mantine/core';
import type { BenchRunDetail } from '@ladderwright/shared/api';
import type { BenchComparison, MeasuredPoint } from '@ladderwright/shared/bench';
import { formatQuantity } from '@ladderwright/shared/units';
import { chartColors, QuantityChart } from '../../../components/quantity-chart';
import { BenchVerdictBadge } from './bench-verdict-badge';

/** Room beyond the last measured load current, so the last point does not sit on the frame. */
const sweepHeadroom = 1.15;

/**
 * Rows of a load-sweep overlay: the predicted regulation curve over the measured range only (0 to 1.15 × the
 * largest measured current, its end interpolated), so the points fill the plot, and the measured points.
 */
export function loadSweepRows(comparison: Pick<BenchComparison, 'predictedCurve' | 'points'>) {
  const largestA = Math.max(0, ...comparison.points.map((point) => point.x));
  const endA = largestA > 0 ? largestA * sweepHeadroom : Infinity;
  const curve = comparison.predictedCurve;
  const predicted: { currentA: number; predictedV: number }[] = [];
  for (let i = 0; i < curve.length; i += 1) {
    const point = curve[i];
    if (!point) continue;
    if (point.x <= endA) {
      predicted.push({ currentA: point.x, predictedV: point.y });
      continue;
    }
    const before = curve[i - 1];
    if (before && before.x < endA) {
      const fraction = (endA - before.x) / (point.x - before.x);
      predicted.push({ currentA: endA, predictedV: before.y + fraction * (point.y - before.y) });
    }
    break;
  }
  const measured = comparison.points.map((point) => ({ currentA: point.x, measuredV: point.measuredV }));
  return [...predicted, ...measured].sort((a, b) => a.currentA - b.currentA);
}

/** Rows of a capture overlay: the measured magnitude, the predicted mean and the predicted ripple band around it. */
export function captureRows(points: readonly MeasuredPoint[], predictedMeanV: number, predictedRippleV: number) {
  return points.map((point) => ({
    timeS: point.x,
    measuredV: Math.abs(point.y),
    predictedV: predictedMeanV,
    rippleLowV: predictedMeanV - predictedRippleV / 2,
    rippleHighV: predictedMeanV + predictedRippleV / 2,
  }));
}

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
    const predictedMeanV = comparison.figures.find((f) => f.key === 'outputMeanV')?.predicted;
    const predictedRippleV = comparison.figures.find((f) => f.key === 'ripplePeakToPeakV')?.predicted ?? 0;
    const [measuredColor = '', predictedColor = ''] = chartColors.traces;
    return (
      <Stack gap="sm" aria-label="Bench overlay">
        {heading}
        <QuantityChart
          label="Capture against prediction, plot"
          title={run.title ? `${run.title}: capture against prediction` : 'Capture against prediction'}
          heightPx={260}
          data={captureRows(run.points, predictedMeanV ?? NaN, predictedRippleV)}
          x={{ key: 'timeS', title: 'Time', unit: 's' }}
          y={{ title: 'Output magnitude', unit: 'V' }}
          series={[
            { key: 'measuredV', name: 'measured output', color: measuredColor },
            ...(predictedMeanV === undefined
              ? []
              : [{ key: 'predictedV', name: 'predicted mean', color: predictedColor, isDashed: true }]),
          ]}
          bands={
            predictedMeanV === undefined
              ? []
              : [
                  {
                    lowKey: 'rippleLowV',
                    highKey: 'rippleHighV',
                    name: 'predicted ripple (peak-to-peak)',
                    color: predictedColor,
                  },
                ]
          }
          isZoomable
        />
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
  const [measuredColor = '', predictedColor = ''] = chartColors.traces;
  return (
    <Stack gap="sm" aria-label="Bench overlay">
      {heading}
      <QuantityChart
        label="Load sweep against prediction, plot"
        title={run.title ? `${run.title}: load sweep against prediction` : 'Load sweep against prediction'}
        heightPx={280}
        data={loadSweepRows(comparison)}
        x={{ key: 'currentA', title: 'Load current', unit: 'A', includesZero: true }}
        y={{ title: 'Output', unit: 'V' }}
        series={[
          { key: 'predictedV', name: 'predicted output (mean)', color: predictedColor, isDashed: true },
          { key: 'measuredV', name: 'measured output', color: measuredColor, kind: 'points' },
        ]}
      />
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
