import { DomainError } from '../errors';
import type { DriverStage } from '../designs/driver-stage.types';
import type {
  BlockingOscillatorOptions,
  OnTimeLimit,
  OscillatorNumbers,
  StageLosses,
} from './blocking-oscillator.types';
import { rampChargeC, rampSquareIntegral } from './primary-ramp';
import { rcdClampLimit, rcdClampPartsOf, rcdClampUnderLoad } from './rcd-clamp';
import { ringBackUnder, type RingBack } from './ring-back';

/** Capacitance at the collector node when none is given (F), for the leakage spike and the switching loss. */
export const DEFAULT_COLLECTOR_NODE_CAPACITANCE_F = 100e-12;

/**
 * Capacitance at the collector node (F): the default stray plus the secondary's self-capacitance reflected
 * by the turns ratio squared, C·(Ns/Np)², which the collector charges and the transistor discharges each cycle.
 */
export function collectorNodeCapacitanceOf(driver: DriverStage): number {
  const tx = driver.transformer;
  return (
    (driver.collectorStrayCapacitanceF ?? DEFAULT_COLLECTOR_NODE_CAPACITANCE_F) +
    (tx.secondaryCapacitanceF ?? 0) * (tx.secondaryTurns / tx.primaryTurns) ** 2
  );
}
/**
 * The collector level (V) nothing but the flyback's own balance lets the collector pass: a zener clamp's voltage,
 * else the transistor's V_CEO. (An RCD clamp's level follows from its parts, rcd-clamp.ts.)
 */
export function collectorHardLimitV(driver: DriverStage): number {
  return driver.clamp?.kind === 'zener' ? driver.clamp.clampVoltageV : driver.transistor.vceoMaxV;
}
/** Supply bypass at the stage when none is given (F): the simulated circuit's default. */
export const DEFAULT_BYPASS_CAPACITANCE_F = 100e-6;
/** The transistor's Ebers–Moll saturation current when the design gives none: the simulator's default. */
export const DEFAULT_TRANSISTOR_SATURATION_CURRENT_A = 1e-14;
/** kT/q at 300.15 K from the exact SI constants (CODATA 2018), as the simulator's junctions take it. */
export const THERMAL_VOLTAGE_V = (1.380649e-23 * 300.15) / 1.602176634e-19;

/** The stage's fixed ratios and resistances (Ω), read once from the design. */
interface StageConstants {
  lp: number;
  k: number;
  turnsRatio: number;
  fbRatio: number;
  /** Primary winding plus collector resistor. */
  seriesR: number;
  /** Base resistor plus feedback winding. */
  baseR: number;
}

/** The primary ramp of the on-time (SI units): where it ends and why. */
interface OnTimeRamp {
  /** Series resistance of the ramp, the unbypassed supply share included. */
  rampR: number;
  /** The ramp's source voltage. */
  sourceV: number;
  turnOffA: number;
  /** Current the ramp tends to (∞ without series resistance). */
  finalA: number;
  ipk: number;
  limit: OnTimeLimit;
  tOn: number;
}

/** The flyback's transfer to the secondary (SI units). */
interface FlybackTransfer {
  maxFlybackSecV: number;
  flybackSecV: number;
  reflectedV: number;
  /** The collector's level (V) the clamp holds it at, null without a clamp. */
  clampCollectorV: number | null;
  /** Flyback power an RCD clamp takes beyond the leakage energy (W), out of what the load could have had. */
  clampTakesW: number;
  tFly: number;
  ring: RingBack;
  /** Secondary forward level while the ring-back recovers (V). */
  recoveryForwardSecV: number;
  /** Charge the secondary can pass at that level in one recovery (C). */
  recoveryChargeC: number;
  frequencyHz: number;
  energyJ: number;
  /** Secondary copper loss of one flyback pulse. */
  copperJ: number;
  coreJ: number;
  flybackEfficiency: number;
  deliverableW: number;
}

