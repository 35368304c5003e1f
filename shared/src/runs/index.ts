export { runLadder } from './ladder-runs';
export type { LadderRunOptions, LadderRunResult, PlotTrace } from './ladder-runs';
export { runDriverDesign } from './driver-runs';
export type { DriverRunOptions, DriverRunResult } from './driver-runs';
export type { DriverFigures, DriverLossKind } from './driver-runs';
export { runDriverStartUp } from './driver-start-up';
export type { StartUpOptions, StartUpResult } from './driver-start-up';
