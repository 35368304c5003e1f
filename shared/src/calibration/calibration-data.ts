import type { BenchKind } from '../bench/bench.types';
import type { Design } from '../designs/design.types';
import { DomainError } from '../errors';
import { loadSweepEstimate, START_UP_MAX_WINDOW_S, waveformProbeOf } from './calibration-models';
import { driverPeriodGuessS } from '../runs/driver-design-circuit';
import { withEffectiveTransformer } from '../transformer/given-numbers';
import { WAVEFORM_MAX_PERIODS, WAVEFORM_MIN_PERIODS } from './waveform-model';
import type { CalibrationDataUse, CalibrationDataset } from './calibration.types';

/** Fewest points of one run a fit reads: a curve needs a few points to show its shape. Common practice, no source. */
export const MIN_POINTS_PER_RUN = 4;
/** Most runs one calibration fits at once (each adds model evaluations). */
export const MAX_CALIBRATION_RUNS = 8;
/** Most points one run contributes; a longer capture is thinned evenly to this many. */
export const MAX_POINTS_PER_RUN = 400;
/** A run whose values sit this factor or more away from the prediction is taken as a unit mistake. */
const UNIT_MISMATCH_FACTOR = 8;

/** Which bench-run kinds can be read as which curve. */
export function usesOfBenchKind(kind: BenchKind): CalibrationDataUse[] {
  return kind === 'load-sweep' ? ['load-sweep'] : ['start-up', 'discharge', 'collector-waveform', 'secondary-waveform'];
}

