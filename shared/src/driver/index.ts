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
  MethodInfo,
  Estimated,
  DriverCheckVerdict,
} from './driver.types';
export { defaultCellCurves, defaultCellMaxContinuousCurrentA } from './cell-curves';
export { driverExamples } from './driver-examples';
