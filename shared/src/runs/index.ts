export { runLadder } from './ladder-runs';
export type { LadderRunOptions, LadderRunResult, PlotTrace } from './ladder-runs';
export { runDriverDesign } from './driver-runs';
export type { DriverRunOptions, DriverRunResult } from './driver-run.types';
export type { DriverFigures, DriverLossKind } from './driver-run.types';
export { runDriverStartUp } from './driver-start-up';
export type { StartUpOptions, StartUpResult } from './driver-start-up';
