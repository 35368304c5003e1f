import { DomainError } from '../errors';
import { estimateBlockingOscillator, type BlockingOscillatorEstimate, type BlockingOscillatorOptions } from './blocking-oscillator';
import type { DriverStage, MethodInfo } from './driver.types';

/** The secondary drive a ladder sees from a blocking oscillator: unequal forward and flyback peaks. */
export interface LadderDrive {
  forwardPeakV: number;
  flybackPeakV: number;
  frequencyHz: number;
}

/**
 * The ladder as the driver sees it: a Thevenin load line V(I) = V0(drive) − Zout(drive)·I. Any ladder
 * analysis can stand behind it (see `halfWaveCascadeLoadLine` for the textbook one).
 */
export interface LadderLoadLine {
  noLoadOutputV(drive: LadderDrive): number;
  outputImpedanceOhm(drive: LadderDrive): number;
}

/**
 * Textbook load line of an n-stage half-wave cascade with equal capacitors C (F) driven by asymmetric pulses:
 * V0 = n·(V₊ + V₋) (REFERENCES.md §1, derived row for blocking-oscillator drive) and
 * Zout = ΔV0/I = (2n³/3 + n²/2 − n/6)/(f·C) (read: J. Lux, "Cockcroft Walton Voltage Multipliers";
 * memory: Kuffel, Zaengl & Kuffel §2.2.2). Ideal diodes, no stray capacitance.
 */
export function halfWaveCascadeLoadLine(stages: number, capacitanceF: number): LadderLoadLine {
  if (!(Number.isInteger(stages) && stages >= 1)) throw new DomainError('invalid_argument', 'stages must be a positive integer', 'stages');
  if (!(capacitanceF > 0)) throw new DomainError('invalid_argument', 'capacitance must be positive', 'capacitanceF');
  const n = stages;
  return {
    noLoadOutputV: (d) => n * (d.forwardPeakV + d.flybackPeakV),
    outputImpedanceOhm: (d) => ((2 * n ** 3) / 3 + n ** 2 / 2 - n / 6) / (d.frequencyHz * capacitanceF),
  };
}

export type OperatingLimit = 'ladder' | 'power';

export interface LoadPoint {
  loadCurrentA: number;
  outputV: number;
  outputPowerW: number;
  /** 'ladder': the flyback sits at its clamp/breakdown limit and the ladder's impedance sets the output;
   *  'power': the driver's energy per cycle sets it (flyback below its limit). */
  limitedBy: OperatingLimit;
  flybackSecondaryPeakV: number;
  frequencyHz: number;
  supplyCurrentA: number;
  efficiency: number;
}

export interface OperatingPointResult {
  ratedLoad: LoadPoint & { driver: BlockingOscillatorEstimate };
  /** Load current above which the driver can no longer hold the flyback at its limit (A). */
  powerLimitOnsetA: number;
  /** Output vs load current from no load to the largest current with a positive output. */
  curve: LoadPoint[];
  method: MethodInfo;
}

const operatingPointMethod: MethodInfo = {
  methodId: 'driver-ladder.power-balance',
  summary:
    'Flyback peak V₋ from the power balance g·I·V₋ = E·f(V₋)·η (g = ∂V0/∂V₋, the charge the flyback pushes per unit output charge), capped at the clamp or breakdown limit; output V = V0(V₊, V₋) − Zout·I.',
  assumptions: [
    'forward pulse is a stiff source: the ladder takes g₊·V₊·I from it straight from the supply',
    'the flyback energy not taken by the ladder goes to the clamp',
    'ladder as a Thevenin load line at each drive',
  ],
  source: 'Energy conservation per cycle; REFERENCES.md §1 (ladder load line) and §3 (E = ½ Lp Ipk², P = E f η)',
};

/**
 * Where the driver meets the ladder: the output voltage (V) at a load current (A), with the limit that sets it.
 * Method: `operatingPointMethod` (power balance per cycle, see its summary).
 */