function columns(use: CalibrationDataUse): { x: string; y: string } {
  return use === 'load-sweep' ? { x: 'current', y: 'voltage' } : { x: 'time', y: 'voltage' };
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

/** At most `limit` points taken evenly over the run, first and last kept. */
export function thinPoints<T>(points: readonly T[], limit = MAX_POINTS_PER_RUN): T[] {
  if (points.length <= limit) return [...points];
  return Array.from({ length: limit }, (_, i) => points[Math.round((i * (points.length - 1)) / (limit - 1))] as T);
}

/**
 * A waveform capture spans WAVEFORM_MIN_PERIODS to WAVEFORM_MAX_PERIODS of the design's oscillation period
 * (its guess); a span far outside says the time column's unit is wrong. The design needs a driver stage.
 */
function checkWaveformSpan(design: Design, spanS: number, fail: (message: string) => never): void {
  const effective = withEffectiveTransformer(design);
  if (effective.drive.kind !== 'driver') fail('a waveform fit needs a design with a driver stage');
  else {
    const periodS = driverPeriodGuessS(effective.drive.driver);
    if (spanS < WAVEFORM_MIN_PERIODS * periodS || spanS > WAVEFORM_MAX_PERIODS * periodS) {
      fail(
        `the capture spans ${spanS.toPrecision(3)} s against an oscillation period near ${periodS.toPrecision(3)} s; a waveform fit reads ${WAVEFORM_MIN_PERIODS} to ${WAVEFORM_MAX_PERIODS} periods (check the time unit, or cut the capture to one cycle)`,
      );
    }
  }
}

/**
 * Checks the runs of a calibration before any fit, so that bad data are a clear error and never a failed
 * job: each run has enough points, its time runs forward (start-up, discharge), and its values fit the
 * quantity at the scale the design predicts (a voltage in kV read as V, a current in µA read as A, a
 * time in ms read as s). Each error is a DomainError('invalid_argument') whose field is `runs[i]` and
 * whose message names the run and the column. `parameterCount` sets the fewest points in all.
 */
export function checkCalibrationData(
  design: Design,
  datasets: readonly CalibrationDataset[],
  parameterCount: number,
): void {
  if (datasets.length === 0) throw new DomainError('invalid_argument', 'Choose at least one bench run to fit', 'runs');
  if (datasets.length > MAX_CALIBRATION_RUNS) {
    throw new DomainError('invalid_argument', `A calibration fits at most ${MAX_CALIBRATION_RUNS} runs`, 'runs');
  }
  let total = 0;
  datasets.forEach((dataset, i) => {
    const field = `runs[${i}]`;
    const { x: xColumn, y: yColumn } = columns(dataset.use);
    const fail = (column: string, message: string): never => {
      throw new DomainError('invalid_argument', `Bench run '${dataset.label}', column ${column}: ${message}`, field);
    };
    const points = dataset.points;
    if (points.length < MIN_POINTS_PER_RUN) {
      fail(yColumn, `${points.length} point(s); a fit needs at least ${MIN_POINTS_PER_RUN} per run`);
    }
    points.forEach((point, k) => {
      if (!Number.isFinite(point.x)) fail(xColumn, `point ${k + 1} is not a finite number`);
      if (!Number.isFinite(point.y)) fail(yColumn, `point ${k + 1} is not a finite number`);
    });
    total += points.length;
    const measuredV = points.map((point) => Math.abs(point.y));
    if (dataset.use !== 'load-sweep') {
      for (let k = 1; k < points.length; k += 1) {
        if (!((points[k] as { x: number }).x > (points[k - 1] as { x: number }).x)) {
          fail(xColumn, `time does not increase at point ${k + 1}; a ${dataset.use} curve needs rising time`);
        }
      }
      const spanS = (points[points.length - 1] as { x: number }).x - (points[0] as { x: number }).x;
      if (dataset.use === 'start-up' && (points[points.length - 1] as { x: number }).x > START_UP_MAX_WINDOW_S) {
        fail(
          xColumn,
          `the curve runs to ${(points[points.length - 1] as { x: number }).x} s; a start-up fit simulates at most ${START_UP_MAX_WINDOW_S} s (check the time unit, or cut the file)`,
        );
      }
      if (dataset.use === 'start-up' && (points[0] as { x: number }).x < 0) {
        fail(xColumn, 'time starts before 0; a start-up curve starts at the push-button (t = 0)');
      }
      if (waveformProbeOf(dataset.use)) checkWaveformSpan(design, spanS, (message) => fail(xColumn, message));
      if (dataset.use === 'discharge') {
        const bleeder = design.outputNetwork.bleeder;
        const capacitanceF = design.multiplier.capacitors.reduce((sum, c) => sum + c.valueF, 0);
        const tauS = bleeder ? bleeder.count * bleeder.valueOhm * capacitanceF : Infinity;
        if (spanS > UNIT_MISMATCH_FACTOR * 100 * tauS || spanS < tauS / (UNIT_MISMATCH_FACTOR * 1000)) {
          fail(
            xColumn,
            `the curve spans ${spanS.toPrecision(3)} s against a bleeder time constant near ${tauS.toPrecision(3)} s; check the time unit`,
          );
        }
        if ((measuredV[measuredV.length - 1] as number) >= (measuredV[0] as number)) {
          fail(yColumn, 'the voltage does not fall; a discharge curve starts at switch-off');
        }
      }
    }
    if (dataset.use === 'load-sweep') {
      const predictedV = loadSweepEstimate(
        design,
        points.map((point) => Math.abs(point.x)),
      );
      const positive = predictedV.filter((v) => v > 0).length;
      if (positive < Math.min(MIN_POINTS_PER_RUN, points.length)) {
        fail(xColumn, 'most currents lie beyond what the design can deliver; check the current unit (A, mA, uA)');
      }
      const ratio = median(measuredV) / median(predictedV.filter((v) => v > 0));
      if (!(ratio < UNIT_MISMATCH_FACTOR && ratio > 1 / UNIT_MISMATCH_FACTOR)) {
        fail(
          yColumn,
          `the voltages are about ${ratio.toPrecision(2)} times the prediction; check the voltage unit (V, kV)`,
        );
      }
    }
  });
  if (total <= parameterCount + 1) {
    throw new DomainError(
      'invalid_argument',
      `${total} points in all cannot fit ${parameterCount} parameters; add runs or choose fewer parameters`,
      'runs',
    );
  }
}
