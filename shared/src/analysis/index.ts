export {
  analyzeDesign,
  analyzeLadderReport,
  evaluateChecks,
  resolveDrive,
  ladderInputOf,
  ratedPoint,
} from './analyze-design';
export type { DesignReport, LadderReport, LadderReportOptions, RatedPoint } from './analyze-design';
export { headlineSource, LADDER_ESTIMATE_TOLERANCE } from './simulated-figures';
export {
  estimateHeadline,
  IRREGULAR_OSCILLATION_NOTE,
  simulationSourceLabel,
  STORED_SIMULATION_METHOD,
} from './figure-source';
export type { ComparedFigure, FigureDifference, FigureSource, HeadlineSource, SimulatedFigures } from './figure-source';
export { driverSizerFigures, withTransformerSection } from './transformer-sizer-inputs';
export { checksWorsenedBySection, sectionAssessor } from './section-on-design';
export type { WorsenedCheck } from './section-on-design';
export type { DriverSizerFigures } from './transformer-sizer-inputs';
export { startingTransformer } from './transformer-start';
export type { MagneticsKinds, StartingTransformer } from './transformer-start';
