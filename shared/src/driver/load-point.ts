/*
 * One load point of the driver with its ladder: the power balance solved for the flyback at an external load
 * current (operating-point.ts sweeps it over the output-vs-load curve).
 */
import { DomainError } from '../errors';
import { bracketedRoot } from '../multiplier/bracketed-root';
import { blockingOscillatorNumbers, estimateOf } from './blocking-oscillator';
import type {
  BlockingOscillatorEstimate,
  BlockingOscillatorOptions,
  OscillatorNumbers,
} from './blocking-oscillator.types';
import type { DriverStage } from '../designs/driver-stage.types';
import type { LadderDrive, LadderLoadLine, LadderState } from './ladder-load-line';
import { scanDown, warmRoot, type WarmStart } from './load-point-roots';
import { forwardPeakFor, forwardShareOf } from './ring-back';

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

/** The stage options with the ladder's load on the secondary, unless the caller gives one. */
export function withLadderLoad(options: BlockingOscillatorOptions, ladder: LadderLoadLine): BlockingOscillatorOptions {
  return options.secondaryLoad || !ladder.secondaryLoad ? options : { ...options, secondaryLoad: ladder.secondaryLoad };
}

/**
 * The secondary drive the ladder sees from the stage `e` when it takes `forwardCurrentA` (A, mean) from the
 * forward pulse: its forward peak by the charge the ring-back returns (forwardPeakFor).
 */
export function driveOf(e: OscillatorNumbers, driver: DriverStage, forwardCurrentA: number): LadderDrive {
  return {
    forwardPeakV: forwardPeakFor(e, forwardCurrentA / e.frequencyHz),
    flybackPeakV: e.flybackSecV,
    frequencyHz: e.frequencyHz,
    dutyCycle: forwardShareOf(e),
    isFlybackFed: isFlybackFed(driver),
  };
}

/** A load point with the stage's numbers and the options they were computed with (numbers only, no method notes). */
export interface SolvedPoint {
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
export function solvePoint(
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
  let supplySlope = limit.supplySlope;
  // The last two flybacks solved with their supply voltages (the limit's first).
  let lastFlyV = NaN;
  let lastSupplyV = warm?.supplyV !== undefined && warm.supplyV > 0 ? warm.supplyV : limit.vin;
  let earlierFlyV = NaN;
  let earlierSupplyV = NaN;
  // The stage at a flyback, its supply solve started on the line through the last two solves' supply
  // voltages (else from the last one's, or the nearby load's): near the balance the guess is off by the
  // square of the flyback's step, and the last evaluations of a balance settle the supply in one stage
  // evaluation instead of two. The options object is filled in place (the surplus's evaluations share one,
  // the solved point gets its own).
  const stageAtFlyback = (flyV: number, stageOptions: BlockingOscillatorOptions): OscillatorNumbers => {
    const lineV = lastSupplyV + ((lastSupplyV - earlierSupplyV) / (lastFlyV - earlierFlyV)) * (flyV - lastFlyV);
    stageOptions.flybackSecondaryPeakV = flyV;
    stageOptions.supplyVoltageGuessV = Number.isFinite(lineV) && lineV > 0 ? lineV : lastSupplyV;
    if (supplySlope !== undefined) stageOptions.supplySlopeGuess = supplySlope;
    const stage = blockingOscillatorNumbers(driver, stageOptions);
    earlierFlyV = lastFlyV;
    earlierSupplyV = lastSupplyV;
    lastFlyV = flyV;
    lastSupplyV = stage.vin;
    supplySlope = stage.supplySlope ?? supplySlope;
    return stage;
  };
  // Every field of the options spelled out, those stageAtFlyback writes included (a NaN slope guess is no
  // guess): one object shape for every evaluation, where a spread and fields added one evaluation at a time
  // cost more than the writes themselves. Typed with every key required, so a new option is not left out.
  const withSolveFields = (): BlockingOscillatorOptions => {
    const full: { [K in keyof Required<BlockingOscillatorOptions>]: BlockingOscillatorOptions[K] } = {
      collectorNodeCapacitanceF: options.collectorNodeCapacitanceF,
      chargeFraction: options.chargeFraction,
      bypassCapacitanceF: options.bypassCapacitanceF,
      secondaryLoad: options.secondaryLoad,
      forwardLoadPowerW,
      flybackSecondaryPeakV: maxFlyV,
      supplyVoltageGuessV: lastSupplyV,
      supplySlopeGuess: options.supplySlopeGuess ?? NaN,
    };
    return full;
  };
  const evalOptions = withSolveFields();
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
    return stage.loadDeliverableW / flyV - ratios.flyback * loaded.ladderCurrentA;
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
    stageOptions = withSolveFields();
    stage = stageAtFlyback(flyV, stageOptions);
    drive = driveOf(stage, driver, forwardA());
    loaded = ladder.at(drive, loadCurrentA);
  }
  if (balance !== null) balance = { flybackV: balance.flybackV, slope: balance.slope, supplyV: stage.vin };
  const outputPowerW = loaded.outputV * loadCurrentA;
  const flybackTakenW = Math.min(stage.loadDeliverableW, ratios.flyback * loaded.ladderCurrentA * flyV);
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
 * voltage or load), giving its own balance for the next; `limit`, the stage at its clamp limit with the ladder's
 * secondary load (`blockingOscillatorNumbers(driver, withLadderLoad({}, ladder))`), when the caller has it.
 */
export function supplyCurrentNear(
  driver: DriverStage,
  ladder: LadderLoadLine,
  loadCurrentA: number,
  warm: WarmStart | null,
  limit?: OscillatorNumbers,
): { supplyCurrentA: number; balance: WarmStart | null } {
  const solved = solvePoint(driver, ladder, loadCurrentA, {}, limit, undefined, warm);
  return { supplyCurrentA: solved.point.supplyCurrentA, balance: solved.balance };
}
