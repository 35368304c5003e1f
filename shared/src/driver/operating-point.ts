import { bracketedRoot } from '../multiplier/bracketed-root';
import { blockingOscillatorNumbers, estimateOf } from './blocking-oscillator';
import type {
  BlockingOscillatorEstimate,
  BlockingOscillatorOptions,
  OscillatorNumbers,
} from './blocking-oscillator.types';
import type { DriverStage } from '../designs/driver-stage.types';
import type { MethodInfo } from '../methods';
import type { LadderLoadLine } from './ladder-load-line';
import { driveOf, solvePoint, withLadderLoad, type LoadPoint } from './load-point';
import { outputSignsNear, scanDown, warmNear, warmPastOnset, type WarmStart } from './load-point-roots';

export type { WarmStart } from './load-point-roots';
export { isFlybackFed, solveLoadPoint, supplyCurrentAt, supplyCurrentNear } from './load-point';
export type { LoadPoint, OperatingLimit } from './load-point';

export interface OperatingPointResult {
  ratedLoad: LoadPoint & { driver: BlockingOscillatorEstimate };
  /** The stage with the flyback at its clamp or breakdown limit and no forward load (the ladder's capacitance on the secondary). */
  atLimit: BlockingOscillatorEstimate;
  /** Load current above which the driver can no longer hold the flyback at its limit (A); 0 if it cannot even at no load. */
  powerLimitOnsetA: number;
  /** The largest external load current (A) at which the output stays above zero: what the supply can deliver. */
  maxLoadCurrentA: number;
  /**
   * True when the rated load is beyond maxLoadCurrentA: the output cannot hold it, and `ratedLoad` is the
   * stage at maxLoadCurrentA instead.
   */
  isRatedLoadBeyond: boolean;
  /** Output vs external load current from no load to the current at which the output reaches zero. */
  curve: LoadPoint[];
  method: MethodInfo;
}

export const OPERATING_POINT_METHOD: MethodInfo = {
  methodId: 'driver-ladder.power-balance-v2',
  summary:
    'Flyback peak V₋ from the power balance g·I_ladder·V₋ = E·f(V₋)·η (g = ∂V_top/∂V₋, the charge the flyback pushes per unit output charge; I_ladder = load plus bleeder), capped at the clamp or breakdown limit; output from the ladder model at that drive and load.',
  assumptions: [
    'forward pulse is a stiff source: the ladder takes g₊·V₊·I_ladder from it straight from the supply (I_ladder at the clamp-limited drive)',
    'the flyback energy not taken by the ladder goes to the clamp',
    'g taken at the clamp-limited drive and held through the solve',
    'ladder: the steady-state charge-transfer model of the actual topology, capacitors, diodes and bleeder',
  ],
  source:
    'Energy conservation per cycle: E = ½ Lp Ipk², P = E f η (common practice; Pressman, Switching Power Supply Design, from memory); ladder by charge-transfer-v1',
};

/**
 * The part of the operating point that does not depend on the rated load: the stage at its limit, the onset
 * of the power limit (A), the largest load the output holds (A), and the output-vs-load curve with each
 * point's power balance (to warm-start the rated load's).
 */
interface OperatingCurve {
  limitEst: OscillatorNumbers;
  powerLimitOnsetA: number;
  maxLoadCurrentA: number;
  curve: LoadPoint[];
  balances: (WarmStart | null)[];
}

/**
 * Curves of the last few drivers and ladders, keyed on every input they depend on (the stage, the options and
 * the ladder load line's own key): the Workbench recomputes on every keystroke, and an edit of the load (or
 * of anything outside the driver and the ladder) leaves the curve as it was. Read-only once made: the
 * report takes copies of its points.
 */
const CURVE_MEMORY = 8;
const curves = new Map<string, OperatingCurve>();

function rememberedCurve(
  driver: DriverStage,
  ladder: LadderLoadLine,
  options: BlockingOscillatorOptions & { points?: number },
): OperatingCurve {
  const ladderKey = ladder.key;
  if (ladderKey === undefined) return operatingCurveOf(driver, ladder, options);
  const key = `${ladderKey}|${JSON.stringify(driver)}|${JSON.stringify(options)}`;
  const known = curves.get(key);
  if (known) {
    curves.delete(key);
    curves.set(key, known);
    return known;
  }
  const made = operatingCurveOf(driver, ladder, options);
  curves.set(key, made);
  if (curves.size > CURVE_MEMORY) curves.delete(curves.keys().next().value as string);
  return made;
}