export function solveLoadPoint(driver: DriverStage, ladder: LadderLoadLine, loadCurrentA: number, options: BlockingOscillatorOptions = {}): LoadPoint & { driver: BlockingOscillatorEstimate } {
  if (!(loadCurrentA >= 0)) throw new DomainError('invalid_argument', 'load current must be ≥ 0', 'loadCurrentA');
  const limitEst = estimateBlockingOscillator(driver, options);
  const forwardV = limitEst.forwardSecondaryPeakV.value;
  const maxFlyV = limitEst.maxFlybackSecondaryPeakV;
  const driveAt = (flyV: number, f: number): LadderDrive => ({ forwardPeakV: forwardV, flybackPeakV: flyV, frequencyHz: f });
  const gain = (flyV: number, f: number) => {
    const dv = Math.max(1e-6 * maxFlyV, 1e-9);
    return (ladder.noLoadOutputV(driveAt(flyV + dv, f)) - ladder.noLoadOutputV(driveAt(flyV, f))) / dv;
  };
  const gainForward = (flyV: number, f: number) => {
    const dv = Math.max(1e-6 * forwardV, 1e-9);
    return (ladder.noLoadOutputV({ ...driveAt(flyV, f), forwardPeakV: forwardV + dv }) - ladder.noLoadOutputV(driveAt(flyV, f))) / dv;
  };
  const at = (flyV: number) => estimateBlockingOscillator(driver, { ...options, flybackSecondaryPeakV: flyV });
  // Surplus of flyback power over what the ladder takes, per volt of flyback. Copper loss makes it fall at
  // very slow flybacks too, so there can be two roots: take the highest (the stable one) by scanning down
  // from the limit on a log grid, then bisecting.
  const surplus = (flyV: number) => {
    const e = at(flyV);
    return e.deliverablePowerW.value / flyV - gain(flyV, e.frequencyHz.value) * loadCurrentA;
  };
  let flyV = maxFlyV;
  let limitedBy: OperatingLimit = 'ladder';
  if (loadCurrentA > 0 && surplus(maxFlyV) < 0) {
    limitedBy = 'power';
    const scanPoints = 120;
    let hi = maxFlyV;
    let lo: number | null = null;
    for (let k = 1; k <= scanPoints; k++) {
      const v = maxFlyV * 10 ** ((-6 * k) / scanPoints);
      if (surplus(v) >= 0) {
        lo = v;
        break;
      }
      hi = v;
    }
    if (lo === null) {
      flyV = maxFlyV * 1e-6; // the driver cannot push the ladder's charge at any flyback: output collapses
    } else {
      let below: number = lo;
      for (let k = 0; k < 60; k++) {
        const mid: number = 0.5 * (below + hi);
        if (surplus(mid) >= 0) below = mid;
        else hi = mid;
      }
      flyV = 0.5 * (below + hi);
    }
  }
  const flyEst = at(flyV);
  const f = flyEst.frequencyHz.value;
  const drive = driveAt(flyV, f);
  const outputV = Math.max(0, ladder.noLoadOutputV(drive) - ladder.outputImpedanceOhm(drive) * loadCurrentA);
  const forwardLoadPowerW = gainForward(flyV, f) * forwardV * loadCurrentA;
  const withForward = estimateBlockingOscillator(driver, { ...options, flybackSecondaryPeakV: flyV, forwardLoadPowerW });
  const outputPowerW = outputV * loadCurrentA;
  return {
    loadCurrentA,
    outputV,
    outputPowerW,
    limitedBy,
    flybackSecondaryPeakV: flyV,
    frequencyHz: withForward.frequencyHz.value,
    supplyCurrentA: withForward.inputCurrentA.value,
    efficiency: outputPowerW / withForward.inputPowerW.value,
    driver: withForward,
  };
}

/**
 * Operating point of the driver with the ladder: output at the rated load current (A), the onset of the
 * power limit (A), and the output-vs-load curve (`points` samples, default 41) up to the current at which
 * the output reaches zero or the driver can push no more charge.
 */
export function driverOperatingPoint(driver: DriverStage, ladder: LadderLoadLine, ratedLoadCurrentA: number, options: BlockingOscillatorOptions & { points?: number } = {}): OperatingPointResult {
  const points = options.points ?? 41;
  const limitEst = estimateBlockingOscillator(driver, options);
  const maxFlyV = limitEst.maxFlybackSecondaryPeakV;
  const drive: LadderDrive = { forwardPeakV: limitEst.forwardSecondaryPeakV.value, flybackPeakV: maxFlyV, frequencyHz: limitEst.frequencyHz.value };
  const dv = 1e-6 * maxFlyV;
  const g = (ladder.noLoadOutputV({ ...drive, flybackPeakV: maxFlyV + dv }) - ladder.noLoadOutputV(drive)) / dv;
  const powerLimitOnsetA = limitEst.deliverablePowerW.value / (g * maxFlyV);
  // Largest current: where the output reaches zero; bracket by doubling from the onset.
  let hiA = Math.max(powerLimitOnsetA, 1e-9);
  for (let k = 0; k < 60 && solveLoadPoint(driver, ladder, hiA, options).outputV > 0; k++) hiA *= 2;
  let loA = 0;
  for (let k = 0; k < 50; k++) {
    const mid = 0.5 * (loA + hiA);
    if (solveLoadPoint(driver, ladder, mid, options).outputV > 0) loA = mid;
    else hiA = mid;
  }
  const curve: LoadPoint[] = [];
  for (let i = 0; i < points; i++) {
    const { driver: _unused, ...point } = solveLoadPoint(driver, ladder, (hiA * i) / (points - 1), options);
    curve.push(point);
  }
  return { ratedLoad: solveLoadPoint(driver, ladder, ratedLoadCurrentA, options), powerLimitOnsetA, curve, method: operatingPointMethod };
}