function stageConstants(driver: DriverStage): StageConstants {
  const tx = driver.transformer;
  return {
    lp: tx.primaryInductanceH,
    k: tx.couplingCoefficient,
    turnsRatio: tx.secondaryTurns / tx.primaryTurns,
    fbRatio: tx.feedbackTurns / tx.primaryTurns,
    seriesR: tx.primaryResistanceOhm + (driver.collectorResistorOhm ?? 0),
    baseR: driver.baseResistorOhm + tx.feedbackResistanceOhm,
  };
}

/**
 * The estimate at one terminal voltage `vin` (V), as plain numbers. Throws a DomainError when the stage
 * cannot run there (too low to turn on, no room for a flyback, latched on).
 */
export function stageAt(
  driver: DriverStage,
  options: BlockingOscillatorOptions,
  vin: number,
  openCircuitV: number,
  supplyResistanceOhm: number,
): OscillatorNumbers {
  const { transistor: q } = driver;
  const c = stageConstants(driver);
  const vPrimary = vin - q.vceSatV;
  const vBase = vin + vPrimary * c.fbRatio;
  const ib = (vBase - q.vbeOnV) / c.baseR;
  if (!(vPrimary > 0) || !(ib > 0)) {
    throw new DomainError('invalid_design', 'the supply is too low to turn the transistor on', 'driver.supply');
  }
  const ramp = onTimeRamp(driver, c, options, vin, openCircuitV, supplyResistanceOhm);
  const fly = flybackTransfer(driver, c, options, vin, ramp);
  const power = stagePower(driver, c, options, { vin, openCircuitV, ib, vBase }, ramp, fly);
  return {
    openCircuitV,
    supplyResistanceOhm,
    vin,
    vPrimary: ramp.sourceV - q.vceSatV,
    ib,
    ibMean: power.ibMean,
    vBase,
    baseLimitedA: q.forwardBeta * ib,
    turnOffA: ramp.turnOffA,
    limit: ramp.limit,
    ipk: ramp.ipk,
    tOn: ramp.tOn,
    tFly: fly.tFly,
    tSwing: fly.ring.swingS,
    tRecovery: fly.ring.recoveryS,
    frequencyHz: fly.frequencyHz,
    energyJ: fly.energyJ,
    deliverableW: fly.deliverableW,
    loadDeliverableW: fly.deliverableW - fly.clampTakesW,
    flybackSecV: fly.flybackSecV,
    maxFlybackSecV: fly.maxFlybackSecV,
    reflectedV: fly.reflectedV,
    inputW: power.inputW,
    emfW: power.emfW,
    inputA: power.inputA,
    collectorPeakV: power.collectorPeakV,
    forwardSecV: vPrimary * c.k * c.turnsRatio,
    recoveryForwardSecV: fly.recoveryForwardSecV,
    recoveryChargeC: fly.recoveryChargeC,
    flybackEfficiency: fly.flybackEfficiency,
    collectorPeakA: ramp.limit === 'base' ? ramp.ipk : ramp.turnOffA,
    losses: power.losses,
  };
}

/**
 * The on-time's primary ramp at terminal voltage `vin`. The bypass capacitor holds the supply at its mean
 * over a cycle only when its time constant R_s·C is long against the on-time; otherwise the supply's
 * resistance is in series with the ramp. The share it leaves in series, φ(u) = 1 − (1 − e^(−u))/u with
 * u = t_on/(R_s·C), is the mean over the on-time of a first-order low-pass's step response; iterated twice
 * with the on-time.
 */
