export { benchLimits, benchTextIssue } from './bench-limits';
export { readMeasurementTable } from './read-measurement-table';
export {
  compareBenchRun,
  interpolateCurve,
  deviation,
  benchVerdict,
  captureFigures,
  predictedLoadCurve,
  predictionFromReport,
  BENCH_MARGINAL_BELOW_PCT,
} from './compare-bench-run';
export type {
  BenchKind,
  MeasuredPoint,
  MeasurementColumn,
  MeasurementTable,
  BenchPrediction,
  CurvePoint,
  BenchVerdict,
  ComparedPoint,
  ComparedFigure,
  BenchComparison,
} from './bench.types';
