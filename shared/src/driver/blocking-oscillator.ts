import { DomainError } from '../errors';
import { supplyThevenin } from './battery';
import type { DriverStage } from '../designs/driver-stage.types';
import type { Estimated, MethodInfo } from '../methods';

/** What ended the on-time: the base drive (hFE·I_B) or the core saturation current. */
export type OnTimeLimit = 'base' | 'saturation';

export interface BlockingOscillatorOptions {
  /**
   * Secondary flyback peak (V) held by the load (the ladder). Default: the largest the circuit allows,
   * set by the clamp, or without a clamp by the collector breakdown.
   */
  flybackSecondaryPeakV?: number;
  /** Power (W) the load takes from the forward pulse during the on-time, drawn straight from the supply. */
  forwardLoadPowerW?: number;
  /**
   * Capacitance (F) at the collector node, for the leakage spike of an unclamped stage and the switching loss.
   * Default 100 pF plus the secondary's self-capacitance reflected by (Ns/Np)².
   */
  collectorNodeCapacitanceF?: number;
  /** State of charge of a cells supply (1 = full). Default 1. */
  chargeFraction?: number;
  /** Supply bypass capacitor at the stage (F). Default 100 µF, the simulated circuit's. */
  bypassCapacitanceF?: number;
  /** Starting guess of the loaded supply voltage (V) for the supply solve (a warm start); default the open-circuit voltage. */
  supplyVoltageGuessV?: number;
}

/**
 * Where the stage's power goes per second (W), by element kind, at one operating condition. Together with
 * what the load takes (the deliverable flyback power and the forward-pulse power) they add up to the power
 * drawn from the supply's EMF.
 */
export interface StageLosses {
  /** Vce,sat·i over the on-time. */
  transistorConductionW: number;
  /** The collector node capacitance discharged through the transistor at each turn-on, ½·C·Vin²·f. */
  transistorSwitchingW: number;
  /** Base drive in the base-emitter junction, V_BE·I_B over the on-time (part of the transistor's dissipation). */
  baseEmitterW: number;
  /** Base drive in R_B and the feedback winding, (V_B − V_BE)·I_B over the on-time. */
  baseResistorW: number;
  /** i²R of the primary winding over the on-time. */
  primaryCopperW: number;
  /** i²R of the collector resistor over the on-time. */
  collectorResistorW: number;
  /** i²R of the secondary winding with the flyback current. */
  secondaryCopperW: number;
  /** Leakage energy ½·(1 − k²)·Lp·Ipk² per cycle, taken by the clamp or the ringing of the collector. */
  leakageW: number;
  /** The core's loss (the design's figure, at most what the flyback carries), taken from the stored energy. */
  coreW: number;
  /** The indicator lamp. */
  lampW: number;
  /** I²·R in the supply's own resistance (cells' internal resistance or the bench supply's). */
  supplyResistanceW: number;
}

/** The estimate as plain numbers (SI units), for solvers that call it many times. */
export interface OscillatorNumbers {
  openCircuitV: number;
  supplyResistanceOhm: number;
  /** Loaded supply terminal voltage. */
  vin: number;
  vPrimary: number;
  /** Base current at the start of the on-time. */
  ib: number;
  /** Mean base current over the on-time (it falls as the winding voltage falls with i·R). */
  ibMean: number;
  vBase: number;
  /** hFE·I_B at the start of the on-time (the base-limited current with no series resistance). */
  baseLimitedA: number;
  /** Collector current at which the regenerative turn-off happens: i = hFE·I_B(i). */
  turnOffA: number;
  limit: OnTimeLimit;
  /** Primary current at the end of the stored-energy ramp. */
  ipk: number;
  tOn: number;
  tFly: number;
  frequencyHz: number;
  energyJ: number;
  deliverableW: number;
  flybackSecV: number;
  maxFlybackSecV: number;
  reflectedV: number;
  /** Power into the stage at its terminals (W). */
  inputW: number;
  /** Power from the supply's EMF (W): terminal power plus the loss in the supply's own resistance. */
  emfW: number;
  inputA: number;
  collectorPeakV: number;
  forwardSecV: number;
  flybackEfficiency: number;
  collectorPeakA: number;
  losses: StageLosses;
}