function onTimeRamp(
  driver: DriverStage,
  c: StageConstants,
  options: BlockingOscillatorOptions,
  vin: number,
  openCircuitV: number,
  supplyResistanceOhm: number,
): OnTimeRamp {
  const { transformer: tx, transistor: q } = driver;
  const bypassF = options.bypassCapacitanceF ?? DEFAULT_BYPASS_CAPACITANCE_F;
  const meanA = supplyResistanceOhm > 0 ? Math.max(0, (openCircuitV - vin) / supplyResistanceOhm) : 0;
  const ramp: OnTimeRamp = {
    rampR: c.seriesR,
    sourceV: vin,
    turnOffA: 0,
    finalA: Infinity,
    ipk: 0,
    limit: 'base',
    tOn: 0,
  };
  let unbypassedOhm = 0;
  for (let pass = 0; pass < (supplyResistanceOhm > 0 ? 3 : 1); pass++) {
    // The ramp's source: the held supply vin plus the unbypassed share's drop at the mean current, behind it.
    ramp.sourceV = vin + meanA * unbypassedOhm;
    ramp.rampR = c.seriesR + unbypassedOhm;
    ramp.turnOffA = turnOffCurrentA(driver, c, ramp.sourceV, unbypassedOhm);
    if (!(ramp.turnOffA > 0)) {
      throw new DomainError('invalid_design', 'the supply is too low to turn the transistor on', 'driver.supply');
    }
    ramp.finalA = ramp.rampR > 0 ? (ramp.sourceV - q.vceSatV) / ramp.rampR : Infinity;
    ramp.limit = ramp.turnOffA <= tx.saturationCurrentA ? 'base' : 'saturation';
    ramp.ipk = Math.min(ramp.turnOffA, tx.saturationCurrentA);
    if (ramp.ipk >= ramp.finalA) {
      throw new DomainError(
        'invalid_design',
        'winding resistance holds the primary current below the turn-off current even with the base drive falling with the winding voltage: the stage latches on',
        'driver.transformer.primaryResistanceOhm',
      );
    }
    ramp.tOn =
      ramp.rampR > 0
        ? -(c.lp / ramp.rampR) * Math.log(1 - ramp.ipk / ramp.finalA)
        : (c.lp * ramp.ipk) / (ramp.sourceV - q.vceSatV);
    if (supplyResistanceOhm > 0) {
      const u = ramp.tOn / (supplyResistanceOhm * bypassF);
      const next = supplyResistanceOhm * (u > 1e-6 ? 1 - -Math.expm1(-u) / u : u / 2);
      const isSettled = Math.abs(next - unbypassedOhm) <= 1e-9 * supplyResistanceOhm;
      unbypassedOhm = next;
      if (isSettled) break;
    }
  }
  return ramp;
}

/**
 * The collector current (A) of the regenerative turn-off from a ramp source `sourceV`. The feedback winding
 * carries the primary winding's voltage V0 − i·R: the base current falls as the current rises, and the
 * transistor leaves saturation where i = hFE·I_B(i):
 * i_off = hFE·(V0·(1 + N_b/N_p) − Vce,sat·N_b/N_p − V_BE,off)/R_B' / (1 + hFE·(R_u·(1 + N_b/N_p) + R·N_b/N_p)/R_B'),
 * R_u the unbypassed supply share, V_BE,off the junction's own voltage at that current, V_T·ln(1 + i_off/I_S)
 * (Ebers–Moll forward law), by three fixed-point passes.
 */
function turnOffCurrentA(driver: DriverStage, c: StageConstants, sourceV: number, unbypassedOhm: number): number {
  const q = driver.transistor;
  const isA = q.saturationCurrentA ?? DEFAULT_TRANSISTOR_SATURATION_CURRENT_A;
  const gainFactor = 1 + (q.forwardBeta * (unbypassedOhm * (1 + c.fbRatio) + c.seriesR * c.fbRatio)) / c.baseR;
  const driveV = sourceV * (1 + c.fbRatio) - q.vceSatV * c.fbRatio;
  let turnOffA = (q.forwardBeta * (driveV - q.vbeOnV)) / c.baseR / gainFactor;
  for (let k3 = 0; k3 < 3 && turnOffA > 0; k3++) {
    const vbeOff = THERMAL_VOLTAGE_V * Math.log1p(turnOffA / isA);
    turnOffA = (q.forwardBeta * Math.max(0, driveV - vbeOff)) / c.baseR / gainFactor;
  }
  return turnOffA;
}

/** The period (s): on-time, flyback at `reflectedV` (V), the ring-back's swing and recovery. */
function periodAt(c: StageConstants, ramp: OnTimeRamp, reflectedV: number, r: RingBack): number {
  return ramp.tOn + (c.lp * ramp.ipk) / reflectedV + r.swingS + r.recoveryS;
}

