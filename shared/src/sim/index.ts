export type * from './circuit.types';
export { GROUND_NODE } from './circuit.types';
export { simulateTransient, TransientStepper, DEFAULT_TOLERANCES } from './transient';
export { MnaSystem } from './mna-system';
export { toSpiceNetlist, spiceNodeName } from './to-spice-netlist';
export { buildCircuit, buildLadderCircuit, ladderSpecFromDesign, idealCapacitorVoltagesV, capacitorName, LADDER_NODES } from './build-circuit';
export type { LadderCircuitSpec, LadderDrive } from './build-circuit';
export { downsampleMinMax, windowMean, windowPeakToPeak } from './waveform-measures';
