export type {
  CellChemistry,
  CellCurvePoint,
  CellsSupply,
  DcSupply,
  DriverSupply,
  DriverTransformer,
  DriverTransistor,
  DriverClamp,
  DriverStage,
} from '../designs/driver-stage.types';
export type { MethodInfo, Estimated } from '../methods';
export { defaultCellCurves, defaultCellMaxContinuousCurrentA, defaultCellRateModels } from './cell-curves';
export type { CellRateModel } from './cell-curves';
export { driverExamples } from '../designs/driver-examples';
export {
  batteryLife,
  cellCurveOf,
  cellInternalResistanceOhm,
  cellRateModelOf,
  peukertEquivalentCurrentA,
  cellOpenCircuitVoltageV,
  cellMaxContinuousCurrentA,
  supplyThevenin,
} from './battery';
export type { BatteryLifeResult } from './battery';
export { estimateBlockingOscillator } from './blocking-oscillator';
export type {
  BlockingOscillatorEstimate,
  BlockingOscillatorOptions,
  OnTimeLimit,
  OscillatorNumbers,
  StageLosses,
} from './blocking-oscillator.types';
export { driverOperatingPoint, isFlybackFed, solveLoadPoint, OPERATING_POINT_METHOD } from './operating-point';
export { engineLadderLoadLine, pulseDriveOf, secondaryLoadOf } from './ladder-load-line';
export { rcdClampPartsOf } from './rcd-clamp';
export type { RcdClampParts } from './rcd-clamp';
export { ringBack, secondaryLoadCapacitanceF } from './ring-back';
export type { RingBack, SecondaryLoad } from './ring-back';
export type { LoadPoint, OperatingLimit, OperatingPointResult } from './operating-point';
export type { LadderDrive, LadderLoadLine, LadderState } from './ladder-load-line';
export { driverReport } from './driver-report';
export type { BenchLossKind, DriverBenchFigures, DriverFigures, DriverReport } from './driver-report';
export { runDriverChecks } from './driver-checks';
export type { DriverChecksInput, DriverChecksResult, DriverCheckVerdict } from './driver-checks';
export {
  driverEnergy,
  DEFAULT_CLAMP_RATED_POWER_W,
  DEFAULT_TRANSISTOR_THERMAL,
  DRIVER_ENERGY_METHOD,
} from './driver-energy';
export type { DriverEnergy, LossKind, TransistorThermal } from './driver-energy';
export { compareWithSimulation, estimateValidity, ESTIMATE_VALIDITY_BOUNDS } from './estimate-validity';
export type { EstimateValidity, FigureComparison } from './estimate-validity';