function copyOfPoint(point: LoadPoint): LoadPoint {
  return { ...point, ladderTakesW: { ...point.ladderTakesW } };
}

/**
 * Operating point of the driver with the ladder: output at the rated external load current (A), the onset of
 * the power limit (A), and the output-vs-load curve (`points` samples, default 25) from no load to the current
 * at which the output reaches zero.
 */
export function driverOperatingPoint(
  driver: DriverStage,
  ladder: LadderLoadLine,
  ratedLoadCurrentA: number,
  givenOptions: BlockingOscillatorOptions & { points?: number } = {},
): OperatingPointResult {
  const { limitEst, powerLimitOnsetA, maxLoadCurrentA, curve, balances } = rememberedCurve(
    driver,
    ladder,
    givenOptions,
  );
  const options = withLadderLoad(givenOptions, ladder);
  // A rated load the output cannot hold (it falls to zero before the load is met) is beyond what the supply
  // delivers: the stage is then reported at the largest load it holds, never at a collapsed flyback.
  const ratedWarm = warmNear(curve, balances, ratedLoadCurrentA);
  let rated = solvePoint(driver, ladder, ratedLoadCurrentA, options, limitEst, undefined, ratedWarm);
  const isRatedLoadBeyond = ratedLoadCurrentA > 0 && !(rated.point.outputV > 0);
  if (isRatedLoadBeyond) rated = solvePoint(driver, ladder, maxLoadCurrentA, options, limitEst);
  return {
    ratedLoad: { ...rated.point, driver: estimateOf(driver, rated.stageOptions, rated.stage) },
    atLimit: estimateOf(driver, options, { ...limitEst, losses: { ...limitEst.losses } }),
    powerLimitOnsetA,
    maxLoadCurrentA,
    isRatedLoadBeyond,
    curve: curve.map(copyOfPoint),
    method: OPERATING_POINT_METHOD,
  };
}

