import type { SimulationTolerances } from './circuit.types';

/** SPICE's default tolerances (reltol, vntol, abstol, chgtol, trtol), and its transient Newton limit raised. */
export const DEFAULT_TOLERANCES: SimulationTolerances = {
  relative: 1e-3,
  voltageAbsoluteV: 1e-6,
  currentAbsoluteA: 1e-12,
  chargeAbsoluteC: 1e-14,
  truncationErrorFactor: 7,
  maxNewtonIterations: 40,
};
