import type { DriverStage } from '../designs/driver-stage.types';
import { TRANSISTOR_MODEL_DEFAULTS } from '../designs/device-defaults';
import type { MethodInfo } from '../methods';
import { THERMAL_VOLTAGE_V, collectorHardLimitV, collectorNodeCapacitanceOf } from './oscillator-stage';

export const TURN_OFF_OVERSHOOT_METHOD: MethodInfo = {
  methodId: 'driver.turn-off-magnetizing-peak-v2',
  summary:
    'The magnetizing current keeps rising after the collector leaves saturation, until the magnetizing voltage crosses zero. The secondary’s self-capacitance, reflected by (Ns/Np)², sits behind the leakage inductance, split (1 − k)·Lp to each side of the magnetizing inductance k·Lp; the collector node holds only its stray capacitance and the Miller capacitance (1 + β)·Cbc of the transistor. The transistor’s collector current is its base drive β·ib, ib from the feedback winding through Rb + Rfb, times the Ebers–Moll share of V_CE (soft saturation); the collector is held between −V_BE and the clamp. The four states (collector voltage, primary and magnetizing currents, reflected capacitor voltage) are integrated by classical Runge–Kutta through the bursts the collector rings in.',
  assumptions: [
    'the transistor leaves saturation at the on-time’s peak current; V_BE fixed, junction capacitances at their zero-bias values',
    'leakage split evenly to both sides of the T equivalent; winding resistances neglected',
    'with little leakage (its ring much faster than the slew) the two capacitances are one node',
  ],
  source:
    'KCL and Faraday’s law on the T equivalent of the coupled windings; Ebers–Moll saturation V_CE = V_T·ln((1/α_R + (I_C/I_B)/β_R)/(1 − (I_C/I_B)/β_F)) (J. J. Ebers, J. L. Moll, Proc. IRE 42, 1954; from memory); Miller multiplication of Cbc (common practice, no source)',
};

/** What the turn-off slew needs. SI units. */
export interface TurnOffSlew {
  /** Magnetizing current when the collector leaves saturation (A). */
  startCurrentA: number;
  /** Primary voltage then (V), positive while the core charges. */
  primaryVoltageV: number;
  magnetizingInductanceH: number;
  /** The collector node as one capacitance (F): stray, Miller and the reflected self-capacitance together. */
  collectorNodeCapacitanceF: number;
  /** Collector current change per volt of primary voltage through the base drive (A/V). */
  transconductanceS: number;
  /** The leakage that parts the collector node from the reflected self-capacitance; one node when absent. */
  leakage?: TurnOffLeakage;
}

/** The T equivalent around the collector and the transistor's saturation, for the leakage-split slew. SI units. */
export interface TurnOffLeakage {
  /** Leakage inductance on each side of the magnetizing inductance, referred to the primary (H). */
  leakageH: number;
  /** Capacitance at the collector itself: stray plus the Miller capacitance (1 + β)·Cbc (F). */
  collectorCapacitanceF: number;
  /** The secondary's self-capacitance referred to the primary, (Ns/Np)²·Cs (F). */
  reflectedCapacitanceF: number;
  /** Lowest primary voltage the clamp (or the collector's breakdown) allows: supply − clamp (V, negative). */
  clampPrimaryV: number;
  forwardBeta: number;
  reverseBeta: number;
  vceSatV: number;
  vbeOnV: number;
}

/** A leakage ring faster than this share of the slow tank's period leaves the two capacitances one node. */
const ONE_NODE_RING_SHARE = 1 / 300;

/**
 * Peak magnetizing current of the turn-off slew (A): with `leakage`, the T equivalent's four states integrated
 * through the collector's bursts (`leakageSlewPeakA`); otherwise (or when the leakage rings far faster than the
 * slew) the collector node as one capacitance (`oneNodeSlewPeakA`).
 */
export function turnOffMagnetizingPeakA(slew: TurnOffSlew): number {
  const x = slew.leakage;
  if (!x || !(x.leakageH > 0 && x.collectorCapacitanceF > 0 && x.reflectedCapacitanceF > 0))
    return oneNodeSlewPeakA(slew);
  const seriesF =
    (x.collectorCapacitanceF * x.reflectedCapacitanceF) / (x.collectorCapacitanceF + x.reflectedCapacitanceF);
  const ringS = 2 * Math.PI * Math.sqrt(2 * x.leakageH * seriesF);
  const tankS =
    2 * Math.PI * Math.sqrt(slew.magnetizingInductanceH * (x.collectorCapacitanceF + x.reflectedCapacitanceF));
  return ringS < ONE_NODE_RING_SHARE * tankS ? oneNodeSlewPeakA(slew) : leakageSlewPeakA(slew, x);
}

