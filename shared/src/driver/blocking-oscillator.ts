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
  /** Capacitance (F) at the collector node, for the leakage spike of an unclamped stage. Default 100 pF. */
  collectorNodeCapacitanceF?: number;
  /** State of charge of a cells supply (1 = full). Default 1. */
  chargeFraction?: number;
}

export interface BlockingOscillatorEstimate {
  supplyVoltageV: Estimated;
  baseCurrentA: Estimated;
  onTimeLimit: OnTimeLimit;
  /** Primary current at the end of the on-time, the current whose energy is stored. */
  peakPrimaryCurrentA: Estimated;
  /** Collector peak current for the stress checks (above the stored-energy peak when the core saturates). */
  collectorPeakCurrentA: Estimated;
  /** Collector current the base drive can hold in saturation, hFE·I_B. */
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
  efficiency: Estimated;
}

const defaultCollectorNodeCapacitanceF = 100e-12;

const source3 =
  'Wikipedia "Blocking oscillator" (read); Pressman, Switching Power Supply Design, 3rd ed. (from memory)';
const commonAssumptions = [
  'supply bypassed: the stage sees the mean loaded supply voltage',
  'magnetizing inductance ≈ primary inductance (k close to 1)',
  'load current reflected into the collector during the on-time neglected for the turn-off point',
  'next on-time starts as the flyback current reaches zero (no dead time)',
];

function method(methodId: string, summary: string, assumptions: string[] = [], source = source3): MethodInfo {
  return { methodId, summary, assumptions: [...commonAssumptions, ...assumptions], source };
}

function est(value: number, m: MethodInfo): Estimated {
  return { value, method: m };
}

/**
 * Closed-form estimate of a blocking oscillator with the feedback winding returned to the supply rail
 * (self-starting through R_B). All results in SI units with the method that produced each.
 * Relations (REFERENCES.md §3):
 *  - base drive: V_B = Vin + (Vin − Vce,sat)·N_b/N_p, I_B = (V_B − V_BE)/(R_B + R_fb)  (common practice);
 *  - primary ramp: i(t) = (Vin − Vce,sat)·t/Lp, with series resistance R the exact first-order form
 *    i(t) = (V/R)(1 − e^(−R t/Lp)) (read: Wikipedia "Blocking oscillator");
 *  - on-time ends at hFE·I_B or at the core saturation current, whichever comes first;
 *  - secondary peaks V = k·(N_s/N_p)·V_primary (open-circuit ratio M/Lp of coupled windings);
 *  - flyback time from the volt-second balance t_fly = Lp·Ipk/Vr, Vr = V₋·N_p/(k·N_s) (memory: Pressman);
 *  - E = ½ Lp Ipk², P = E f η (common practice; memory: Pressman);
 *  - Vce,max = Vin + Vr + leakage spike, the spike Ipk·√(L_lk/C) with L_lk = (1 − k²)Lp, capped by a clamp.
 * The supply's loaded voltage is found by fixed-point iteration on its internal resistance.
 */
