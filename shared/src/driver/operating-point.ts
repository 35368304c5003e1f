import { DomainError } from '../errors';
import { bracketedRoot } from '../multiplier/bracketed-root';
import { blockingOscillatorNumbers, estimateOf } from './blocking-oscillator';
import type {
  BlockingOscillatorEstimate,
  BlockingOscillatorOptions,
  OscillatorNumbers,
} from './blocking-oscillator.types';
import type { DriverStage } from '../designs/driver-stage.types';
import type { MethodInfo } from '../methods';
import type { LadderDrive, LadderLoadLine, LadderState } from './ladder-load-line';
import { outputSignsNear, scanDown, warmNear, warmPastOnset, warmRoot, type WarmStart } from './load-point-roots';
import { forwardPeakFor, forwardShareOf } from './ring-back';

export type { WarmStart } from './load-point-roots';

/** Whether a stage's ladder is fed by the flyback pulse (the secondary phasing; 'flyback' by default). */
export function isFlybackFed(driver: DriverStage): boolean {
  return (driver.transformer.secondaryPhasing ?? 'flyback') === 'flyback';
}

export type OperatingLimit = 'ladder' | 'power';

export interface LoadPoint {
  loadCurrentA: number;
  outputV: number;
  outputPowerW: number;
  /** External load plus bleeder (A). */
  ladderCurrentA: number;
  /** 'ladder': the flyback sits at its clamp/breakdown limit and the ladder sets the output;
   *  'power': the driver's energy per cycle sets it (flyback below its limit). */
  limitedBy: OperatingLimit;
  flybackSecondaryPeakV: number;
  /** Forward (on-time) secondary peak at this load (V); it rises a little as the supply sags less at light loads. */
  forwardSecondaryPeakV: number;
  /** Charge the flyback pushes per unit of ladder output charge (∂V_top/∂V₋). */
  flybackChargeRatio: number;
  frequencyHz: number;
  dutyCycle: number;
  supplyCurrentA: number;
  /** Power drawn from the supply's EMF (W): what the cells or the bench supply give up. */
  inputPowerW: number;
  /** Power the ladder takes from the secondary (W): from the forward pulse and from the flyback. */
  ladderTakesW: { forward: number; flyback: number };
  /** Output power (into the external load) over the power from the supply's EMF. */
  efficiency: number;
}

