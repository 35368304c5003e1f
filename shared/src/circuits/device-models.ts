import type { DiodeModel, NpnModel } from '../sim/circuit.types';
import { TRANSISTOR_MODEL_DEFAULTS } from '../designs/device-defaults';
import type { DriverTransistor } from '../designs/driver-stage.types';

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
 * its SPICE name (NpnModel), a field left out at TRANSISTOR_MODEL_DEFAULTS, and no Early effect without VAF.
 */
export function npnModelOf(q: DriverTransistor): NpnModel {
  const model: NpnModel = { ...TRANSISTOR_MODEL_DEFAULTS, forwardBeta: q.forwardBeta, reverseBeta: q.reverseBeta };
  for (const key of [
    ...(Object.keys(TRANSISTOR_MODEL_DEFAULTS) as Array<keyof typeof TRANSISTOR_MODEL_DEFAULTS>),
    'earlyVoltageV',
  ] as const) {
    const value = q[key];
    if (value !== undefined) model[key] = value;
  }
  return model;
}
