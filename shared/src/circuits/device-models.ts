import type { DiodeModel, NpnModel } from '../sim/circuit.types';
import type { DriverTransistor } from '../designs/driver-stage.types';

/** Transistor junction capacitances when the design gives none (SPICE CJE, CJC of a small switching NPN; from memory). */
export const DEFAULT_CJE_F = 10e-12;
export const DEFAULT_CJC_F = 5e-12;

/** Ebers–Moll saturation current when the design gives none (a small-signal NPN; from memory). */
export const DEFAULT_NPN_SATURATION_CURRENT_A = 1e-14;

/** The junction fields a design gives a diode (the ladder's, a clamp's): SPICE CJO, VJ, M, BV, IBV. */
export interface DiodeJunctionFields {
  junctionCapacitanceF?: number;
  junctionPotentialV?: number;
  gradingCoefficient?: number;
  breakdownVoltageV?: number;
  breakdownCurrentA?: number;
}

/**
 * A diode's simulator model: its Shockley part and each junction field of the design one to one, a field the
 * design leaves out left out (SPICE's default: no capacitance, VJ 1 V, M 0.5, no breakdown, IBV 1 mA).
 */
export function diodeModelOf(
  shockley: Pick<DiodeModel, 'saturationCurrentA' | 'emissionCoefficient' | 'seriesResistanceOhm'>,
  fields: DiodeJunctionFields,
): DiodeModel {
  const model: DiodeModel = {
    saturationCurrentA: shockley.saturationCurrentA,
    emissionCoefficient: shockley.emissionCoefficient,
    seriesResistanceOhm: shockley.seriesResistanceOhm,
  };
  if (fields.junctionCapacitanceF) {
    model.junctionCapacitanceF = fields.junctionCapacitanceF;
    if (fields.junctionPotentialV !== undefined) model.junctionPotentialV = fields.junctionPotentialV;
    if (fields.gradingCoefficient !== undefined) model.gradingCoefficient = fields.gradingCoefficient;
  }
  if (fields.breakdownVoltageV !== undefined) {
    model.breakdownVoltageV = fields.breakdownVoltageV;
    if (fields.breakdownCurrentA !== undefined) model.breakdownCurrentA = fields.breakdownCurrentA;
  }
  return model;
}

/**
 * The transistor's simulator model (a Gummel–Poon subset, sim/devices/bjt.ts): each field of the design under
 * its SPICE name (NpnModel), the junction capacitances at the defaults above when absent and every other
 * optional field at SPICE's own default (no Early effect, transit time or terminal resistance).
 */
export function npnModelOf(q: DriverTransistor): NpnModel {
  const model: NpnModel = {
    saturationCurrentA: q.saturationCurrentA ?? DEFAULT_NPN_SATURATION_CURRENT_A,
    forwardBeta: q.forwardBeta,
    reverseBeta: q.reverseBeta,
    baseEmitterCapacitanceF: q.baseEmitterCapacitanceF ?? DEFAULT_CJE_F,
    baseCollectorCapacitanceF: q.baseCollectorCapacitanceF ?? DEFAULT_CJC_F,
  };
  const optional = [
    'baseEmitterPotentialV',
    'baseEmitterGrading',
    'baseCollectorPotentialV',
    'baseCollectorGrading',
    'earlyVoltageV',
    'forwardTransitTimeS',
    'reverseTransitTimeS',
    'baseResistanceOhm',
    'collectorResistanceOhm',
    'emitterResistanceOhm',
  ] as const;
  for (const key of optional) {
    const value = q[key];
    if (value !== undefined) model[key] = value;
  }
  return model;
}