export interface OperatingPointResult {
  ratedLoad: LoadPoint & { driver: BlockingOscillatorEstimate };
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

/** The stage options with the ladder's load on the secondary, unless the caller gives one. */
function withLadderLoad(options: BlockingOscillatorOptions, ladder: LadderLoadLine): BlockingOscillatorOptions {
  return options.secondaryLoad || !ladder.secondaryLoad ? options : { ...options, secondaryLoad: ladder.secondaryLoad };
}

/**
 * The secondary drive the ladder sees from the stage `e` when it takes `forwardCurrentA` (A, mean) from the
 * forward pulse: its forward peak by the charge the ring-back returns (forwardPeakFor).
 */
function driveOf(e: OscillatorNumbers, driver: DriverStage, forwardCurrentA: number): LadderDrive {
  return {
    forwardPeakV: forwardPeakFor(e, forwardCurrentA / e.frequencyHz),
    flybackPeakV: e.flybackSecV,
    frequencyHz: e.frequencyHz,
    dutyCycle: forwardShareOf(e),
    isFlybackFed: isFlybackFed(driver),
  };
}

/** A load point with the stage's numbers and the options they were computed with (numbers only, no method notes). */
interface SolvedPoint {
  point: LoadPoint;
  stage: OscillatorNumbers;
  stageOptions: BlockingOscillatorOptions;
  /** The power balance where it was solved by the surplus (power-limited), to warm-start a nearby load's. */
  balance: WarmStart | null;
}

/**
 * The load point as numbers. `limit` is the stage at its clamp limit with no forward load (the same for every
 * load current of one driver), passed in by callers that solve many loads; `flybackGuessV`, a nearby load's
 * flyback, starts the scan for the power balance's bracket there instead of at the limit; `warm`, a nearby
 * load's balance, starts Newton's method there (the scan runs only where it does not settle).
 */
function solvePoint(
  driver: DriverStage,
  ladder: LadderLoadLine,
  loadCurrentA: number,
  givenOptions: BlockingOscillatorOptions,
  givenLimit?: OscillatorNumbers,
  flybackGuessV?: number,
  warm?: WarmStart | null,
): SolvedPoint {
  const options = withLadderLoad(givenOptions, ladder);
  const limit = givenLimit ?? blockingOscillatorNumbers(driver, options);
  if (!(loadCurrentA >= 0)) throw new DomainError('invalid_argument', 'load current must be ≥ 0', 'loadCurrentA');
  const maxFlyV = limit.maxFlybackSecV;
  // The ladder's current and charge ratios at the limit drive (its forward peak at the recovery level, then
  // again with the forward charge that current takes), held through the solve.
  let limitDrive = driveOf(limit, driver, 0);
  let limitLadderA = ladder.at(limitDrive, loadCurrentA).ladderCurrentA;
  let ratios = ladder.chargeRatios(limitDrive, limitLadderA);
  const forwardA = () => ratios.forward * limitLadderA;
  if (limit.recoveryChargeC > 0 && forwardA() / limit.frequencyHz > limit.recoveryChargeC) {
    limitDrive = driveOf(limit, driver, forwardA());
    limitLadderA = ladder.at(limitDrive, loadCurrentA).ladderCurrentA;
    ratios = ladder.chargeRatios(limitDrive, limitLadderA);
  }
  // The forward pulse's load on the supply, g₊·V₊·I_ladder, taken at the limit drive and held through the
  // solve, so that the supply sag is the same in the balance and in the reported figures (the ring-back's
  // share of it, above the on-time level, counted as the supply's too).
  const forwardLoadPowerW = ratios.forward * limitDrive.forwardPeakV * limitLadderA;
  let supplyGuessV = limit.vin;
  let supplySlope = limit.supplySlope;
  // The stage at a flyback, its supply solve started from the last one's; the options object is filled in
  // place (the surplus's evaluations share one, the solved point gets its own).
  const stageAtFlyback = (flyV: number, stageOptions: BlockingOscillatorOptions): OscillatorNumbers => {
    stageOptions.flybackSecondaryPeakV = flyV;
    stageOptions.supplyVoltageGuessV = supplyGuessV;
    if (supplySlope !== undefined) stageOptions.supplySlopeGuess = supplySlope;
    const stage = blockingOscillatorNumbers(driver, stageOptions);
    supplyGuessV = stage.vin;
    supplySlope = stage.supplySlope ?? supplySlope;
    return stage;
  };
  const evalOptions: BlockingOscillatorOptions = { ...options, forwardLoadPowerW };
  // The last flyback the surplus was evaluated at, with the stage and the ladder there: the solved point
  // takes them when it lands on that flyback (its own evaluation would repeat the same numbers).
  let last: { flyV: number; stage: OscillatorNumbers; drive: LadderDrive; loaded: LadderState } | null = null;
  // Surplus of flyback power over what the ladder takes, per volt of flyback. Copper loss makes it fall at
  // very slow flybacks too, so there can be two roots: take the highest (the stable one) by scanning down
  // from the limit on a log grid (8 points a decade over 6 decades), then solving in that bracket.
  const surplus = (flyV: number) => {
    const stage = stageAtFlyback(flyV, evalOptions);
    const drive = driveOf(stage, driver, forwardA());
    const loaded = ladder.at(drive, loadCurrentA);
    last = { flyV, stage, drive, loaded };
    return stage.deliverableW / flyV - ratios.flyback * loaded.ladderCurrentA;
  };
  let flyV = maxFlyV;
  let limitedBy: OperatingLimit = 'ladder';
  // From a nearby load's balance, Newton's method first: a falling crossing below the limit is, with at most
  // two roots, the highest one, and the surplus is then negative at the limit (power-limited).
  let balance: WarmStart | null = warm ? warmRoot(surplus, warm, maxFlyV) : null;
  if (balance !== null) {
    limitedBy = 'power';
    flyV = balance.flybackV;
  }
  const surplusAtLimit = balance === null ? surplus(maxFlyV) : NaN;
  if (surplusAtLimit < 0) {
    limitedBy = 'power';
    const scanPoints = 48;
    const gridV = (k: number) => maxFlyV * 10 ** ((-6 * k) / scanPoints);
    let hi = maxFlyV;
    let surplusHi = surplusAtLimit;
    let lo: number | null = null;
    let surplusLo = 0;
    // From a nearby load's flyback: the grid point below it and, while the surplus there is positive, the
    // points above, to the first negative one. With at most two roots the surplus is positive on one run of
    // the grid only, so this is the bracket the scan from the limit finds; else the scan runs.
    const guessK =
      flybackGuessV !== undefined && flybackGuessV > 0 && flybackGuessV < maxFlyV
        ? Math.min(scanPoints, Math.ceil((Math.log10(maxFlyV / flybackGuessV) * scanPoints) / 6))
        : 0;
    const surplusAtGuess = guessK > 0 ? surplus(gridV(guessK)) : -1;
    if (surplusAtGuess >= 0) {
      let k = guessK;
      lo = gridV(k);
      surplusLo = surplusAtGuess;
      for (; k > 1; k--) {
        const s = surplus(gridV(k - 1));
        if (s < 0) {
          hi = gridV(k - 1);
          surplusHi = s;
          break;
        }
        lo = gridV(k - 1);
        surplusLo = s;
      }
    } else {
      const scan = scanDown(surplus, gridV, scanPoints, hi, surplusHi);
      ({ hi, fHi: surplusHi } = scan);
      if (scan.found) {
        lo = scan.lo;
        surplusLo = scan.fLo;
      }
    }
    if (lo === null) {
      flyV = maxFlyV * 1e-6; // the driver cannot push the ladder's charge at any flyback: output collapses
    } else {
      // To the resolution 40 halvings of the bracket (an eighth of a decade) would give: 2e-13 relative.
      flyV = bracketedRoot(surplus, lo, hi, surplusLo, surplusHi, (hi - lo) * 2 ** -40);
      // The power surplus's slope there for the next load's warm start (over the bracket, an eighth of a decade).
      balance = { flybackV: flyV, slope: (hi * surplusHi - lo * surplusLo) / (hi - lo) };
    }
  }
  const solved = last as { flyV: number; stage: OscillatorNumbers; drive: LadderDrive; loaded: LadderState } | null;
  let stageOptions: BlockingOscillatorOptions;
  let stage: OscillatorNumbers;
  let drive: LadderDrive;
  let loaded: LadderState;
  if (solved !== null && solved.flyV === flyV) {
    ({ stage, drive, loaded } = solved);
    stageOptions = { ...evalOptions };
  } else {
    stageOptions = { ...options, forwardLoadPowerW };
    stage = stageAtFlyback(flyV, stageOptions);
    drive = driveOf(stage, driver, forwardA());
    loaded = ladder.at(drive, loadCurrentA);
  }
  const outputPowerW = loaded.outputV * loadCurrentA;
  const flybackTakenW = Math.min(stage.deliverableW, ratios.flyback * loaded.ladderCurrentA * flyV);
  return {
    point: {
      loadCurrentA,
      outputV: loaded.outputV,
      outputPowerW,
      ladderCurrentA: loaded.ladderCurrentA,
      limitedBy,
      flybackSecondaryPeakV: flyV,
      forwardSecondaryPeakV: drive.forwardPeakV,
      flybackChargeRatio: ratios.flyback,
      frequencyHz: stage.frequencyHz,
      dutyCycle: drive.dutyCycle ?? 0.5,
      supplyCurrentA: stage.inputA,
      inputPowerW: stage.emfW,
      ladderTakesW: { forward: forwardLoadPowerW, flyback: flybackTakenW },
      efficiency: outputPowerW / stage.emfW,
    },
    stage,
    stageOptions,
    balance,
  };
}

/**
 * Where the driver meets the ladder: the output voltage (V) at an external load current (A), with the limit
 * that sets it. Method: OPERATING_POINT_METHOD (power balance per cycle, see its summary).
 */
export function solveLoadPoint(
  driver: DriverStage,
  ladder: LadderLoadLine,
  loadCurrentA: number,
  options: BlockingOscillatorOptions = {},
): LoadPoint & { driver: BlockingOscillatorEstimate } {
  const { point, stage, stageOptions } = solvePoint(driver, ladder, loadCurrentA, options);
  return { ...point, driver: estimateOf(driver, stageOptions, stage) };
}

/** The supply current (A) the driver draws at an external load current (A): the load point's numbers only. */
export function supplyCurrentAt(
  driver: DriverStage,
  ladder: LadderLoadLine,
  loadCurrentA: number,
  options: BlockingOscillatorOptions = {},
): number {
  return solvePoint(driver, ladder, loadCurrentA, options).point.supplyCurrentA;
}

/**
 * `supplyCurrentAt` with the power balance warm-started from a nearby solve's (`warm`, from another supply
 * voltage or load), giving its own balance for the next.
 */
export function supplyCurrentNear(
  driver: DriverStage,
  ladder: LadderLoadLine,
  loadCurrentA: number,
  warm: WarmStart | null,
): { supplyCurrentA: number; balance: WarmStart | null } {
  const solved = solvePoint(driver, ladder, loadCurrentA, {}, undefined, undefined, warm);
  return { supplyCurrentA: solved.point.supplyCurrentA, balance: solved.balance };
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
      ? { flybackV: lastBalance.balance.flybackV * scale, slope: lastBalance.balance.slope / scale }
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
    const warm =
      a && b && c
        ? { flybackV: 3 * powerOf(a, 1) - 3 * powerOf(b, 2) + powerOf(c, 3), slope: 2 * a.slope - b.slope }
        : a && b
          ? { flybackV: 2 * powerOf(a, 1) - powerOf(b, 2), slope: a.slope }
          : (a ?? warmPastOnset(endBalances, powerLimitOnsetA, maxFlyV, loadA));
    const solved = solvePoint(driver, ladder, loadA, options, limitEst, curve[i - 1]?.flybackSecondaryPeakV, warm);
    curve.push(solved.point);
    balances.push(solved.balance);
  }
  // A rated load the output cannot hold (it falls to zero before the load is met) is beyond what the supply
  // delivers: the stage is then reported at the largest load it holds, never at a collapsed flyback.
  const ratedWarm = warmNear(curve, balances, ratedLoadCurrentA);
  let rated = solvePoint(driver, ladder, ratedLoadCurrentA, options, limitEst, undefined, ratedWarm);
  const isRatedLoadBeyond = ratedLoadCurrentA > 0 && !(rated.point.outputV > 0);
  if (isRatedLoadBeyond) rated = solvePoint(driver, ladder, loA, options, limitEst);
  return {
    ratedLoad: { ...rated.point, driver: estimateOf(driver, rated.stageOptions, rated.stage) },
    powerLimitOnsetA,
    maxLoadCurrentA: loA,
    isRatedLoadBeyond,
    curve,
    method: OPERATING_POINT_METHOD,
  };
}
