export type * from './circuit.types';
export { GROUND_NODE } from './circuit.types';
export { simulateTransient, TransientStepper, DEFAULT_TOLERANCES } from './transient';
export { MnaSystem } from './mna-system';
export { toSpiceNetlist, spiceNodeName } from './to-spice-netlist';
export { buildCircuit } from '../circuits/design-circuit';
export {
  buildLadderCircuit,
  ladderSpecFromDesign,
  ladderPartFromDesign,
  idealCapacitorVoltagesV,
  capacitorName,
  LADDER_NODES,
} from '../circuits/build-ladder-circuit';
export type { LadderCircuitSpec, LadderDrive } from '../circuits/build-ladder-circuit';
export { downsampleMinMax, windowMean, windowPeakToPeak } from './waveform-measures';
export { findPeriodicSteadyState } from './periodic-steady-state';
export { chargeBalanceCapacitorVoltagesV } from '../circuits/steady-state-estimate';
export type { PeriodicSteadyStateOptions, PeriodicSteadyStateResult } from './periodic-steady-state';
export { runLadder } from '../runs/ladder-runs';
export { runDriverDesign } from '../runs/driver-runs';
export type { DriverRunOptions, DriverRunResult } from '../runs/driver-runs';
export { EnergyMeter } from './energy-meter';
export type { EnergyAccount } from './energy-meter';
export type { LadderRunOptions, LadderRunResult, PlotTrace } from '../runs/ladder-runs';
