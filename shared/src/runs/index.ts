export { runLadder } from './ladder-runs';
export type { LadderRunOptions, LadderRunResult, PlotTrace } from './ladder-runs';
export { runDriverDesign } from './driver-runs';
export type { DriverRunOptions, DriverRunResult } from './driver-runs';
