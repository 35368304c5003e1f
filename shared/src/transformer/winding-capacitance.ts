import type { MethodInfo } from '../methods';

/** Permittivity of free space (F/m). */
export const EPSILON0 = 8.8541878128e-12;
/** Relative permittivity of polyurethane or polyester enamel and of polyester tape (common practice, no source). */
export const ENAMEL_PERMITTIVITY = 3.5;
export const TAPE_PERMITTIVITY = 3.2;

export const SELF_CAPACITANCE_METHOD: MethodInfo = {
  methodId: 'transformer.self-capacitance-layers',
  summary:
    'Equivalent capacitance of an m-layer winding wound back and forth: C = (4/3)·Cl·(m − 1)/m², Cl = ε0·A/Σ(di/εri) between adjacent layers of area MLT × breadth, each layer of round wire taken as a sheet of its copper area, the gap between the sheets filled by tape, both enamels and air.',
  assumptions: [
    'voltage rising evenly along the winding; turn-to-turn capacitance within a layer neglected',
    'enamel εr 3.5, tape εr 3.2 (common practice, no source)',
  ],
  source:
    'E. C. Snelling, Soft Ferrites: Properties and Applications, 2nd ed., 1988, self-capacitance of layered windings (from memory); the 4(m−1)/(3m²) energy factor follows from a linear voltage along each layer pair',
};

/** Capacitance (F) between two adjacent layers of round wire, as parallel sheets (see SELF_CAPACITANCE_METHOD). */
export function layerCapacitanceF(input: {
  meanTurnLengthM: number;
  breadthM: number;
  copperDiameterM: number;
  overallDiameterM: number;
  tapeM: number;
}): number {
  const enamelM = (input.overallDiameterM - input.copperDiameterM) / 2;
  const airM = input.copperDiameterM * (1 - Math.PI / 4);
  const effectiveM = input.tapeM / TAPE_PERMITTIVITY + (2 * enamelM) / ENAMEL_PERMITTIVITY + airM;
  return (EPSILON0 * input.meanTurnLengthM * input.breadthM) / effectiveM;
}

/** Equivalent self-capacitance (F) of `layers` layers with `layerCapacitance` between neighbours: 4(m−1)/(3m²)·Cl. */
export function multilayerCapacitanceF(layerCapacitance: number, layers: number): number {
  return (4 * (layers - 1) * layerCapacitance) / (3 * layers ** 2);
}
