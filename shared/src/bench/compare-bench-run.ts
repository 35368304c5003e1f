import { DomainError } from '../errors';
import type {
  CurvePoint,
  BenchComparison,
  BenchKind,
  BenchPrediction,
  BenchVerdict,
  ComparedFigure,
  ComparedPoint,
  MeasuredPoint,
} from './bench.types';

/** Margin (percent of the tolerance) below which a bench verdict is marginal rather than pass; the Checks use the same 20 %. */
export const BENCH_MARGINAL_BELOW_PCT = 20;

/**
 * Linear interpolation of y at `x` on a curve sorted by x (any order is accepted and sorted first).
 * Returns null outside the curve's x range: a bench point beyond the prediction is not compared.
 */
export function interpolateCurve(curve: readonly CurvePoint[], x: number): number | null {
  const sorted = [...curve].sort((a, b) => a.x - b.x);
  const first = sorted[0];
  const last = sorted[sorted.length - 1];
  if (!first || !last || x < first.x || x > last.x) return null;
  for (let i = 1; i < sorted.length; i += 1) {
    const right = sorted[i] as CurvePoint;
    const left = sorted[i - 1] as CurvePoint;
    if (x <= right.x) {
      if (right.x === left.x) return right.y;
      return left.y + ((right.y - left.y) * (x - left.x)) / (right.x - left.x);
    }
  }
  return last.y;
}

/** Relative deviation (measured − predicted)/|predicted|; a zero prediction gives 0 for 0, else ±Infinity. */
export function deviation(measured: number, predicted: number): number {
  if (predicted === 0) return measured === 0 ? 0 : measured > 0 ? Infinity : -Infinity;
  return (measured - predicted) / Math.abs(predicted);
}

/**
 * Verdict of a worst |deviation| against a fractional tolerance, in the Checks' convention for an upper
 * limit: marginPct = (tolerance − worst)/tolerance·100; fail below 0, marginal below 20 %, else pass.
 */
export function benchVerdict(worstDeviation: number, tolerance: number): { verdict: BenchVerdict; marginPct: number } {
  if (!(tolerance > 0)) throw new DomainError('invalid_argument', 'tolerance must be positive', 'tolerance');
  const marginPct = Number.isFinite(worstDeviation) ? ((tolerance - worstDeviation) / tolerance) * 100 : -Infinity;
  const verdict: BenchVerdict = marginPct < 0 ? 'fail' : marginPct < BENCH_MARGINAL_BELOW_PCT ? 'marginal' : 'pass';
  return { verdict, marginPct: Number.isFinite(marginPct) ? marginPct : -100 };
}

/** Time-weighted mean (trapezoids) and peak-to-peak of a capture, in volts; magnitudes of the voltage. */
export function captureFigures(points: readonly MeasuredPoint[]): { meanV: number; ripplePeakToPeakV: number } {
  if (points.length < 2) throw new DomainError('invalid_argument', 'a capture needs at least two samples', 'data');
  let area = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < points.length; i += 1) {
    const point = points[i] as MeasuredPoint;
    const y = Math.abs(point.y);
    min = Math.min(min, y);
    max = Math.max(max, y);
    if (i > 0) {
      const previous = points[i - 1] as MeasuredPoint;
      area += ((Math.abs(previous.y) + y) / 2) * (point.x - previous.x);
    }
  }
  const span = (points[points.length - 1] as MeasuredPoint).x - (points[0] as MeasuredPoint).x;
  const meanV = span > 0 ? area / span : points.reduce((sum, p) => sum + Math.abs(p.y), 0) / points.length;
  return { meanV, ripplePeakToPeakV: max - min };
}

/**
 * Compares measured bench data with the revision's prediction.
 * - load sweep: each (|current|, |voltage|) point against the predicted regulation curve, linearly
 *   interpolated (points outside the curve are listed but not compared);
 * - scope capture: the capture's mean output and peak-to-peak ripple against the predicted mean output
 *   and ripple at the design's load.
 * The verdict takes the worst |deviation| against `tolerance` (fraction) through `benchVerdict`.
 */
