import { Alert, Stack, Table, Text } from '@mantine/core';
import { formatParameterValue, intervalMethodWords, intervalRangeText } from '@ladderwright/shared/api';
import type { CalibrationCurve, CalibrationResult } from '@ladderwright/shared/calibration';
import { formatQuantity } from '@ladderwright/shared/units';
import { chartColors, QuantityChart } from '../../../components/quantity-chart';

const USE_WORDS: Record<CalibrationCurve['use'], string> = {
  'load-sweep': 'load sweep',
  'start-up': 'start-up',
  discharge: 'discharge',
  'collector-waveform': 'collector waveform',
  'secondary-waveform': 'secondary waveform',
};

/** Rows of an overlay: measured points, the design's prediction and the calibrated model's, by x. */
export function calibrationCurveRows(curve: CalibrationCurve) {
  return curve.x
    .map((x, i) => ({
      x,
      measuredV: curve.measuredV[i],
      predictedV: curve.predictedV[i],
      calibratedV: curve.calibratedV[i],
    }))
    .sort((a, b) => a.x - b.x);
}

function CurveOverlay({ curve }: { curve: CalibrationCurve }) {
  const [measuredColor = '', predictedColor = '', calibratedColor = ''] = chartColors.traces;
  const isSweep = curve.use === 'load-sweep';
  return (
    <QuantityChart
      label={`${curve.label}: measured, predicted and calibrated, plot`}
      title={`${curve.label} (${USE_WORDS[curve.use]}): measured, predicted and calibrated`}
      heightPx={260}
      data={calibrationCurveRows(curve)}
      x={
        isSweep
          ? { key: 'x', title: 'Load current', unit: 'A', includesZero: true }
          : { key: 'x', title: 'Time', unit: 's', includesZero: true }
      }
      y={{ title: 'Output', unit: 'V' }}
      series={[
        { key: 'predictedV', name: 'predicted (design values)', color: predictedColor, isDashed: true },
        { key: 'calibratedV', name: 'calibrated model', color: calibratedColor },
        { key: 'measuredV', name: 'measured', color: measuredColor, kind: 'points' },
      ]}
    />
  );
}

/** The fitted values with their intervals, the residuals before and after, warnings and the overlays. */
export function CalibrationResultView({ result }: { result: CalibrationResult }) {
  const confidencePct = (result.confidence * 100).toFixed(0);
  return (
    <Stack gap="md" aria-label="Calibration result">
      {result.warnings.map((warning, i) => (
        <Alert
          key={i}
          color="ember"
          title={warning.kind === 'correlated' ? 'Not separately identifiable' : 'Not determined'}
        >
          {warning.message}
        </Alert>
      ))}
      {!result.isConverged && (
        <Alert color="ember" title="Stopped before converging">
          The fit used its iteration budget; the values are the best found so far.
        </Alert>
      )}
      <Table aria-label="Fitted parameters">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Parameter</Table.Th>
            <Table.Th ta="right">Design value</Table.Th>
            <Table.Th ta="right">Fitted</Table.Th>
            <Table.Th ta="right">{confidencePct} % interval</Table.Th>
            <Table.Th>Interval from</Table.Th>
            <Table.Th ta="right">Prior range</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {result.parameters.map((parameter) => (
            <Table.Tr key={parameter.id}>
              <Table.Td>{parameter.label}</Table.Td>
              <Table.Td ta="right">{formatParameterValue(parameter.initialValue, parameter.unit)}</Table.Td>
              <Table.Td ta="right">
                {formatParameterValue(parameter.value, parameter.unit)}
                {parameter.isAtBound ? ' (at a bound)' : ''}
              </Table.Td>
              <Table.Td ta="right">{intervalRangeText(parameter)}</Table.Td>
              <Table.Td>{parameter.interval ? intervalMethodWords(parameter) : '—'}</Table.Td>
              <Table.Td ta="right">
                {formatParameterValue(parameter.prior.min, parameter.unit)} to{' '}
                {formatParameterValue(parameter.prior.max, parameter.unit)}
              </Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
      <Table aria-label="Residual per run">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Bench run</Table.Th>
            <Table.Th>Model</Table.Th>
            <Table.Th ta="right">Points</Table.Th>
            <Table.Th ta="right">Residual before (rms)</Table.Th>
            <Table.Th ta="right">Residual after (rms)</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {result.residuals.map((residual) => (
            <Table.Tr key={residual.benchRunId}>
              <Table.Td>
                {residual.label} ({USE_WORDS[residual.use]})
              </Table.Td>
              <Table.Td>{residual.model === 'estimate' ? 'estimate' : 'simulator'}</Table.Td>
              <Table.Td ta="right">{residual.pointCount}</Table.Td>
              <Table.Td ta="right">{formatQuantity(residual.rmsBeforeV, 'V')}</Table.Td>
              <Table.Td ta="right">{formatQuantity(residual.rmsAfterV, 'V')}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
      {result.parameters.length > 1 && (
        <Table aria-label="Correlation of the fitted parameters">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Correlation</Table.Th>
              {result.parameters.map((parameter) => (
                <Table.Th key={parameter.id} ta="right">
                  {parameter.label}
                </Table.Th>
              ))}
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {result.parameters.map((parameter, i) => (
              <Table.Tr key={parameter.id}>
                <Table.Td>{parameter.label}</Table.Td>
                {result.parameters.map((other, j) => {
                  const r = result.correlation[i]?.[j];
                  return (
                    <Table.Td key={other.id} ta="right">
                      {r === undefined || r === null || Number.isNaN(r) ? '—' : r.toFixed(3)}
                    </Table.Td>
                  );
                })}
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
      <Text size="xs" c="dimmed">
        {result.iterations} steps, {result.evaluations} model runs, {result.degreesOfFreedom} degrees of freedom.
        Intervals: Jacobian, linearized is ±t·se at the optimum; profile likelihood is read from the cost refitted with
        the parameter held (waveform fits).
      </Text>
      {result.curves.map((curve) => (
        <CurveOverlay key={curve.benchRunId} curve={curve} />
      ))}
    </Stack>
  );
}
