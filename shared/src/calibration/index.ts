export type {
  CalibrationCurve,
  CalibrationDataUse,
  CalibrationDataset,
  CalibrationModelKind,
  CalibrationParameterId,
  CalibrationResult,
  ChosenParameter,
  DatasetResidual,
  FittedParameter,
  IdentifiabilityWarning,
  PriorRange,
} from './calibration.types';
export {
  applicableParameters,
  applyParameterValues,
  checkChosenParameters,
  uncertainParameter,
  uncertainParameters,
} from './uncertain-parameters';
export type { UncertainParameter } from './uncertain-parameters';
export {
  checkCalibrationData,
  MAX_CALIBRATION_RUNS,
  MAX_POINTS_PER_RUN,
  MIN_POINTS_PER_RUN,
  thinPoints,
  usesOfBenchKind,
} from './calibration-data';
export {
  dischargeSimulation,
  fittedValueOf,
  loadSweepEstimate,
  modelKindOf,
  predictDataset,
  START_UP_MAX_WINDOW_S,
  startUpSimulation,
  waveformProbeOf,
} from './calibration-models';
export {
  alignedWaveform,
  simulatedWaveform,
  WAVEFORM_MAX_PERIODS,
  WAVEFORM_MIN_PERIODS,
  WAVEFORM_RELATIVE_TOLERANCE,
  WAVEFORM_SETTLE_PERIODS,
  waveformSimulation,
} from './waveform-model';
export type { WaveformProbe } from './waveform-model';
export type { SimulatorRunOptions } from './calibration-models';
export { fitParameters, leastSquaresCost, secantJacobian, toU, toValue } from './fit-parameters';
export { profileIntervals } from './profile-intervals';
export type { ProfileInput, ProfileInterval } from './profile-intervals';
export type { BatchModel, FitOptions, FitOutcome, FitParameter } from './fit-parameters';
export { CORRELATION_WARNING, fitStatistics, invertMatrix } from './fit-statistics';
export type { FitStatistics } from './fit-statistics';
export { regularizedBeta, studentTCdf, studentTCritical } from './student-t';
export {
  calibrateDesign,
  calibratedDesign,
  DEFAULT_CONFIDENCE,
  inProcessPredictor,
  predictDatasets,
  preparedDatasets,
} from './calibrate-design';
export type { CalibrationInput, DesignBatchPredictor } from './calibrate-design';