export function compareBenchRun(
  kind: BenchKind,
  points: readonly MeasuredPoint[],
  prediction: BenchPrediction,
  tolerance: number,
): BenchComparison {
  let compared: ComparedPoint[] = [];
  let figures: ComparedFigure[] = [];
  if (kind === 'load-sweep') {
    compared = points.map((point) => {
      const x = Math.abs(point.x);
      const measuredV = Math.abs(point.y);
      const predictedV = interpolateCurve(prediction.regulation, x);
      return { x, measuredV, predictedV, deviation: predictedV === null ? null : deviation(measuredV, predictedV) };
    });
  } else {
    const { meanV, ripplePeakToPeakV } = captureFigures(points);
    figures = [
      {
        key: 'outputMeanV',
        measured: meanV,
        predicted: prediction.outputMeanV,
        deviation: deviation(meanV, prediction.outputMeanV),
      },
      {
        key: 'ripplePeakToPeakV',
        measured: ripplePeakToPeakV,
        predicted: prediction.ripplePeakToPeakV,
        deviation: deviation(ripplePeakToPeakV, prediction.ripplePeakToPeakV),
      },
    ];
  }
  const deviations = [
    ...compared.flatMap((point) => (point.deviation === null ? [] : [Math.abs(point.deviation)])),
    ...figures.map((figure) => Math.abs(figure.deviation)),
  ];
  if (deviations.length === 0) {
    throw new DomainError(
      'invalid_argument',
      'No measured point lies within the predicted load range (0 to the short-circuit current); check the current column and its unit',
      'data',
    );
  }
  const worstDeviation = deviations.reduce((worst, d) => (d > worst ? d : worst), 0);
  const { verdict, marginPct } = benchVerdict(worstDeviation, tolerance);
  return {
    kind,
    tolerance,
    points: compared,
    figures,
    predictedCurve: kind === 'load-sweep' ? [...prediction.regulation] : [],
    worstDeviation,
    verdict,
    marginPct,
    comparedCount: deviations.length,
    skippedCount: compared.length - compared.filter((point) => point.deviation !== null).length,
  };
}

function finiteNumber(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/**
 * The predicted output against external load current a load sweep is compared with: for a driver design the
 * joint driver–ladder operating curve (`driver.operatingPoint.curve`: the driver's power and the ladder meet
 * at each load, as the Calibrate panel's model solves it), else the ladder's regulation curve at its fixed
 * drive (`curves.regulation`). Points with non-finite numbers are left out.
 */
export function predictedLoadCurve(report: unknown): CurvePoint[] {
  const body = (report ?? {}) as Record<string, unknown>;
  const driver = (body.driver ?? {}) as Record<string, unknown>;
  const operating = ((driver.operatingPoint ?? {}) as Record<string, unknown>).curve;
  if (Array.isArray(operating) && operating.length >= 2) {
    return (operating as { loadCurrentA?: unknown; outputV?: unknown }[])
      .map((point) => ({ x: point.loadCurrentA, y: point.outputV }))
      .filter((point): point is CurvePoint => finiteNumber(point.x) && finiteNumber(point.y));
  }
  const curves = (body.curves ?? {}) as Record<string, unknown>;
  return Array.isArray(curves.regulation)
    ? (curves.regulation as unknown[]).filter(
        (point): point is CurvePoint =>
          finiteNumber((point as CurvePoint)?.x) && finiteNumber((point as CurvePoint)?.y),
      )
    : [];
}

/**
 * Takes the prediction out of a revision's stored engine report (the predicted load curve, `outputMeanV`,
 * `ripplePeakToPeakV`, `analysis.loadCurrentA`), as magnitudes. Throws when the report lacks them.
 */
export function predictionFromReport(report: unknown): BenchPrediction {
  const body = (report ?? {}) as Record<string, unknown>;
  const analysis = (body.analysis ?? {}) as Record<string, unknown>;
  const regulation = predictedLoadCurve(report);
  if (regulation.length < 2 || !finiteNumber(body.outputMeanV) || !finiteNumber(body.ripplePeakToPeakV)) {
    throw new DomainError('invalid_argument', 'The revision has no predicted output curve to compare with', 'revision');
  }
  return {
    regulation: regulation.map((point) => ({ x: Math.abs(point.x), y: Math.abs(point.y) })),
    outputMeanV: Math.abs(body.outputMeanV),
    ripplePeakToPeakV: Math.abs(body.ripplePeakToPeakV),
    loadCurrentA: finiteNumber(analysis.loadCurrentA) ? Math.abs(analysis.loadCurrentA) : 0,
  };
}