export interface BlockingOscillatorEstimate {
  supplyVoltageV: Estimated;
  baseCurrentA: Estimated;
  onTimeLimit: OnTimeLimit;
  /** Primary current at the end of the on-time, the current whose energy is stored. */
  peakPrimaryCurrentA: Estimated;
  /** Collector peak current for the stress checks (above the stored-energy peak when the core saturates). */
  collectorPeakCurrentA: Estimated;
  /** Collector current the base drive can hold in saturation at the start of the on-time, hFE·I_B. */
  baseLimitedCurrentA: number;
  onTimeS: Estimated;
  flybackTimeS: Estimated;
  frequencyHz: Estimated;
  energyPerCycleJ: Estimated;
  deliverablePowerW: Estimated;
  forwardSecondaryPeakV: Estimated;
  flybackSecondaryPeakV: Estimated;
  /** The largest flyback the circuit allows (clamp- or breakdown-limited), V at the secondary. */
  maxFlybackSecondaryPeakV: number;
  reflectedVoltageV: Estimated;
  collectorPeakV: Estimated;
  inputCurrentA: Estimated;
  inputPowerW: Estimated;
  /** The stage's own transfer efficiency: (deliverable flyback + forward-pulse power) over terminal input power. */
  efficiency: Estimated;
  /** Where the stage's power goes (W), without what the load takes. */
  losses: StageLosses;
  /** Power from the supply's EMF (W), terminal power plus the supply's own I²R. */
  emfPowerW: number;
}

const defaultCollectorNodeCapacitanceF = 100e-12;

/**
 * Capacitance at the collector node (F): the default stray plus the secondary's self-capacitance reflected
 * by the turns ratio squared, C·(Ns/Np)², which the collector charges and the transistor discharges each cycle.
 */
function collectorNodeCapacitanceOf(driver: DriverStage): number {
  const tx = driver.transformer;
  return (
    defaultCollectorNodeCapacitanceF + (tx.secondaryCapacitanceF ?? 0) * (tx.secondaryTurns / tx.primaryTurns) ** 2
  );
}
/** Supply bypass at the stage when none is given (F): the simulated circuit's default. */
export const DEFAULT_BYPASS_CAPACITANCE_F = 100e-6;
/** The transistor's Ebers–Moll saturation current when the design gives none: the simulator's default. */
export const DEFAULT_TRANSISTOR_SATURATION_CURRENT_A = 1e-14;
/** kT/q at 300.15 K from the exact SI constants (CODATA 2018), as the simulator's junctions take it. */
const THERMAL_VOLTAGE_V = (1.380649e-23 * 300.15) / 1.602176634e-19;

const source3 =
  'Wikipedia "Blocking oscillator" (read); Pressman, Switching Power Supply Design, 3rd ed. (from memory)';
const commonAssumptions = [
  'supply bypassed: the stage sees the mean loaded supply voltage',
  'magnetizing inductance ≈ primary inductance (k close to 1)',
  'load current reflected into the collector during the on-time neglected for the turn-off point',
  'next on-time starts as the flyback current reaches zero (no dead time)',
  'core with a hard saturation knee: past the saturation current the current rises to the turn-off point storing no more energy',
];

function method(methodId: string, summary: string, assumptions: string[] = [], source = source3): MethodInfo {
  return { methodId, summary, assumptions: [...commonAssumptions, ...assumptions], source };
}

function est(value: number, m: MethodInfo): Estimated {
  return { value, method: m };
}

function checkStage(driver: DriverStage): void {
  const tx = driver.transformer;
  if (!(tx.primaryInductanceH > 0))
    throw new DomainError(
      'invalid_design',
      'primary inductance must be positive',
      'driver.transformer.primaryInductanceH',
    );
  if (!(tx.primaryTurns > 0 && tx.secondaryTurns > 0 && tx.feedbackTurns > 0)) {
    throw new DomainError('invalid_design', 'turns must be positive', 'driver.transformer.primaryTurns');
  }
  if (!(tx.couplingCoefficient > 0 && tx.couplingCoefficient <= 1)) {
    throw new DomainError(
      'invalid_design',
      'coupling coefficient must be in (0, 1]',
      'driver.transformer.couplingCoefficient',
    );
  }
  if (!(driver.baseResistorOhm + tx.feedbackResistanceOhm > 0)) {
    throw new DomainError('invalid_design', 'base resistor must be positive', 'driver.baseResistorOhm');
  }
}