export function estimateBlockingOscillator(
  driver: DriverStage,
  options: BlockingOscillatorOptions = {},
): BlockingOscillatorEstimate {
  const { transformer: tx, transistor: q } = driver;
  const { openCircuitV, resistanceOhm } = supplyThevenin(driver.supply, options.chargeFraction ?? 1);
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
  const lp = tx.primaryInductanceH;
  const k = tx.couplingCoefficient;
  const turnsRatio = tx.secondaryTurns / tx.primaryTurns;
  const seriesR = tx.primaryResistanceOhm + (driver.collectorResistorOhm ?? 0);
  const lampA = driver.indicatorLamp?.currentA ?? 0;
  const nodeC = options.collectorNodeCapacitanceF ?? defaultCollectorNodeCapacitanceF;

  const evaluate = (vin: number) => {
    const vPrimary = vin - q.vceSatV;
    const vBase = vin + vPrimary * (tx.feedbackTurns / tx.primaryTurns);
    const ib = (vBase - q.vbeOnV) / (driver.baseResistorOhm + tx.feedbackResistanceOhm);
    if (!(vPrimary > 0) || !(ib > 0)) {
      throw new DomainError('invalid_design', 'the supply is too low to turn the transistor on', 'driver.supply');
    }
    const baseLimitedA = q.forwardBeta * ib;
    const limit: OnTimeLimit = baseLimitedA <= tx.saturationCurrentA ? 'base' : 'saturation';
    const ipk = Math.min(baseLimitedA, tx.saturationCurrentA);
    let tOn: number;
    if (seriesR > 0) {
      const finalA = vPrimary / seriesR;
      if (ipk >= finalA) {
        throw new DomainError(
          'invalid_design',
          'winding resistance holds the primary current below the turn-off current: the stage does not switch off',
          'driver.transformer.primaryResistanceOhm',
        );
      }
      tOn = -(lp / seriesR) * Math.log(1 - ipk / finalA);
    } else {
      tOn = (lp * ipk) / vPrimary;
    }
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
    const flybackEfficiency = Math.max(0, k * k - copperJ / energyJ);
    const deliverableW = energyJ * frequencyHz * flybackEfficiency;
    // Supply energy per cycle: primary ramp Vin·∫i dt plus the base drive V_B·I_B·t_on.
    const rampChargeC = seriesR > 0 ? (vPrimary / seriesR) * tOn - (lp * ipk) / seriesR : 0.5 * ipk * tOn;
    const driveW = frequencyHz * (vin * rampChargeC + vBase * ib * tOn);
    const forwardW = options.forwardLoadPowerW ?? 0;
    const inputW = driveW + forwardW + vin * lampA;
    const leakageH = (1 - k * k) * lp;
    const spikeV = ipk * Math.sqrt(leakageH / nodeC);
    const unclampedPeakV = vin + reflectedV + spikeV;
    const collectorPeakV = driver.clamp ? Math.min(driver.clamp.clampVoltageV, unclampedPeakV) : unclampedPeakV;
    return {
      vPrimary,
      ib,
      baseLimitedA,
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
      collectorPeakV,
      forwardSecV: vPrimary * k * turnsRatio,
      flybackEfficiency,
      collectorPeakA: limit === 'base' ? ipk : baseLimitedA,
    };
  };

  let vin = openCircuitV;
  let r = evaluate(vin);
  for (let it = 0; it < 100 && resistanceOhm > 0; it++) {
    const next = openCircuitV - (r.inputW / vin) * resistanceOhm;
    if (!(next > 0))
      throw new DomainError(
        'invalid_design',
        'the supply resistance is too high for the drawn current',
        'driver.supply',
      );
    const settled = Math.abs(next - vin) < 1e-9 * openCircuitV;
    vin = 0.5 * (vin + next);
    r = evaluate(vin);
    if (settled) break;
  }
  const inputA = r.inputW / vin;

  const limitNote =
    r.limit === 'base'
      ? 'base-limited: the ramp ends when the collector current reaches hFE·I_B'
      : 'saturation-limited: the core saturates before hFE·I_B; stored energy stops at the saturation current';
  return {
    supplyVoltageV: est(
      vin,
      method(
        'supply.loaded',
        'Loaded supply voltage V = Voc − I_in·R_s, solved by fixed-point iteration.',
        [],
        "Ohm's law (Thevenin source)",
      ),
    ),
    baseCurrentA: est(
      r.ib,
      method(
        'bo.base-current',
        'I_B = (Vin + (Vin − Vce,sat)·N_b/N_p − V_BE)/(R_B + R_fb); feedback winding returned to the supply rail.',
        ['V_BE constant'],
        'base drive V_B ≈ Vin·Nb/Np, I_B = (V_B − V_BE)/R_B (common practice, no source)',
      ),
    ),
    onTimeLimit: r.limit,
    peakPrimaryCurrentA: est(r.ipk, method('bo.peak-current', `Ipk = min(hFE·I_B, I_sat); ${limitNote}.`)),
    collectorPeakCurrentA: est(
      r.collectorPeakA,
      method(
        'bo.collector-peak-current',
        r.limit === 'base'
          ? 'Collector peak = hFE·I_B.'
          : 'After core saturation the collector current climbs to hFE·I_B: that is the stress peak.',
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
      inputA,
      method('bo.input-current', 'I_in = (f·(Vin·∫i_p dt + V_B·I_B·t_on) + P_forward)/Vin + I_lamp.'),
    ),
    inputPowerW: est(r.inputW, method('bo.input-power', 'P_in = Vin·I_in.')),
    efficiency: est(
      (r.deliverableW + (options.forwardLoadPowerW ?? 0)) / r.inputW,
      method('bo.efficiency', 'η = (P_deliverable + P_forward)/P_in.'),
    ),
  };
}
