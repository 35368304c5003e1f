import type { DriverStage } from '../designs/driver-stage.types';

/**
 * What the ladder hangs on the secondary for the swings between the pulses: its diodes' junction capacitance
 * (each diode's reverse voltage swings by the secondary's peak-to-peak) and the stray capacitance of the
 * oscillating column's nodes, which move with the secondary.
 */
export interface SecondaryLoad {
  diodeCount: number;
  /** Zero-bias junction capacitance of one diode (F), SPICE CJO. */
  diodeJunctionCapacitanceF: number;
  /** Stray capacitance to ground of the ladder nodes that swing with the secondary, summed (F). */
  swingingStrayCapacitanceF: number;
}

/** Junction potential and grading coefficient the simulator's diodes take when the part gives none (SPICE VJ, M). */
const DIODE_JUNCTION_POTENTIAL_V = 1;
const DIODE_GRADING_COEFFICIENT = 0.5;

/**
 * The capacitance (F) that holds the same charge over a swing of `swingV` (V) as the ladder's secondary load:
 * the depletion charge of each diode over the swing, CJO·VJ/(1 − M)·((1 + ΔV/VJ)^(1 − M) − 1) (the SPICE
 * junction charge, e.g. ngspice manual, diode model), over ΔV, plus the swinging strays.
 */
export function secondaryLoadCapacitanceF(load: SecondaryLoad, swingV: number): number {
  if (!(swingV > 0)) return load.swingingStrayCapacitanceF + load.diodeCount * load.diodeJunctionCapacitanceF;
  const vj = DIODE_JUNCTION_POTENTIAL_V;
  const m = DIODE_GRADING_COEFFICIENT;
  const chargeC = ((load.diodeJunctionCapacitanceF * vj) / (1 - m)) * ((1 + swingV / vj) ** (1 - m) - 1);
  return load.swingingStrayCapacitanceF + (load.diodeCount * chargeC) / swingV;
}

/** The ring-back between the flyback's end and the next turn-on (SI units). */
export interface RingBack {
  /** Capacitance at the collector the magnetizing inductance swings, the secondary's reflected by (Ns/Np)² (F). */
  swingCapacitanceF: number;
  /** The collector's fall from Vin + Vr to Vin, a quarter of the resonant period, where the transistor turns on (s). */
  swingS: number;
  /** The magnetizing current's return from −I0 to zero with the transistor conducting backwards (s). */
  recoveryS: number;
  /** −I0: the magnetizing current as the transistor turns on (A, ≤ 0). */
  recoveryStartA: number;
}

/**
 * The ring-back of a blocking oscillator after the flyback: when the magnetizing current reaches zero the
 * collector is at Vin + Vr with the node capacitance C (collector stray, snubber, and the secondary's
 * self-capacitance and ladder load reflected by (Ns/Np)²) charged; the inductance swings it down as an LC
 * ring about Vin, v = Vin + Vr·cos(ωt), ω = 1/√(Lp·C). A quarter period on, the collector passes Vin, the
 * feedback winding turns the base on and the transistor takes the collector to the emitter (the rest of the
 * node's charge, ½·C·Vin², is its turn-on loss), with the magnetizing current at −I0 = −Vr·√(C/Lp). The
 * transistor then conducts backwards, its collector a junction drop below the emitter, until the current
 * has returned to zero, Lp·I0/(Vin + V_BE), and the next on-time's ramp starts (resonant LC ring and
 * volt-second balance; common practice, no source).
 */
export function ringBack(
  driver: DriverStage,
  vin: number,
  reflectedV: number,
  nodeCapacitanceF: number,
  secondaryLoadF: number,
): RingBack {
  const tx = driver.transformer;
  const turnsRatio = tx.secondaryTurns / tx.primaryTurns;
  const swingCapacitanceF =
    nodeCapacitanceF + (driver.snubber?.capacitorF ?? 0) + turnsRatio * turnsRatio * secondaryLoadF;
  const lp = tx.primaryInductanceH;
  const swingS = (Math.PI / 2) * Math.sqrt(lp * swingCapacitanceF);
  const startA = Math.max(0, reflectedV) * Math.sqrt(swingCapacitanceF / lp);
  const recoveryS = (lp * startA) / Math.max(vin + driver.transistor.vbeOnV, Number.MIN_VALUE);
  return { swingCapacitanceF, swingS, recoveryS, recoveryStartA: -startA };
}

/**
 * The share of the period the secondary spends at its forward level (the ladder's pulse timing): the on-time,
 * the ring-back's recovery and half its swing.
 */
export function forwardShareOf(r: { tOn: number; tRecovery: number; tSwing: number; frequencyHz: number }): number {
  return (r.tOn + r.tRecovery + 0.5 * r.tSwing) * r.frequencyHz;
}

/**
 * The forward peak (V) a load sees that takes `forwardChargeC` (C) from the forward pulse each cycle: the
 * recovery level Vin + V_BE (through the turns) when the ring-back's returned charge covers that charge, the
 * on-time level Vin − Vce,sat when there is none, and in between by the share it covers (charge balance;
 * common practice, no source).
 */
export function forwardPeakFor(
  r: { forwardSecV: number; recoveryForwardSecV: number; recoveryChargeC: number },
  forwardChargeC: number,
): number {
  const share = forwardChargeC > 0 ? Math.min(1, r.recoveryChargeC / forwardChargeC) : r.recoveryChargeC > 0 ? 1 : 0;
  return r.forwardSecV + (r.recoveryForwardSecV - r.forwardSecV) * share;
}

/** `ringBack` with the secondary's load (none when absent) swinging by `swingV` (V) across the flyback. */
export function ringBackUnder(
  driver: DriverStage,
  vin: number,
  reflectedV: number,
  nodeF: number,
  secondaryLoad: SecondaryLoad | undefined,
  swingV: number,
): RingBack {
  const loadF = secondaryLoad ? secondaryLoadCapacitanceF(secondaryLoad, swingV) : 0;
  return ringBack(driver, vin, reflectedV, nodeF, loadF);
}