/** ∫i² dt (A²·s) of the first-order ramp i(t) = I∞(1 − e^(−t/τ)) from 0 to t; i²·t/3 for the linear ramp. */
function rampSquareIntegral(finalA: number, tauS: number, endA: number, tS: number): number {
  if (!(tauS > 0 && Number.isFinite(tauS))) return (endA * endA * tS) / 3;
  const e1 = -Math.expm1(-tS / tauS);
  const e2 = -Math.expm1((-2 * tS) / tauS);
  return finalA * finalA * (tS - 2 * tauS * e1 + 0.5 * tauS * e2);
}

/** Charge (C) of the first-order ramp i(t) = I∞(1 − e^(−t/τ)) from 0 to t, τ = Lp/R; the linear ramp's ½·i·t when R = 0. */
function rampChargeC(finalA: number, tauS: number, endA: number, tS: number): number {
  return tauS > 0 && Number.isFinite(tauS) ? finalA * tS - tauS * endA : 0.5 * endA * tS;
}

/**
 * The estimate at one terminal voltage `vin` (V), as plain numbers. Throws a DomainError when the stage
 * cannot run there (too low to turn on, no room for a flyback, latched on).
 */
function stageAt(
  driver: DriverStage,
  options: BlockingOscillatorOptions,
  vin: number,
  openCircuitV: number,
  supplyResistanceOhm: number,
): OscillatorNumbers {
  const { transformer: tx, transistor: q } = driver;
  const lp = tx.primaryInductanceH;
  const k = tx.couplingCoefficient;
  const turnsRatio = tx.secondaryTurns / tx.primaryTurns;
  const fbRatio = tx.feedbackTurns / tx.primaryTurns;
  const seriesR = tx.primaryResistanceOhm + (driver.collectorResistorOhm ?? 0);
  const baseR = driver.baseResistorOhm + tx.feedbackResistanceOhm;
  // The bypass capacitor holds the supply at its mean over a cycle only when its time constant R_s·C is long
  // against the on-time; otherwise the supply's resistance is in series with the ramp. The share it leaves
  // in series, φ(u) = 1 − (1 − e^(−u))/u with u = t_on/(R_s·C), is the mean over the on-time of a first-order
  // low-pass's step response; iterated twice with the on-time.
  const bypassF = options.bypassCapacitanceF ?? DEFAULT_BYPASS_CAPACITANCE_F;
  const meanA = supplyResistanceOhm > 0 ? Math.max(0, (openCircuitV - vin) / supplyResistanceOhm) : 0;
  const isA = q.saturationCurrentA ?? DEFAULT_TRANSISTOR_SATURATION_CURRENT_A;
  const vPrimary = vin - q.vceSatV;
  const vBase = vin + vPrimary * fbRatio;
  const ib = (vBase - q.vbeOnV) / baseR;
  if (!(vPrimary > 0) || !(ib > 0)) {
    throw new DomainError('invalid_design', 'the supply is too low to turn the transistor on', 'driver.supply');
  }
  const baseLimitedA = q.forwardBeta * ib;
  let rampR = seriesR;
  let sourceV = vin;
  let turnOffA = 0;
  let tOn = 0;
  let finalA = Infinity;
  let ipk = 0;
  let limit: OnTimeLimit = 'base';
  let unbypassedOhm = 0;
  for (let pass = 0; pass < (supplyResistanceOhm > 0 ? 3 : 1); pass++) {
    // The ramp's source: the held supply vin plus the unbypassed share's drop at the mean current, behind it.
    sourceV = vin + meanA * unbypassedOhm;
    rampR = seriesR + unbypassedOhm;
    // The feedback winding carries the primary winding's voltage V0 − i·R: the base current falls as the
    // current rises, and the transistor leaves saturation where i = hFE·I_B(i) (regenerative turn-off):
    // i_off = hFE·(V0·(1 + N_b/N_p) − Vce,sat·N_b/N_p − V_BE,off)/R_B' / (1 + hFE·(R_u·(1 + N_b/N_p) + R·N_b/N_p)/R_B'),
    // R_u the unbypassed supply share, V_BE,off the junction's own voltage at that current, V_T·ln(1 + i_off/I_S)
    // (Ebers–Moll forward law), by three fixed-point passes.
    const gainFactor = 1 + (q.forwardBeta * (unbypassedOhm * (1 + fbRatio) + seriesR * fbRatio)) / baseR;
    const driveV = sourceV * (1 + fbRatio) - q.vceSatV * fbRatio;
    turnOffA = (q.forwardBeta * (driveV - q.vbeOnV)) / baseR / gainFactor;
    for (let k3 = 0; k3 < 3 && turnOffA > 0; k3++) {
      const vbeOff = THERMAL_VOLTAGE_V * Math.log1p(turnOffA / isA);
      turnOffA = (q.forwardBeta * Math.max(0, driveV - vbeOff)) / baseR / gainFactor;
    }
    if (!(turnOffA > 0)) {
      throw new DomainError('invalid_design', 'the supply is too low to turn the transistor on', 'driver.supply');
    }
    finalA = rampR > 0 ? (sourceV - q.vceSatV) / rampR : Infinity;
    limit = turnOffA <= tx.saturationCurrentA ? 'base' : 'saturation';
    ipk = Math.min(turnOffA, tx.saturationCurrentA);
    if (ipk >= finalA) {
      throw new DomainError(
        'invalid_design',
        'winding resistance holds the primary current below the turn-off current even with the base drive falling with the winding voltage: the stage latches on',
        'driver.transformer.primaryResistanceOhm',
      );
    }
    tOn = rampR > 0 ? -(lp / rampR) * Math.log(1 - ipk / finalA) : (lp * ipk) / (sourceV - q.vceSatV);
    if (supplyResistanceOhm > 0) {
      const u = tOn / (supplyResistanceOhm * bypassF);
      const next = supplyResistanceOhm * (u > 1e-6 ? 1 - -Math.expm1(-u) / u : u / 2);
      const isSettled = Math.abs(next - unbypassedOhm) <= 1e-9 * supplyResistanceOhm;
      unbypassedOhm = next;
      if (isSettled) break;
    }
  }
  const tauS = rampR > 0 ? lp / rampR : Infinity;
  const maxReflectedV = driver.clamp ? driver.clamp.clampVoltageV - vin : q.vceoMaxV - vin;
  // Open-circuit secondary voltage of coupled windings: V_s = (M/Lp)·V_p = k·(N_s/N_p)·V_p.
  const maxFlybackSecV = Math.max(0, maxReflectedV) * k * turnsRatio;
  const flybackSecV = Math.min(options.flybackSecondaryPeakV ?? maxFlybackSecV, maxFlybackSecV);
  if (!(flybackSecV > 0))
    throw new DomainError(
      'invalid_design',
      'no room for a flyback: clamp or breakdown voltage below the supply',
      'driver.clamp',
    );
  const reflectedV = flybackSecV / (k * turnsRatio);
  const tFly = (lp * ipk) / reflectedV;
  const frequencyHz = 1 / (tOn + tFly);
  const energyJ = 0.5 * lp * ipk * ipk;
  // Flyback transfer: leakage share (1 − k²) goes to the clamp or the ringing; secondary copper loss of
  // the triangular current pulse, peak Ipk·Np/Ns, is I²R·t/3.
  const iSecPk = ipk / turnsRatio;
  const copperJ = iSecPk * iSecPk * tx.secondaryResistanceOhm * (tFly / 3);
  const coreJ = Math.min((tx.coreLossW ?? 0) / frequencyHz, Math.max(0, k * k * energyJ - copperJ));
  const flybackEfficiency = Math.max(0, k * k - (copperJ + coreJ) / energyJ);
  const deliverableW = energyJ * frequencyHz * flybackEfficiency;
  // Supply charge per cycle: the primary ramp ∫i dt plus the base drive, with I_B falling linearly in i:
  // mean I_B = I_B0 − R·(N_b/N_p)·(Q/t_on)/R_B'.
  const rampC = rampChargeC(finalA, tauS, ipk, tOn);
  const rampSquareA2S = rampSquareIntegral(finalA, tauS, ipk, tOn);
  const ibMean = Math.max(0, ib - (seriesR * fbRatio * (rampC / tOn)) / baseR);
  const baseDriveJ = vBase * ibMean * tOn;
  const forwardW = options.forwardLoadPowerW ?? 0;
  const lampA = driver.indicatorLamp?.currentA ?? 0;
  // Energy into the stage per cycle, from Kirchhoff's law along the primary loop: V0·Q − R_u·∫i² =
  // Vce,sat·Q + R·∫i² + E, plus the base drive ∫V_B·I_B dt (the rail's share directly, the feedback winding's
  // through the primary). The supply current is that power over the mean terminal voltage.
  // The collector node capacitance, recharged by each flyback, is discharged through the transistor at each turn-on.
  const nodeC = options.collectorNodeCapacitanceF ?? collectorNodeCapacitanceOf(driver);
  const switchingJ = 0.5 * nodeC * vin * vin;
  const inputW =
    frequencyHz * (q.vceSatV * rampC + seriesR * rampSquareA2S + energyJ + baseDriveJ + switchingJ) +
    forwardW +
    vin * lampA;
  const inputA = inputW / vin;
  const leakageH = (1 - k * k) * lp;
  const spikeV = ipk * Math.sqrt(leakageH / nodeC);
  const unclampedPeakV = vin + reflectedV + spikeV;
  const collectorPeakV = driver.clamp ? Math.min(driver.clamp.clampVoltageV, unclampedPeakV) : unclampedPeakV;
  // The source's own loss: its EMF's power less what reaches the stage (R_s·I² at the solved supply voltage).
  const emfW = openCircuitV * inputA;
  const supplyResistanceW = Math.max(0, emfW - inputW);
  const baseEmitterJ = q.vbeOnV * ibMean * tOn;
  const losses: StageLosses = {
    transistorConductionW: frequencyHz * q.vceSatV * rampC,
    transistorSwitchingW: switchingJ * frequencyHz,
    baseEmitterW: frequencyHz * baseEmitterJ,
    baseResistorW: frequencyHz * (baseDriveJ - baseEmitterJ),
    primaryCopperW: frequencyHz * tx.primaryResistanceOhm * rampSquareA2S,
    collectorResistorW: frequencyHz * (driver.collectorResistorOhm ?? 0) * rampSquareA2S,
    secondaryCopperW: frequencyHz * Math.min(copperJ, k * k * energyJ),
    leakageW: frequencyHz * (1 - k * k) * energyJ,
    coreW: frequencyHz * coreJ,
    lampW: vin * lampA,
    supplyResistanceW,
  };
  return {
    openCircuitV,
    supplyResistanceOhm,
    vin,
    vPrimary: sourceV - q.vceSatV,
    ib,
    ibMean,
    vBase,
    baseLimitedA,
    turnOffA,
    limit,
    ipk,
    tOn,
    tFly,
    frequencyHz,
    energyJ,
    deliverableW,
    flybackSecV,
    maxFlybackSecV,
    reflectedV,
    inputW,
    emfW,
    inputA,
    collectorPeakV,
    forwardSecV: vPrimary * k * turnsRatio,
    flybackEfficiency,
    collectorPeakA: limit === 'base' ? ipk : turnOffA,
    losses,
  };
}

