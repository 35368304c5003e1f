import { RCD_CLAMP_DEFAULTS } from '../designs/device-defaults';
import type { DriverClamp } from '../designs/driver-stage.types';

/** The parts of an RCD clamp that set its level: resistor (Ω) and capacitor (F), defaults filled in. */
export interface RcdClampParts {
  resistorOhm: number;
  capacitorF: number;
}

/** The resistor and capacitor of a design's RCD clamp, a part left out at RCD_CLAMP_DEFAULTS. */
export function rcdClampPartsOf(clamp: Extract<DriverClamp, { kind: 'rcd' }>): RcdClampParts {
  return {
    resistorOhm: clamp.resistorOhm ?? RCD_CLAMP_DEFAULTS.resistorOhm,
    capacitorF: clamp.capacitorF ?? RCD_CLAMP_DEFAULTS.capacitorF,
  };
}

/**
 * Energy per cycle per volt² of peak (J/V²) an RCD clamp's resistor dissipates: the capacitor, charged to its
 * peak Vp by each flyback and discharged through R for the rest of the period T, loses ½·C·Vp²·(1 − e^(−2T/RC)).
 * For T ≪ RC this is Vp²·T/R, the resistor's Vc²/R over one period.
 */
function joulesPerSquareVolt(periodS: number, parts: RcdClampParts): number {
  const tauS = parts.resistorOhm * parts.capacitorF;
  return 0.5 * parts.capacitorF * -Math.expm1((-2 * periodS) / tauS);
}

/**
 * Peak voltage across an RCD clamp's capacitor (V, above the supply) when it takes `energyJ` (J) every
 * `periodS` (s): the capacitor's loss per cycle to its resistor equals what the flyback hands it,
 * ½·C·Vp²·(1 − e^(−2T/RC)) = E (steady state of a pulse-charged RC; Vp² = E·f·R when T ≪ RC).
 */
export function rcdClampPeakV(energyJ: number, periodS: number, parts: RcdClampParts): number {
  return Math.sqrt(Math.max(0, energyJ) / joulesPerSquareVolt(periodS, parts));
}

/**
 * An RCD clamp below its limit, while the load holds the flyback: its capacitor's peak (V, above the supply) and
 * the power it dissipates (W). With a load on the secondary the clamp stands in parallel with it at the flyback's
 * primary-side peak `primaryFlybackV` (k·V_s·N_p/N_s), the magnetizing current feeding it while the secondary's
 * capacitance charges, and dissipates what its resistor takes at that level (Vc²/R with the capacitor's ripple,
 * rcdClampPeakV). The leakage energy E_lk it must take in any case sets the floor Vc ≥ √(E_lk·f·R). (The standard
 * flyback relation E_lk·f·Vc/(Vc − Vr) = Vc²/R, Fairchild AN-4147 from memory, assumes a secondary that conducts
 * at once at a flat Vr; behind a ladder our simulation and ngspice put the clamp at the flyback's peak instead,
 * shared/test/ngspice/rcd-clamp-level-vs-ngspice.test.ts.)
 */
export function rcdClampUnderLoad(
  primaryFlybackV: number,
  leakageJ: number,
  periodS: number,
  parts: RcdClampParts,
): { clampV: number; powerW: number } {
  const a = joulesPerSquareVolt(periodS, parts);
  const clampV = Math.max(primaryFlybackV, Math.sqrt(Math.max(0, leakageJ) / a));
  return { clampV, powerW: (a * clampV * clampV) / periodS };
}

/** An RCD clamp's level: the capacitor's peak (V, above the supply) and the reflected flyback (V) it allows. */
export interface RcdClampLevel {
  clampV: number;
  reflectedV: number;
}

/**
 * An RCD clamp's limit, where it takes the whole flyback (no load holding it lower). `cycleAt(Vr)` gives, at a
 * reflected voltage Vr, the period and the energy the flyback hands over per cycle (E); the clamp dissipates E,
 * Vc = rcdClampPeakV(E), and the primary sits at Vc, a reflected Vr = Vc/k² in the stage's open-circuit terms
 * (`couplingSquared` = k²). The period shortens as Vr rises (d ln Vc/d ln Vr = ½·t_fly/T < ½), so the fixed
 * point contracts; iterated to 1e-9.
 */
export function rcdClampLimit(
  parts: RcdClampParts,
  couplingSquared: number,
  startV: number,
  cycleAt: (reflectedV: number) => { periodS: number; energyJ: number },
): RcdClampLevel {
  const level: RcdClampLevel = { clampV: startV, reflectedV: Math.max(startV, 1e-3) };
  for (let pass = 0; pass < 60; pass++) {
    const { periodS, energyJ } = cycleAt(level.reflectedV);
    level.clampV = rcdClampPeakV(energyJ, periodS, parts);
    const next = level.clampV / couplingSquared;
    const isSettled = Math.abs(next - level.reflectedV) <= 1e-9 * next;
    level.reflectedV = next;
    if (isSettled || !(next > 0)) break;
  }
  return level;
}
