import type { NpnModel } from '../circuit.types';
import { JUNCTION_GMIN_S, THERMAL_VOLTAGE_V } from './junction';

// Local copies of the junction module's bindings, so a hot call does not go through a module accessor.
const gminS = JUNCTION_GMIN_S;
const thermalVoltageV = THERMAL_VOLTAGE_V;

/** Terminal currents into collector and base, and their derivatives with respect to Vbe and Vbc. */
export interface NpnOperatingPoint {
  collectorA: number;
  baseA: number;
  dCollectorDVbe: number;
  dCollectorDVbc: number;
  dBaseDVbe: number;
  dBaseDVbc: number;
}

/**
 * Ebers–Moll NPN in transport form (J. J. Ebers and J. L. Moll, Proc. IRE 42, 1954; the transport form
 * is the Gummel–Poon model of SPICE with no Early effect, high injection or base resistance):
 * Ic = Is(e^(Vbe/Vt) − e^(Vbc/Vt)) − (Is/βR)(e^(Vbc/Vt) − 1), Ib = (Is/βF)(e^(Vbe/Vt) − 1) + (Is/βR)(e^(Vbc/Vt) − 1),
 * with a gmin shunt across each junction.
 */
export function evaluateNpn(model: NpnModel, vbeV: number, vbcV: number, out: NpnOperatingPoint): void {
  const vt = thermalVoltageV;
  const is = model.saturationCurrentA;
  const ebe = Math.exp(vbeV / vt);
  const ebc = Math.exp(vbcV / vt);
  const ibe = is * (ebe - 1);
  const ibc = is * (ebc - 1);
  const gbe = (is * ebe) / vt;
  const gbc = (is * ebc) / vt;
  const br = model.reverseBeta;
  const bf = model.forwardBeta;
  out.collectorA = ibe - ibc - ibc / br - gminS * vbcV;
  out.dCollectorDVbe = gbe;
  out.dCollectorDVbc = -gbc - gbc / br - gminS;
  out.baseA = ibe / bf + ibc / br + gminS * (vbeV + vbcV);
  out.dBaseDVbe = gbe / bf + gminS;
  out.dBaseDVbc = gbc / br + gminS;
}