/**
 * The blocking oscillator's estimate as plain numbers (SI units), the loaded supply voltage solved by a
 * safeguarded Newton (secant) iteration on h(V) = V − Voc + R_s·I_in(V) (first slope by a forward difference,
 * then secant steps; a step leaving the bracket [lo, hi] of the root becomes a bisection). `options.supplyVoltageGuessV` warm-starts it.
 * Where the stage does not run (below its turn-on voltage) it draws nothing, so h < 0 there.
 */
export function blockingOscillatorNumbers(
  driver: DriverStage,
  options: BlockingOscillatorOptions = {},
): OscillatorNumbers {
  checkStage(driver);
  const { openCircuitV, resistanceOhm } = supplyThevenin(driver.supply, options.chargeFraction ?? 1);
  if (!(resistanceOhm > 0)) return stageAt(driver, options, openCircuitV, openCircuitV, 0);
  const voc = openCircuitV;
  // h(V) at one voltage, keeping the stage's numbers there; below its turn-on voltage the stage draws nothing.
  let state: OscillatorNumbers | null = null;
  const h = (v: number): number => {
    try {
      state = stageAt(driver, options, v, voc, resistanceOhm);
      return v - voc + resistanceOhm * state.inputA;
    } catch (error) {
      state = null;
      if (error instanceof DomainError && error.message.startsWith('the supply is too low')) return v - voc;
      throw error;
    }
  };
  let lo = 0;
  let hi = voc;
  const guess = options.supplyVoltageGuessV;
  let v = guess !== undefined && guess > 0 && guess <= voc ? guess : voc;
  const tolV = 1e-10 * voc;
  let hv = h(v);
  // The first slope by a forward difference, then secant steps from the last two points, each kept inside
  // the bracket [lo, hi] of the root (a bisection otherwise).
  let prevV = NaN;
  let prevH = NaN;
  for (let it = 0; it < 100 && Math.abs(hv) > tolV; it++) {
    if (hv > 0) hi = v;
    else lo = v;
    if (hi - lo <= tolV) break;
    let slope: number;
    if (Number.isNaN(prevV) || prevV === v) {
      const dv = Math.max(1e-7 * voc, 4 * tolV) * (v - lo > hi - v ? -1 : 1);
      slope = (h(v + dv) - hv) / dv;
    } else {
      slope = (hv - prevH) / (v - prevV);
    }
    let next = v - hv / slope;
    if (!Number.isFinite(next) || next <= lo || next >= hi) next = 0.5 * (lo + hi);
    prevV = v;
    prevH = hv;
    v = next;
    hv = h(v);
  }
  // A weak supply has no root where the stage runs: the iteration then closes on the turn-on voltage,
  // where h jumps from below zero (the stage off) to above it.
  if (Math.abs(hv) > 1e-6 * voc) {
    throw new DomainError('invalid_design', 'the supply resistance is too high for the drawn current', 'driver.supply');
  }
  return state ?? stageAt(driver, options, v, voc, resistanceOhm);
}

