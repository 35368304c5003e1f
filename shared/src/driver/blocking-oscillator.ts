import { DomainError } from '../errors';
import { supplyThevenin } from './battery';
import type { DriverStage } from '../designs/driver-stage.types';
import type { Estimated, MethodInfo } from '../methods';
import type {
  BlockingOscillatorEstimate,
  BlockingOscillatorOptions,
  OscillatorNumbers,
} from './blocking-oscillator.types';
import { checkStage } from './check-stage';
import { collectorNodeCapacitanceOf, stageAt } from './oscillator-stage';

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

/** The stage's numbers at the voltage supplyResidualV was last called with (null where it does not run). */
const lastResidual: { state: OscillatorNumbers | null } = { state: null };

/**
 * h(V) = V − Voc + R_s·I_in(V) at one terminal voltage (V), keeping the stage's numbers there in
 * `lastResidual`; below its turn-on voltage the stage draws nothing. A function of the module, not a
 * closure per solve: the driver's operating point solves the supply some hundred times per design.
 */
function supplyResidualV(
  driver: DriverStage,
  options: BlockingOscillatorOptions,
  v: number,
  voc: number,
  resistanceOhm: number,
): number {
  try {
    lastResidual.state = stageAt(driver, options, v, voc, resistanceOhm);
    return v - voc + resistanceOhm * lastResidual.state.inputA;
  } catch (error) {
    lastResidual.state = null;
    if (error instanceof DomainError && error.message.startsWith('the supply is too low')) return v - voc;
    throw error;
  }
}

/**
 * The blocking oscillator's estimate as plain numbers (SI units), the loaded supply voltage solved by a
 * safeguarded Newton (secant) iteration on h(V) = V − Voc + R_s·I_in(V) (first slope by a forward difference,
 * then secant steps; a step leaving the bracket [lo, hi] of the root becomes a bisection). `options.supplyVoltageGuessV`
 * and `options.supplySlopeGuess` warm-start it (Newton's first step then takes the nearby slope).
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
  let lo = 0;
  let hi = voc;
  const guess = options.supplyVoltageGuessV;
  let v = guess !== undefined && guess > 0 && guess <= voc ? guess : voc;
  const tolV = 1e-10 * voc;
  let hv = supplyResidualV(driver, options, v, voc, resistanceOhm);
  // The first slope by a forward difference, then secant steps from the last two points, each kept inside
  // the bracket [lo, hi] of the root (a bisection otherwise).
  let prevV = NaN;
  let prevH = NaN;
  let slope = options.supplySlopeGuess !== undefined && options.supplySlopeGuess > 0 ? options.supplySlopeGuess : NaN;
  for (let it = 0; it < 100 && Math.abs(hv) > tolV; it++) {
    if (hv > 0) hi = v;
    else lo = v;
    if (hi - lo <= tolV) break;
    if (!Number.isNaN(prevV) && prevV !== v) {
      slope = (hv - prevH) / (v - prevV);
    } else if (Number.isNaN(slope)) {
      const dv = Math.max(1e-7 * voc, 4 * tolV) * (v - lo > hi - v ? -1 : 1);
      slope = (supplyResidualV(driver, options, v + dv, voc, resistanceOhm) - hv) / dv;
    }
    let next = v - hv / slope;
    if (!Number.isFinite(next) || next <= lo || next >= hi) next = 0.5 * (lo + hi);
    prevV = v;
    prevH = hv;
    v = next;
    hv = supplyResidualV(driver, options, v, voc, resistanceOhm);
  }
  // A weak supply has no root where the stage runs: the iteration then closes on the turn-on voltage,
  // where h jumps from below zero (the stage off) to above it.
  if (Math.abs(hv) > 1e-6 * voc) {
    throw new DomainError('invalid_design', 'the supply resistance is too high for the drawn current', 'driver.supply');
  }
  const solved: OscillatorNumbers = lastResidual.state ?? stageAt(driver, options, v, voc, resistanceOhm);
  if (Number.isFinite(slope)) solved.supplySlope = slope;
  return solved;
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
  return {
    ...driveEstimates(r),
    ...timingEstimates(driver, r),
    ...voltageAndPowerEstimates(driver, options, r),
    losses: r.losses,
    emfPowerW: r.emfW,
  };
}

/** The loaded supply, the base drive and the currents of the on-time, with their method notes. */
function driveEstimates(
  r: OscillatorNumbers,
): Pick<
  BlockingOscillatorEstimate,
  | 'supplyVoltageV'
  | 'baseCurrentA'
  | 'onTimeLimit'
  | 'peakPrimaryCurrentA'
  | 'collectorPeakCurrentA'
  | 'baseLimitedCurrentA'
