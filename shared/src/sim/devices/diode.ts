import type { DiodeModel } from '../circuit.types';
import { JUNCTION_GMIN_S, THERMAL_VOLTAGE_V } from './junction';

// Local copies of the junction module's bindings, so a hot call does not go through a module accessor.
const gminS = JUNCTION_GMIN_S;
const thermalVoltageV = THERMAL_VOLTAGE_V;

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
 * Junction voltage v of a diode with series resistance Rs at terminal voltage u: the root of
 * v + Rs·I(v) = u, which lies between 0 and u and, since |I| ≤ |u|/Rs there, within the voltages where
 * the forward exponential or the breakdown knee carries |u|/Rs. Newton from the guess inside that bracket,
 * falling back to bisection whenever a step leaves it (so no exponential is ever evaluated out of range).
 * Leaves `out` at the root.
 */
export function solveSeriesJunctionV(
  model: DiodeModel,
  terminalV: number,
  guessV: number,
  out: DiodeOperatingPoint,
): number {
  const rs = model.seriesResistanceOhm;
  const vte = model.emissionCoefficient * thermalVoltageV;
  const u = terminalV;
  let lo = Math.min(u, 0);
  let hi = Math.max(u, 0);
  if (u > 0) hi = Math.min(hi, vte * Math.log1p(u / (rs * model.saturationCurrentA)));
  const bv = model.breakdownVoltageV;
  if (u < 0 && bv !== undefined && bv > 0)
    lo = Math.max(lo, -bv - vte * Math.log1p(-u / (rs * (model.breakdownCurrentA ?? 1e-3))));
  let v = Math.min(hi, Math.max(lo, guessV));
  const tolerance = 1e-12 * (1 + Math.abs(u));
  for (let k = 0; k < 200; k++) {
    evaluateDiode(model, v, out);
    const residual = v + rs * out.currentA - u;
    if (Math.abs(residual) <= tolerance) return v;
    if (residual > 0) hi = v;
    else lo = v;
    let next = v - residual / (1 + rs * out.conductanceS);
    if (!(next >= lo && next <= hi)) next = 0.5 * (lo + hi);
    if (hi - lo <= tolerance) break;
    v = next;
  }
  evaluateDiode(model, v, out);
  return v;
}

/** Current of a diode with its series resistance at terminal voltage u (see solveSeriesJunctionV). */
export function seriesDiodeCurrentA(model: DiodeModel, terminalV: number, out: DiodeOperatingPoint): number {
  solveSeriesJunctionV(model, terminalV, 0, out);
  return out.currentA;
}