/**
 * Closed-form estimate of a blocking oscillator with the feedback winding returned to the supply rail
 * (self-starting through R_B). All results in SI units with the method that produced each.
 * Relations (REFERENCES.md §3):
 *  - base drive: V_B = Vin + (Vp − i·R)·N_b/N_p, I_B = (V_B − V_BE)/(R_B + R_fb), Vp = Vin − Vce,sat, R the
 *    primary-side series resistance: the feedback winding sees the primary winding's own voltage (common practice);
 *  - primary ramp: i(t) = (Vin − Vce,sat)·t/Lp, with series resistance R the exact first-order form
 *    i(t) = (V/R)(1 − e^(−R t/Lp)) (read: Wikipedia "Blocking oscillator");
 *  - on-time ends at the regenerative turn-off i = hFE·I_B(i), or at the core saturation current, whichever
 *    comes first (pulse-circuits text, ch. 13: the on-time ends when the collector current reaches hFE·I_B or the
 *    core saturates); past saturation the current climbs on to the turn-off point, storing no more energy;
 *  - secondary peaks V = k·(N_s/N_p)·V_primary (open-circuit ratio M/Lp of coupled windings);
 *  - flyback time from the volt-second balance t_fly = Lp·Ipk/Vr, Vr = V₋·N_p/(k·N_s) (memory: Pressman);
 *  - E = ½ Lp Ipk², P = E f η (common practice; memory: Pressman);
 *  - Vce,max = Vin + Vr + leakage spike, the spike Ipk·√(L_lk/C) with L_lk = (1 − k²)Lp, capped by a clamp.
 * The supply's loaded voltage is found by Newton's method on V = Voc − I_in(V)·R_s (blockingOscillatorNumbers).
 */