/**
 * The collector node as one capacitance: primary voltage and magnetizing current integrated by classical
 * Runge–Kutta from the saturation exit until the primary voltage crosses zero; the collector current follows
 * the base drive linearly and is held at or above zero (cut-off).
 */
function oneNodeSlewPeakA(slew: TurnOffSlew): number {
  const { startCurrentA: i0, primaryVoltageV: v0, magnetizingInductanceH: lm, collectorNodeCapacitanceF: c } = slew;
  const g = slew.transconductanceS;
  if (!(v0 > 0 && lm > 0 && c > 0 && i0 >= 0)) return i0;
  const collectorA = (v: number) => Math.max(0, i0 + g * (v - v0));
  // v' = (iC(v) − im)/C, im' = v/Lm.
  const dv = (v: number, im: number) => (collectorA(v) - im) / c;
  const di = (v: number) => v / lm;
  // Steps of 1/2000 of the tank's period; while the collector still conducts, also at most a tenth of the
  // regenerative time constant C/g, so a fast cut-off is followed rather than stepped over.
  const maxStepS = (2 * Math.PI * Math.sqrt(lm * c)) / 2000;
  const regenerativeS = g > 0 ? (0.1 * c) / g : maxStepS;
  let v = v0;
  let im = i0;
  for (let n = 0; n < 1_000_000 && v > 0; n += 1) {
    const stepS = collectorA(v) > 0 ? Math.min(maxStepS, regenerativeS) : maxStepS;
    const k1v = dv(v, im);
    const k1i = di(v);
    const k2v = dv(v + (stepS / 2) * k1v, im + (stepS / 2) * k1i);
    const k2i = di(v + (stepS / 2) * k1v);
    const k3v = dv(v + (stepS / 2) * k2v, im + (stepS / 2) * k2i);
    const k3i = di(v + (stepS / 2) * k2v);
    const k4v = dv(v + stepS * k3v, im + stepS * k3i);
    const k4i = di(v + stepS * k3v);
    const nextV = v + (stepS / 6) * (k1v + 2 * k2v + 2 * k3v + k4v);
    const nextI = im + (stepS / 6) * (k1i + 2 * k2i + 2 * k3i + k4i);
    if (nextV <= 0) {
      // The current peaks where v crosses zero: interpolate the current over the last step.
      return im + ((nextI - im) * v) / (v - nextV);
    }
    v = nextV;
    im = nextI;
  }
  return im;
}

/**
 * Ebers–Moll collector-to-base current ratio at a collector-emitter voltage (V): from
 * V_CE = V_T·ln((1/α_R + x/β_R)/(1 − x/β_F)), x = I_C/I_B, solved for x. It nears β_F above a few V_T and
 * turns negative below zero (the base–collector junction conducts).
 */
export function collectorToBaseRatio(vceV: number, forwardBeta: number, reverseBeta: number): number {
  const e = Math.exp(Math.min(vceV / THERMAL_VOLTAGE_V, 40));
  const alphaR = reverseBeta / (1 + reverseBeta);
  return (e - 1 / alphaR) / (e / forwardBeta + 1 / reverseBeta);
}

/**
 * The leakage-split slew: the T equivalent of the windings referred to the primary, the collector node
 * (capacitance Cc, primary voltage vp) through the leakage L to the magnetizing node (Lm), through L again to
 * the reflected self-capacitance Cs (voltage vs). The magnetizing node carries no capacitance, so its voltage
 * is the inductive divider vm = (vp + vs)/L / (2/L + 1/Lm). The transistor takes ib·x(V_CE), ib the base drive
 * (startCurrentA + g·(vp − v0))/β_F from the primary voltage, x the Ebers–Moll ratio; the collector is held
 * between −V_BE (the base–collector junction) and the clamp. Started where the saturated transistor carries
 * the ramp at V_CE,sat; ends when the reflected capacitor has swung to −v0 or half the slow tank's period
 * has passed. Returns the largest magnetizing current on the way (A).
 */