/**
 * The flyback: the reflected voltage the load (or the clamp, or the breakdown) allows, its duration by the
 * volt-second balance, and the share of the stored energy that reaches the secondary. The leakage share
 * (1 − k²) goes to the clamp or the ringing; secondary copper loss of the triangular current pulse, peak
 * Ipk·Np/Ns, is I²R·t/3.
 */
function flybackTransfer(
  driver: DriverStage,
  c: StageConstants,
  options: BlockingOscillatorOptions,
  vin: number,
  ramp: OnTimeRamp,
): FlybackTransfer {
  const { transformer: tx, transistor: q } = driver;
  const { k, lp, turnsRatio } = c;
  const ipk = ramp.ipk;
  // The forward pulse: the primary at Vin − Vce,sat in the on-time, at Vin + V_BE while the ring-back recovers.
  const onForwardSecV = (vin - q.vceSatV) * k * turnsRatio;
  const nodeF = options.collectorNodeCapacitanceF ?? collectorNodeCapacitanceOf(driver);
  const clamp = driver.clamp;
  const rcd = clamp?.kind === 'rcd' ? rcdClampPartsOf(clamp) : null;
  const leakageJ = 0.5 * (1 - k * k) * lp * ipk * ipk;
  // An RCD clamp's limit: it takes all the stored energy the ring-back does not return (the core's loss aside).
  const rcdLimit = rcd
    ? rcdClampLimit(rcd, k * k, vin, (vr) => {
        const r = ringBackUnder(driver, vin, vr, nodeF, options.secondaryLoad, onForwardSecV + vr * k * turnsRatio);
        const periodS = periodAt(c, ramp, vr, r);
        return {
          periodS,
          energyJ: 0.5 * lp * (ipk * ipk - r.recoveryStartA ** 2) - (tx.coreLossW ?? 0) * periodS,
        };
      })
    : null;
  const maxReflectedV = rcdLimit ? rcdLimit.reflectedV : collectorHardLimitV(driver) - vin;
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
  const ring = ringBackUnder(
    driver,
    vin,
    reflectedV,
    nodeF,
    options.secondaryLoad,
    onForwardSecV + reflectedV * k * turnsRatio,
  );
  const recoveryForwardSecV = (vin + q.vbeOnV) * k * turnsRatio;
  const recoveryChargeC = (0.5 * -ring.recoveryStartA * ring.recoveryS) / turnsRatio;
  const frequencyHz = 1 / periodAt(c, ramp, reflectedV, ring);
  const energyJ = 0.5 * lp * ipk * ipk;
  const iSecPk = ipk / turnsRatio;
  const copperJ = iSecPk * iSecPk * tx.secondaryResistanceOhm * (tFly / 3);
  const coreJ = Math.min((tx.coreLossW ?? 0) / frequencyHz, Math.max(0, k * k * energyJ - copperJ));
  const flybackEfficiency = Math.max(0, k * k - (copperJ + coreJ) / energyJ);
  const deliverableW = energyJ * frequencyHz * flybackEfficiency;
  let clampCollectorV = clamp?.kind === 'zener' ? clamp.clampVoltageV : null;
  let clampTakesW = 0;
  if (rcd && rcdLimit) {
    // Below its limit an RCD clamp dissipates Vc²/R at the flyback's primary-side peak k²·Vr: beyond the leakage
    // energy, that comes out of what the load could have had (rcdClampUnderLoad).
    const under = rcdClampUnderLoad(k * k * reflectedV, leakageJ, 1 / frequencyHz, rcd);
    clampTakesW = Math.min(deliverableW, Math.max(0, under.powerW - leakageJ * frequencyHz));
    clampCollectorV = vin + Math.min(rcdLimit.clampV, under.clampV);
  }
  return {
    maxFlybackSecV,
    flybackSecV,
    reflectedV,
    clampCollectorV,
    clampTakesW,
    tFly,
    ring,
    recoveryForwardSecV,
    recoveryChargeC,
    frequencyHz,
    energyJ,
    copperJ,
    coreJ,
    flybackEfficiency,
    deliverableW,
  };
}

