export { sizeLadder } from './size-ladder';
export type {
  SizerRequest,
  SizerResult,
  SizerCandidate,
  CapacitorOption,
  DiodeOption,
  ResistorOption,
} from './size-ladder';
export { spreadStatistics, toleranceSpread } from './tolerance-spread';
export { BATCH_MAX_MEMBERS, monteCarloDesigns, sweepDesigns } from './design-variants';
export type { DesignVariant } from './design-variants';
export type { ToleranceSpreadRequest, ToleranceSpreadResult, SpreadStatistics, HistogramBin } from './tolerance-spread';
export { mulberry32, normalFrom } from './seeded-random';
export {
  sizeDriverSupply,
  designOf as driverSizerDesign,
  DRIVER_SIZER_DEFAULTS,
  DRIVER_SIZER_METHOD,
} from './size-driver-supply';
export type { DriverSizerCandidate, DriverSizerRequest, DriverSizerResult } from './size-driver-supply';