function leakageSlewPeakA(slew: TurnOffSlew, x: TurnOffLeakage): number {
  const { startCurrentA: i0, primaryVoltageV: v0, magnetizingInductanceH: lm, transconductanceS: g } = slew;
  const { leakageH: l, collectorCapacitanceF: cc, reflectedCapacitanceF: cs } = x;
  if (!(v0 > 0 && lm > 0 && i0 >= 0)) return i0;
  const supplyV = v0 + x.vceSatV;
  const highV = supplyV + x.vbeOnV;
  const lowV = Math.min(0, x.clampPrimaryV);
  const divider = 2 / l + 1 / lm;
  const collectorA = (vp: number) =>
    (Math.max(0, i0 + g * (vp - v0)) / x.forwardBeta) *
    collectorToBaseRatio(supplyV - vp, x.forwardBeta, x.reverseBeta);
  // State [vp, ip, im, vs]; derivatives into `out`.
  const derivative = (s: Float64Array, out: Float64Array) => {
    const vp = s[0]!;
    const ip = s[1]!;
    const vm = (vp + s[3]!) / l / divider;
    let dvp = (collectorA(vp) - ip) / cc;
    if ((vp <= lowV && dvp < 0) || (vp >= highV && dvp > 0)) dvp = 0;
    out[0] = dvp;
    out[1] = (vp - vm) / l;
    out[2] = vm / lm;
    out[3] = (ip - s[2]!) / cs;
  };
  // Steps of 1/20 of the leakage ring across the collector capacitance (1/40 and 1/160 move the peak by under
  // 0.05 %), and at most a fifth of the regenerative time constant Cc/g, so the bursts are followed rather than
  // stepped over.
  const ringS = 2 * Math.PI * Math.sqrt(l * cc);
  const stepS = Math.min(ringS / 20, g > 0 ? (0.2 * cc) / g : ringS);
  const endS = Math.PI * Math.sqrt(lm * (cc + cs));
  const startA = collectorA(v0);
  const state = Float64Array.of(v0, startA, startA, v0);
  const [k1, k2, k3, k4, probe] = [0, 1, 2, 3, 4].map(() => new Float64Array(4)) as [
    Float64Array,
    Float64Array,
    Float64Array,
    Float64Array,
    Float64Array,
  ];
  const along = (k: Float64Array, h: number) => {
    for (let j = 0; j < 4; j++) probe[j] = state[j]! + h * k[j]!;
    return probe;
  };
  let peakA = startA;
  for (let timeS = 0; timeS < endS && state[3]! > -v0; timeS += stepS) {
    derivative(state, k1);
    derivative(along(k1, stepS / 2), k2);
    derivative(along(k2, stepS / 2), k3);
    derivative(along(k3, stepS), k4);
    for (let j = 0; j < 4; j++) state[j] = state[j]! + (stepS / 6) * (k1[j]! + 2 * k2[j]! + 2 * k3[j]! + k4[j]!);
    state[0] = Math.min(highV, Math.max(lowV, state[0]!));
    peakA = Math.max(peakA, state[2]!);
  }
  return peakA;
}

/**
 * The turn-off slew of a driver stage from its estimate's peak current and on-time primary voltage: the T
 * equivalent of the simulator's coupled windings (leakage (1 − k)·Lp each side of k·Lp), the collector's stray
 * capacitance with the transistor's Miller capacitance (1 + β)·Cbc, the secondary's self-capacitance reflected
 * by (Ns/Np)², the clamp (or Vce0,max) as the collector's ceiling.
 */
export function stageTurnOffSlew(stage: DriverStage, peakCurrentA: number, primaryVoltageV: number): TurnOffSlew {
  const tx = stage.transformer;
  const q = stage.transistor;
  const millerF =
    (1 + q.forwardBeta) * (q.baseCollectorCapacitanceF ?? TRANSISTOR_MODEL_DEFAULTS.baseCollectorCapacitanceF);
  const nodeF = collectorNodeCapacitanceOf(stage);
  const reflectedF = (tx.secondaryCapacitanceF ?? 0) * (tx.secondaryTurns / tx.primaryTurns) ** 2;
  return {
    startCurrentA: peakCurrentA,
    primaryVoltageV,
    magnetizingInductanceH: tx.couplingCoefficient * tx.primaryInductanceH,
    collectorNodeCapacitanceF: nodeF + millerF,
    transconductanceS:
      (q.forwardBeta * (tx.feedbackTurns / tx.primaryTurns)) / (stage.baseResistorOhm + tx.feedbackResistanceOhm),
    leakage: {
      leakageH: (1 - tx.couplingCoefficient) * tx.primaryInductanceH,
      collectorCapacitanceF: nodeF - reflectedF + millerF,
      reflectedCapacitanceF: reflectedF,
      // An RCD clamp's capacitor sits at or above the flyback's level, so only a zener holds the slew.
      clampPrimaryV: primaryVoltageV + q.vceSatV - collectorHardLimitV(stage),
      forwardBeta: q.forwardBeta,
      reverseBeta: q.reverseBeta,
      vceSatV: q.vceSatV,
      vbeOnV: q.vbeOnV,
    },
  };
}