/**
 * Power into the stage, where it goes, and the collector's peak voltage. Supply charge per cycle: the
 * primary ramp ∫i dt plus the base drive, with I_B falling linearly in i: mean I_B = I_B0 − R·(N_b/N_p)·(Q/t_on)/R_B'.
 * Energy into the stage per cycle, from Kirchhoff's law along the primary loop: V0·Q − R_u·∫i² =
 * Vce,sat·Q + R·∫i² + E, plus the base drive ∫V_B·I_B dt (the rail's share directly, the feedback winding's
 * through the primary). The supply current is that power over the mean terminal voltage. The collector node
 * capacitance, recharged by each flyback, is discharged through the transistor at each turn-on.
 */
function stagePower(
  driver: DriverStage,
  c: StageConstants,
  options: BlockingOscillatorOptions,
  at: { vin: number; openCircuitV: number; ib: number; vBase: number },
  ramp: OnTimeRamp,
  fly: FlybackTransfer,
): { ibMean: number; inputW: number; inputA: number; emfW: number; collectorPeakV: number; losses: StageLosses } {
  const { transformer: tx, transistor: q } = driver;
  const { k, lp, seriesR } = c;
  const { vin, ib, vBase } = at;
  const { ipk, tOn } = ramp;
  const { frequencyHz, energyJ } = fly;
  const tauS = ramp.rampR > 0 ? lp / ramp.rampR : Infinity;
  const rampC = rampChargeC(ramp.finalA, tauS, ipk, tOn);
  const rampSquareA2S = rampSquareIntegral(ramp.finalA, tauS, ipk, tOn);
  const ibMean = Math.max(0, ib - (seriesR * c.fbRatio * (rampC / tOn)) / c.baseR);
  const baseDriveJ = vBase * ibMean * tOn;
  const forwardW = options.forwardLoadPowerW ?? 0;
  const lampA = driver.indicatorLamp?.currentA ?? 0;
  const nodeC = options.collectorNodeCapacitanceF ?? collectorNodeCapacitanceOf(driver);
  const switchingJ = 0.5 * nodeC * vin * vin;
  const inputW =
    frequencyHz * (q.vceSatV * rampC + seriesR * rampSquareA2S + energyJ + baseDriveJ + switchingJ) +
    forwardW +
    vin * lampA;
  const inputA = inputW / vin;
  const leakageH = (1 - k * k) * lp;
  const spikeV = ipk * Math.sqrt(leakageH / nodeC);
  const unclampedPeakV = vin + fly.reflectedV + spikeV;
  const collectorPeakV = fly.clampCollectorV === null ? unclampedPeakV : Math.min(fly.clampCollectorV, unclampedPeakV);
  // The source's own loss: its EMF's power less what reaches the stage (R_s·I² at the solved supply voltage).
  const emfW = at.openCircuitV * inputA;
  const baseEmitterJ = q.vbeOnV * ibMean * tOn;
  const losses: StageLosses = {
    transistorConductionW: frequencyHz * q.vceSatV * rampC,
    transistorSwitchingW: switchingJ * frequencyHz,
    baseEmitterW: frequencyHz * baseEmitterJ,
    baseResistorW: frequencyHz * (baseDriveJ - baseEmitterJ),
    primaryCopperW: frequencyHz * tx.primaryResistanceOhm * rampSquareA2S,
    collectorResistorW: frequencyHz * (driver.collectorResistorOhm ?? 0) * rampSquareA2S,
    secondaryCopperW: frequencyHz * Math.min(fly.copperJ, k * k * energyJ),
    leakageW: frequencyHz * (1 - k * k) * energyJ,
    coreW: frequencyHz * fly.coreJ,
    lampW: vin * lampA,
    supplyResistanceW: Math.max(0, emfW - inputW),
  };
  return { ibMean, inputW, inputA, emfW, collectorPeakV, losses };
}
