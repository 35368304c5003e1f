import type { DiodeModel } from '../circuit.types';
import { criticalVoltageV, JUNCTION_GMIN_S, limitJunctionVoltage, THERMAL_VOLTAGE_V } from './junction';

// Local copies of the junction module's bindings, so a hot call does not go through a module accessor.
const gminS = JUNCTION_GMIN_S;
const thermalVoltageV = THERMAL_VOLTAGE_V;
const limitJunction = limitJunctionVoltage;
const criticalV = criticalVoltageV;

export interface DiodeOperatingPoint {
  currentA: number;
  conductanceS: number;
}

/**
 * Junction current and its derivative of a Shockley diode, I = Is·(exp(V/(n·Vt)) − 1), with the SPICE
 * treatment below −3·n·Vt (a cubic that tends to −Is), an exponential reverse breakdown knee at −BV
 * carrying the breakdown current there, and a gmin shunt. Series resistance is a separate element.
 */
export function evaluateDiode(model: DiodeModel, voltageV: number, out: DiodeOperatingPoint): void {
  const vte = model.emissionCoefficient * thermalVoltageV;
  const is = model.saturationCurrentA;
  let i: number;
  let g: number;
  if (voltageV >= -3 * vte) {
    const e = Math.exp(voltageV / vte);
    i = is * (e - 1);
    g = (is * e) / vte;
  } else {
    const arg = (3 * vte) / (voltageV * Math.E);
    const arg3 = arg * arg * arg;
    i = -is * (1 + arg3);
    g = (is * 3 * arg3) / voltageV;
    const bv = model.breakdownVoltageV;
    if (bv !== undefined && bv > 0) {
      const ibv = model.breakdownCurrentA ?? 1e-3;
      const eb = Math.exp(-(bv + voltageV) / vte);
      i -= ibv * eb;
      g += (ibv * eb) / vte;
    }
  }
  out.currentA = i + gminS * voltageV;
  out.conductanceS = g + gminS;
}

/**
 * Current of a diode with its series resistance at terminal voltage u: solves v + Rs·I(v) = u for the
 * junction voltage v by scalar Newton (limited as in pnjlim; the left side rises with slope ≥ 1).
 */
export function seriesDiodeCurrentA(model: DiodeModel, terminalV: number, out: DiodeOperatingPoint): number {
  const rs = model.seriesResistanceOhm;
  const vte = model.emissionCoefficient * thermalVoltageV;
  const vcrit = criticalV(model.saturationCurrentA, vte);
  let v = terminalV <= vcrit ? terminalV : vcrit;
  for (let k = 0; k < 200; k++) {
    evaluateDiode(model, v, out);
    const step = (terminalV - v - rs * out.currentA) / (1 + rs * out.conductanceS);
    const next = limitJunction(v + step, v, vte, vcrit);
    const isDone = Math.abs(next - v) <= 1e-12 * (1 + Math.abs(v));
    v = next;
    if (isDone) break;
  }
  evaluateDiode(model, v, out);
  return out.currentA;
}
