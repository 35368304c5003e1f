export { buildCircuit } from './design-circuit';
export {
  buildLadderCircuit,
  ladderSpecFromDesign,
  ladderPartFromDesign,
  idealCapacitorVoltagesV,
  capacitorName,
  LADDER_NODES,
} from './build-ladder-circuit';
export type { LadderCircuitSpec } from './build-ladder-circuit';
export { buildDriverCircuit, DRIVER_NODES, DRIVER_SUPPLY_SOURCE } from './build-driver-circuit';
export type { DriverCircuitOptions } from './build-driver-circuit';
export { chargeBalanceCapacitorVoltagesV } from './steady-state-estimate';
