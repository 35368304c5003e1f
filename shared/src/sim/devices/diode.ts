import type { DiodeModel } from '../circuit.types';
import { JUNCTION_GMIN_S, THERMAL_VOLTAGE_V } from './junction';

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
  const vte = model.emissionCoefficient * THERMAL_VOLTAGE_V;
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
  out.currentA = i + JUNCTION_GMIN_S * voltageV;
  out.conductanceS = g + JUNCTION_GMIN_S;
}