export function estimateBlockingOscillator(
  driver: DriverStage,
  options: BlockingOscillatorOptions = {},
): BlockingOscillatorEstimate {
  return estimateOf(driver, options, blockingOscillatorNumbers(driver, options));
}

/** The estimate with its method notes from numbers already computed by `blockingOscillatorNumbers`. */
export function estimateOf(
  driver: DriverStage,
  options: BlockingOscillatorOptions,
  r: OscillatorNumbers,
): BlockingOscillatorEstimate {
  const seriesR = driver.transformer.primaryResistanceOhm + (driver.collectorResistorOhm ?? 0);
  const nodeC = options.collectorNodeCapacitanceF ?? collectorNodeCapacitanceOf(driver);
  const limitNote =
    r.limit === 'base'
      ? 'base-limited: the ramp ends at the regenerative turn-off, where the collector current reaches hFE·I_B(i)'
      : 'saturation-limited: the core saturates before the turn-off point; stored energy stops at the saturation current';
  return {
    supplyVoltageV: est(
      r.vin,
      method(
        'supply.loaded',
        'Loaded supply voltage V = Voc − I_in·R_s, solved by Newton’s method (safeguarded by bisection).',
        [],
        "Ohm's law (Thevenin source)",
      ),
    ),
    baseCurrentA: est(
      r.ib,
      method(
        'bo.base-current',
        'I_B = (Vin + (Vin − Vce,sat)·N_b/N_p − V_BE)/(R_B + R_fb) at the start of the on-time; feedback winding returned to the supply rail.',
        ['V_BE constant'],
        'base drive V_B ≈ Vin·Nb/Np, I_B = (V_B − V_BE)/R_B (common practice, no source)',
      ),
    ),
    onTimeLimit: r.limit,
    peakPrimaryCurrentA: est(
      r.ipk,
      method(
        'bo.peak-current',
        `Ipk = min(i_off, I_sat), i_off = hFE·I_B0/(1 + hFE·R·N_b/(N_p·R_B')) where i = hFE·I_B(i); ${limitNote}.`,
      ),
    ),
    collectorPeakCurrentA: est(
      r.collectorPeakA,
      method(
        'bo.collector-peak-current',
        r.limit === 'base'
          ? 'Collector peak = the turn-off current i_off = hFE·I_B(i_off).'
          : 'After core saturation the collector current climbs to the turn-off point i_off = hFE·I_B(i_off): that is the stress peak.',
      ),
    ),
    baseLimitedCurrentA: r.baseLimitedA,
    onTimeS: est(
      r.tOn,
      method(
        'bo.on-time',
        seriesR > 0
          ? 't_on = −(Lp/R)·ln(1 − Ipk·R/(Vin − Vce,sat)), the first-order ramp with series resistance R.'
          : 't_on = Lp·Ipk/(Vin − Vce,sat), the linear ramp.',
      ),
    ),
    flybackTimeS: est(
      r.tFly,
      method('bo.flyback-time', 't_fly = Lp·Ipk/Vr, volt-second balance with the reflected voltage Vr = V₋·N_p/N_s.', [
        'diode drop neglected against the flyback voltage',
      ]),
    ),
    frequencyHz: est(r.frequencyHz, method('bo.frequency', 'f = 1/(t_on + t_fly).')),
    energyPerCycleJ: est(r.energyJ, method('bo.energy', 'E = ½·Lp·Ipk².')),
    deliverablePowerW: est(
      r.deliverableW,
      method('bo.deliverable-power', 'P = E·f·η_fly with η_fly = k² − secondary copper loss share.', [
        'leakage energy (1 − k²)·E lost in the clamp or ringing',
      ]),
    ),
    forwardSecondaryPeakV: est(
      r.forwardSecV,
      method(
        'bo.forward-peak',
        'V₊ = k·(Vin − Vce,sat)·N_s/N_p during the on-time (open-circuit ratio of coupled windings M/Lp).',
        ['secondary unloaded during the on-time'],
      ),
    ),
    flybackSecondaryPeakV: est(
      r.flybackSecV,
      method(
        'bo.flyback-peak',
        options.flybackSecondaryPeakV !== undefined
          ? 'V₋ held by the load, capped by the clamp or breakdown limit.'
          : driver.clamp
            ? 'V₋ = k·(V_clamp − Vin)·N_s/N_p: the largest flyback the collector clamp allows (no load holding it lower).'
            : 'V₋ = k·(Vce0,max − Vin)·N_s/N_p: with no clamp and no load the flyback rises to the collector breakdown.',
      ),
    ),
    maxFlybackSecondaryPeakV: r.maxFlybackSecV,
    reflectedVoltageV: est(r.reflectedV, method('bo.reflected', 'Vr = V₋·N_p/(k·N_s).')),
    collectorPeakV: est(
      r.collectorPeakV,
      method(
        'bo.collector-peak-voltage',
        driver.clamp
          ? 'Vce,pk = min(V_clamp, Vin + Vr + Ipk·√(L_lk/C)).'
          : 'Vce,pk = Vin + Vr + Ipk·√(L_lk/C), leakage L_lk = (1 − k²)·Lp into the collector node capacitance C.',
        [`collector node capacitance ${nodeC} F`],
      ),
    ),
    inputCurrentA: est(
      r.inputA,
      method('bo.input-current', 'I_in = (f·(Vin·∫i_p dt + ∫V_B·I_B dt) + P_forward)/Vin + I_lamp.'),
    ),
    inputPowerW: est(r.inputW, method('bo.input-power', 'P_in = Vin·I_in, at the supply terminals.')),
    efficiency: est(
      (r.deliverableW + (options.forwardLoadPowerW ?? 0)) / r.inputW,
      method(
        'bo.efficiency',
        'The stage’s transfer efficiency η = (P_deliverable + P_forward)/P_in, before the ladder (not the supply’s overall efficiency).',
      ),
    ),
    losses: r.losses,
    emfPowerW: r.emfW,
  };
}
