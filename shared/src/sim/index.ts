export type * from './circuit.types';
export { GROUND_NODE } from './circuit.types';
export { simulateTransient, TransientStepper, DEFAULT_TOLERANCES } from './transient';
export { MnaSystem } from './mna-system';
export { toSpiceNetlist, spiceNodeName } from './to-spice-netlist';
export { buildCircuit } from './design-circuit';
export {
  buildLadderCircuit,
  ladderSpecFromDesign,
  ladderPartFromDesign,
  idealCapacitorVoltagesV,
  capacitorName,
  LADDER_NODES,
} from './build-circuit';
export type { LadderCircuitSpec, LadderDrive } from './build-circuit';
export { downsampleMinMax, windowMean, windowPeakToPeak } from './waveform-measures';
export { findPeriodicSteadyState } from './periodic-steady-state';
export { chargeBalanceCapacitorVoltagesV } from './steady-state-estimate';
export type { PeriodicSteadyStateOptions, PeriodicSteadyStateResult } from './periodic-steady-state';
export { runLadder } from './design-runs';
export { runDriverDesign } from './driver-runs';
export type { DriverRunOptions, DriverRunResult } from './driver-runs';
export { EnergyMeter } from './energy-meter';
export type { EnergyAccount } from './energy-meter';
export type { LadderRunOptions, LadderRunResult, PlotTrace } from './design-runs';