> {
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
  };
}

/** The on-time, flyback time, frequency, stored energy and deliverable power, with their method notes. */
function timingEstimates(
  driver: DriverStage,
  r: OscillatorNumbers,
): Pick<
  BlockingOscillatorEstimate,
  'onTimeS' | 'flybackTimeS' | 'ringBack' | 'frequencyHz' | 'energyPerCycleJ' | 'deliverablePowerW'
> {
  const seriesR = driver.transformer.primaryResistanceOhm + (driver.collectorResistorOhm ?? 0);
  return {
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
    ringBack: { swingS: r.tSwing, recoveryS: r.tRecovery },
    frequencyHz: est(
      r.frequencyHz,
      method(
        'bo.frequency',
        'f = 1/(t_on + t_fly + t_swing + t_recovery): after the flyback the collector node capacitance C (stray, snubber, the secondary’s self-capacitance and the ladder’s diode junctions reflected by (Ns/Np)²) rings down about Vin, a quarter period t_swing = (π/2)·√(Lp·C) to Vin, where the transistor turns on with the magnetizing current at −I0 = −Vr·√(C/Lp); it returns to zero through the transistor conducting backwards, t_recovery = Lp·I0/(Vin + V_BE).',
        ['the ladder’s diodes swing by the secondary’s peak-to-peak; their junction charge at VJ 1 V, M 0.5'],
        'resonant LC ring and volt-second balance (common practice, no source)',
      ),
    ),
    energyPerCycleJ: est(r.energyJ, method('bo.energy', 'E = ½·Lp·Ipk².')),
    deliverablePowerW: est(
      r.deliverableW,
      method('bo.deliverable-power', 'P = E·f·η_fly with η_fly = k² − secondary copper loss share.', [
        'leakage energy (1 − k²)·E lost in the clamp or ringing',
      ]),
    ),
  };
}

/** The secondary and collector voltages, the input current and power and the efficiency, with their method notes. */
function voltageAndPowerEstimates(
  driver: DriverStage,
  options: BlockingOscillatorOptions,
  r: OscillatorNumbers,
): Pick<
  BlockingOscillatorEstimate,
  | 'forwardSecondaryPeakV'
  | 'flybackSecondaryPeakV'
  | 'maxFlybackSecondaryPeakV'
  | 'reflectedVoltageV'
  | 'collectorPeakV'
  | 'inputCurrentA'
  | 'inputPowerW'
  | 'efficiency'
> {
  const nodeC = options.collectorNodeCapacitanceF ?? collectorNodeCapacitanceOf(driver);
  return {
    forwardSecondaryPeakV: est(
      r.forwardSecV,
      method(
        'bo.forward-peak',
        'V₊ = k·(Vin − Vce,sat)·N_s/N_p during the on-time (open-circuit ratio of coupled windings M/Lp); a ladder that takes less charge per cycle than the ring-back returns, ½·I0·t_recovery·N_p/N_s, charges towards k·(Vin + V_BE)·N_s/N_p instead (the operating point).',
        ['secondary unloaded during the on-time'],
      ),
    ),
    flybackSecondaryPeakV: est(
      r.flybackSecV,
      method(
        'bo.flyback-peak',
        options.flybackSecondaryPeakV !== undefined
          ? 'V₋ held by the load, capped by the clamp or breakdown limit.'
          : driver.clamp?.kind === 'rcd'
            ? 'V₋ = k·Vr·N_s/N_p with the primary at the RCD clamp’s level Vc = k²·Vr, where its resistor takes the whole flyback: ½·C·Vc²·(1 − e^(−2T/RC)) = ½·Lp·(Ipk² − I0²) per cycle (pulse-charged RC; Vc²/R = E·f when T ≪ RC).'
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
        driver.clamp?.kind === 'rcd'
          ? 'Vce,pk = min(Vin + Vc, Vin + Vr + Ipk·√(L_lk/C)): the RCD clamp’s capacitor at the flyback’s primary-side peak k²·Vr, at least where its resistor takes the leakage energy, ½·C·Vc²·(1 − e^(−2T/RC)) = ½·(1 − k²)·Lp·Ipk²; its resistor’s power beyond that energy comes out of the flyback the load gets.'
          : driver.clamp
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
  };
}
