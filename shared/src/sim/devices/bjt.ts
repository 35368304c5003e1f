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
  /** Forward diffusion current Is(e^(Vbe/Vt) − 1)/qb and its derivatives (the TF charge is TF times it). */
  forwardA: number;
  dForwardDVbe: number;
  dForwardDVbc: number;
  /** Reverse diffusion current Is(e^(Vbc/Vt) − 1) and its derivative (the TR charge is TR times it). */
  reverseA: number;
  dReverseDVbc: number;
}

/** An operating point with every field zero, to be filled by evaluateNpn. */
export function emptyNpnOperatingPoint(): NpnOperatingPoint {
  return {
    collectorA: 0,
    baseA: 0,
    dCollectorDVbe: 0,
    dCollectorDVbc: 0,
    dBaseDVbe: 0,
    dBaseDVbc: 0,
    forwardA: 0,
    dForwardDVbe: 0,
    dForwardDVbc: 0,
    reverseA: 0,
    dReverseDVbc: 0,
  };
}

/**
 * Gummel–Poon NPN as SPICE has it (H. K. Gummel and H. C. Poon, Bell Syst. Tech. J. 49, 1970; L. W. Nagel,
 * SPICE2, UCB ERL-M520, 1975), at the internal junction voltages, with ideal junctions (NF = NR = 1, no
 * ISE/ISC leakage, no high-level injection) and the forward Early effect only: base charge
 * qb = 1/(1 − Vbc/VAF), Ic = Is(e^(Vbe/Vt) − e^(Vbc/Vt))/qb − (Is/βR)(e^(Vbc/Vt) − 1),
 * Ib = (Is/βF)(e^(Vbe/Vt) − 1) + (Is/βR)(e^(Vbc/Vt) − 1), with a gmin shunt across each junction. Without
 * VAF (qb = 1) it is the Ebers–Moll transport model (J. J. Ebers and J. L. Moll, Proc. IRE 42, 1954).
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
  const vaf = model.earlyVoltageV;
  // 1/qb and d(qb)/dVbc / qb; qb = 1 without an Early voltage.
  let inverseQb = 1;
  let dLogQbDVbc = 0;
  if (vaf !== undefined && vaf > 0) {
    inverseQb = 1 - vbcV / vaf;
    dLogQbDVbc = 1 / (vaf * inverseQb);
  }
  const transport = (ibe - ibc) * inverseQb;
  out.collectorA = transport - ibc / br - gminS * vbcV;
  out.dCollectorDVbe = gbe * inverseQb;
  out.dCollectorDVbc = -gbc * inverseQb - transport * dLogQbDVbc - gbc / br - gminS;
  out.baseA = ibe / bf + ibc / br + gminS * (vbeV + vbcV);
  out.dBaseDVbe = gbe / bf + gminS;
  out.dBaseDVbc = gbc / br + gminS;
  const forward = ibe * inverseQb;
  out.forwardA = forward;
  out.dForwardDVbe = gbe * inverseQb;
  out.dForwardDVbc = -forward * dLogQbDVbc;
  out.reverseA = ibc;
  out.dReverseDVbc = gbc;
}