/** The operating curve of a driver and its ladder (see OperatingCurve), solved afresh. */
function operatingCurveOf(
  driver: DriverStage,
  ladder: LadderLoadLine,
  givenOptions: BlockingOscillatorOptions & { points?: number },
): OperatingCurve {
  const points = Math.max(2, givenOptions.points ?? 25);
  const options = withLadderLoad(givenOptions, ladder);
  const limitEst = blockingOscillatorNumbers(driver, options);
  const maxFlyV = limitEst.maxFlybackSecV;
  const limitDrive = driveOf(limitEst, driver, 0);
  // The end of the curve's loads, each warm-started from the last power balance solved.
  // Power-limited, the flyback carries about a fixed power, V₋·I nearly constant: a warm start is the last
  // balance moved along that hyperbola (the first past the onset from the limit there).
  let lastBalance: { loadA: number; balance: WarmStart } | null = null;
  const endBalances: { loadA: number; balance: WarmStart }[] = [];
  const pointAt = (loadA: number) => {
    const scale = lastBalance ? lastBalance.loadA / loadA : powerLimitOnsetA / loadA;
    const warm = lastBalance
      ? {
          ...lastBalance.balance,
          flybackV: lastBalance.balance.flybackV * scale,
          slope: lastBalance.balance.slope / scale,
        }
      : powerLimitOnsetA > 0 && scale < 1
        ? { flybackV: maxFlyV * scale, slope: -lastFlybackRatio * loadA }
        : null;
    const solved = solvePoint(driver, ladder, loadA, options, limitEst, undefined, warm);
    if (solved.balance) {
      endBalances.push({ loadA, balance: solved.balance });
      lastBalance = { loadA, balance: solved.balance };
    }
    return solved.point;
  };
  // Deliverable flyback power over what the ladder takes at the limit drive, per volt of flyback: power-limited below zero.
  let lastFlybackRatio = NaN;
  const limitSurplusAt = (loadA: number) => {
    const state = ladder.at(limitDrive, loadA);
    lastFlybackRatio = ladder.chargeRatios(limitDrive, state.ladderCurrentA).flyback;
    return limitEst.deliverableW / maxFlyV - lastFlybackRatio * state.ladderCurrentA;
  };
  // Onset: bracketed around the load the no-load surplus would carry at the no-load charge ratio (the
  // surplus falls nearly in proportion to the load), widened by doubling and halving, then solved to the
  // resolution of 40 halvings (1e-12 relative). Past 1e-9·2⁸⁰ A the driver is taken never to limit.
  const neverA = 1e-9 * 2 ** 80;
  let powerLimitOnsetA = 0;
  const surplusAtNoLoad = limitSurplusAt(0);
  if (surplusAtNoLoad >= 0) {
    const guessA = surplusAtNoLoad / lastFlybackRatio;
    const hasGuess = guessA > 1e-9 && guessA < neverA;
    let loA = 0;
    let surplusLo = surplusAtNoLoad;
    let hiA = hasGuess ? 1.25 * guessA : 1e-9;
    let surplusHi = limitSurplusAt(hiA);
    if (hasGuess && surplusHi < 0) {
      // The low end: just below the guess, halved towards no load (40 times) while the surplus there is negative.
      const scan = scanDown(limitSurplusAt, (k) => (0.8 * guessA) / 2 ** (k - 1), 40, hiA, surplusHi);
      ({ hi: hiA, fHi: surplusHi } = scan);
      if (scan.found) {
        loA = scan.lo;
        surplusLo = scan.fLo;
      }
    }
    for (let k = 0; k < 80 && surplusHi >= 0 && hiA < neverA; k++) {
      loA = hiA;
      surplusLo = surplusHi;
      hiA = Math.min(2 * hiA, neverA);
      surplusHi = limitSurplusAt(hiA);
    }
    powerLimitOnsetA =
      surplusHi >= 0 ? neverA : bracketedRoot(limitSurplusAt, loA, hiA, surplusLo, surplusHi, hiA * 2 ** -40);
  }
  // End of the curve: where the output reaches zero; bracket by doubling from the onset, then 14 bisections
  // (6e-5 relative, below the curve's sampling).
  let hiA = Math.max(powerLimitOnsetA, 1e-9);
  let lastOutput: { loadA: number; outputV: number } | null = null;
  let earlierOutput: { loadA: number; outputV: number } | null = null;
  for (let k = 0; k < 60; k++) {
    const outputV = pointAt(hiA).outputV;
    if (!(outputV > 0)) break;
    earlierOutput = lastOutput;
    lastOutput = { loadA: hiA, outputV };
    hiA *= 2;
  }
  const hasOutputAt = outputSignsNear(pointAt, lastOutput, hiA, earlierOutput);
  let loA = 0;
  for (let k = 0; k < 14; k++) {
    const mid = 0.5 * (loA + hiA);
    if (hasOutputAt(mid)) loA = mid;
    else hiA = mid;
  }
  // Evenly spaced loads: each power balance starts from the parabola through the last three (the line
  // through the last two after the onset) of the flyback times the load, nearly constant where the flyback
  // carries a fixed power (the flyback itself runs as 1/I there, which a parabola follows badly), its slope
  // from the line through the last two slopes.
  const curve: LoadPoint[] = [];
  const balances: (WarmStart | null)[] = [];
  for (let i = 0; i < points; i++) {
    const loadA = (hiA * i) / (points - 1);
    const a = balances[i - 1];
    const b = balances[i - 2];
    const c = balances[i - 3];
    // The flyback times the load at the point k steps back, over this load.
    const powerOf = (w: WarmStart, k: number) => (w.flybackV * (i - k)) / i;
    // The supply voltage from the same parabola (line) through the last points' (it moves smoothly with the load).
    const supplyOf = (...ws: WarmStart[]) => (ws.every((w) => w.supplyV !== undefined) ? ws : null);
    const warm: WarmStart | null =
      a && b && c
        ? {
            flybackV: 3 * powerOf(a, 1) - 3 * powerOf(b, 2) + powerOf(c, 3),
            slope: 2 * a.slope - b.slope,
            ...(supplyOf(a, b, c) ? { supplyV: 3 * a.supplyV! - 3 * b.supplyV! + c.supplyV! } : {}),
          }
        : a && b
          ? {
              flybackV: 2 * powerOf(a, 1) - powerOf(b, 2),
              slope: a.slope,
              ...(supplyOf(a, b) ? { supplyV: 2 * a.supplyV! - b.supplyV! } : {}),
            }
          : (a ?? warmPastOnset(endBalances, powerLimitOnsetA, maxFlyV, loadA));
    const solved = solvePoint(driver, ladder, loadA, options, limitEst, curve[i - 1]?.flybackSecondaryPeakV, warm);
    curve.push(solved.point);
    balances.push(solved.balance);
  }
  return { limitEst, powerLimitOnsetA, maxLoadCurrentA: loA, curve, balances };
}
