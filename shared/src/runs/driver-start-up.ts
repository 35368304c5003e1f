import { capacitorName, LADDER_NODES } from '../circuits/build-ladder-circuit';
import { DRIVER_NODES } from '../circuits/build-driver-circuit';
import type { Design } from '../designs/design.types';
import { DomainError } from '../errors';
import type { SimulationTolerances } from '../sim/circuit.types';
import { MnaSystem } from '../sim/mna-system';
import { readSettlingTimes } from '../sim/oscillation-measures';
import { TurnOnTrigger } from '../sim/turn-on-events';
import { TransientStepper } from '../sim/transient';
import { downsampleMinMax } from '../sim/waveform-measures';
import { driverDesignCircuit, driverPeriodGuessS } from './driver-design-circuit';
import type { PlotTrace } from './ladder-runs';
import { withEffectiveTransformer } from '../transformer/given-numbers';

export interface StartUpOptions {
  /** Simulated-time budget (s); default 5 s. */
  maxTimeS?: number;
  /** Budget of time steps (the run's cost); default 400 000. */
  maxSteps?: number;
  /** Settled when the projected remaining change of the output is below this fraction; default 1e-3. */
  settleFraction?: number;
  /** Oscillation cycles per block of the settling test and the projection; default 8. */
  blockCycles?: number;
  maxStepS?: number;
  /** The stepper's tolerances; SPICE's defaults when not given (reltol 1e-3). */
  tolerances?: Partial<SimulationTolerances>;
  plotBuckets?: number;
  onProgress?: (fraction: number) => void;
  shouldCancel?: () => boolean;
}

export interface StartUpResult {
  /** Settled output (cycle mean, V), the last block's mean plus its projected remaining change; null when not settled. */
  finalOutputV: number | null;
  /** Mean of the last whole cycle simulated, V. */
  lastOutputV: number;
  isSettled: boolean;
  /** From the push-button (t = 0) to the cycle mean's first reaching 90 % of the settled output, s. */
  timeTo90PercentS: number | null;
  /** From the push-button to the cycle mean's entering ±1 % of the settled output for good, s. */
  timeTo1PercentS: number | null;
  /** Simulated time when the run stopped, s. */
  reachedS: number;
  /** When not settled: the simulated time within which it did not settle, s (else null). */
  notSettledWithinS: number | null;
  cyclesSimulated: number;
  /** Oscillation frequency over the last block, from turn-on events; null before the first block. */
  frequencyHz: number | null;
  /**
   * Cycle means of the output against time (each at its cycle's end), from (0, the empty ladder's output)
   * to the stop (an unsettled run's last, partial cycle at the stop), min/max downsampled.
   */
  curve: PlotTrace;
}

/** Decay time constant of the block means and whether two successive estimates agree (a clean decay). */
interface Decay {
  tauS: number;
  isClean: boolean;
}

/**
 * Push-button start of a driver design from an empty ladder, until the output settles or the budget runs
 * out. Cycles run between the turn-on trigger's marks (the end of each turn-on's conduction, turn-on-events.ts); every `blockCycles` cycles the
 * block means of the output (m0, m1, m2 over the last three blocks) give the slow mode's rate
 * d = (m2 − m1)/Δt and its decay ratio r = (m2 − m1)/(m1 − m0), a time constant τ = −Δt/ln r, clean when two
 * successive τ agree within 25 %. Settling test: a clean decay has been seen in the run, and at two
 * successive evaluations the slope over the last three blocks, (m2 − m0)/(2Δt), projected over τ_slow (the
 * longest clean τ seen, and never less than a quarter of the elapsed time: a spurious short decay in the
 * irregular first cycles must not stand for the charging's slowest mode) stays below `settleFraction` of
 * the output; the settled output is m2 plus that projection. An output that has shown no decay is never settled, and one still rising carries its
 * projected rise. The charging curve is the cycle means; 90 % and 1 % times are read from it against the
 * settled output (linear interpolation).
 */
export function runDriverStartUp(givenDesign: Design, options: StartUpOptions = {}): StartUpResult {
  const design = withEffectiveTransformer(givenDesign);
  if (design.drive.kind !== 'driver')
    throw new DomainError('invalid_design', 'runDriverStartUp needs a driver drive', 'drive.kind');
  const driver = design.drive.driver;
  const periodGuessS = driverPeriodGuessS(driver);
  const capsF = design.multiplier.capacitors.map((c) => c.valueF);
  const circuit = driverDesignCircuit(
    design,
    capsF.map(() => 0),
  );
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, {
    maxStepS: options.maxStepS ?? periodGuessS / 200,
    ...(options.tolerances ? { tolerances: options.tolerances } : {}),
  });
  stepper.startFromCharges(system.initialCharge);
  const capIndex = capsF.map((_, i) => system.reactiveNames.indexOf(capacitorName(i)));
  const top = system.probeIndex(LADDER_NODES.ladderTop);
  const primary = system.probeIndex('I(T1.Lp)');
  const collector = system.probeIndex(DRIVER_NODES.collector);
  const supply = system.probeIndex(DRIVER_NODES.supply);
  const settleFraction = options.settleFraction ?? 1e-3;
  const blockCycles = options.blockCycles ?? 8;
  const maxTimeS = options.maxTimeS ?? 5;
  const maxSteps = options.maxSteps ?? 400_000;
  const trigger = new TurnOnTrigger(driver.transformer.saturationCurrentA, 3 * periodGuessS);

  // Cycle records: end time, mean output over the cycle, mean ladder capacitor voltages over the cycle.
  // The curve starts at the push-button with the empty ladder's output.
  const curveT: number[] = [0];
  const curveV: number[] = [system.x[top]!];
  const cycleStartS: number[] = [];
  const cycleEndS: number[] = [];
  const cycleMeanV: number[] = [];
  const cycleCapV: number[][] = [];
  let lastEventS = NaN;
  let area = 0;
  let capArea = capsF.map(() => 0);
  let prevT = 0;
  let prevV = system.x[top]!;
  let prevCaps = capIndex.map((k) => stepper.q0[k]!);
  let cyclesSimulated = 0;
  let tauSlowS = 0;
  let lastDecay: Decay | null = null;
  let isSettled = false;
  let wasWithin = false;
  let finalOutputV: number | null = null;
  let frequencyHz: number | null = null;
  let reported = 0;

  const blockMean = (fromCycle: number, toCycle: number, of: (k: number) => number): number => {
    let a = 0;
    let span = 0;
    for (let k = fromCycle; k < toCycle; k++) {
      const dt = cycleEndS[k]! - cycleStartS[k]!;
      a += of(k) * dt;
      span += dt;
    }
    return a / span;
  };

  while (!isSettled && stepper.timeS < maxTimeS && stepper.acceptedSteps < maxSteps) {
    if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The run was cancelled');
    stepper.step(maxTimeS);
    const t = stepper.timeS;
    const v = system.x[top]!;
    const caps = capIndex.map((k, i) => stepper.q0[k]! / capsF[i]!);
    const dt = t - prevT;
    const fired = trigger.push(t, system.x[primary]!, system.x[collector]! - system.x[supply]!);
    const before = Number.isNaN(fired) ? 1 : (fired - prevT) / dt;
    const vAt = prevV + (v - prevV) * before;
    area += 0.5 * (prevV + vAt) * dt * before;
    caps.forEach((c, i) => {
      const cAt = prevCaps[i]! + (c - prevCaps[i]!) * before;
      capArea[i]! += 0.5 * (prevCaps[i]! + cAt) * dt * before;
    });
    if (!Number.isNaN(fired)) {
      if (!Number.isNaN(lastEventS) && fired > lastEventS) {
        const span = fired - lastEventS;
        cycleStartS.push(lastEventS);
        cycleEndS.push(fired);
        cycleMeanV.push(area / span);
        cycleCapV.push(capArea.map((a) => a / span));
        curveT.push(fired);
        curveV.push(area / span);
        cyclesSimulated++;
      }
      lastEventS = fired;
      area = 0.5 * (vAt + v) * dt * (1 - before);
      capArea = caps.map((c, i) => 0.5 * (prevCaps[i]! + (c - prevCaps[i]!) * before + c) * dt * (1 - before));
      const n = cycleEndS.length;
      if (n >= 3 * blockCycles && n % blockCycles === 0) {
        const k = blockCycles;
        const m0 = blockMean(n - 3 * k, n - 2 * k, (c) => cycleMeanV[c]!);
        const m1 = blockMean(n - 2 * k, n - k, (c) => cycleMeanV[c]!);
        const m2 = blockMean(n - k, n, (c) => cycleMeanV[c]!);
        const spacingS = (cycleEndS[n - 1]! - cycleEndS[n - 1 - 2 * k]!) / 2;
        frequencyHz = k / (cycleEndS[n - 1]! - cycleEndS[n - 1 - k]!);
        const ratio = m1 !== m0 ? (m2 - m1) / (m1 - m0) : 0;
        const tauS = ratio > 0 && ratio < 1 ? -spacingS / Math.log(ratio) : NaN;
        const isClean: boolean =
          Number.isFinite(tauS) &&
          lastDecay !== null &&
          Number.isFinite(lastDecay.tauS) &&
          Math.abs(tauS - lastDecay.tauS) <= 0.25 * tauS;
        lastDecay = { tauS, isClean };
        if (isClean) tauSlowS = Math.max(tauSlowS, tauS);
        const tauUseS = Math.max(tauSlowS, isClean ? tauS : 0, stepper.timeS / 4);
        const scale = Math.abs(m2) || 1;
        // The slope over the last three blocks (less noisy than the last two) projected over τ_slow.
        const slope = (m2 - m0) / (2 * spacingS);
        const isWithin = tauSlowS > 0 && Math.abs(slope) * tauUseS <= settleFraction * scale;
        if (isWithin && wasWithin) {
          isSettled = true;
          finalOutputV = m2 + slope * tauUseS;
        }
        wasWithin = isWithin;
      }
    }
    prevT = stepper.timeS;
    prevV = system.x[top]!;
    prevCaps = capIndex.map((k, i) => stepper.q0[k]! / capsF[i]!);
    const share = Math.max(stepper.timeS / maxTimeS, stepper.acceptedSteps / maxSteps);
    if (options.onProgress && share >= reported + 0.01) {
      reported = share;
      options.onProgress(Math.min(0.99, share));
    }
  }
  // The cycle under way when the run stopped enters the curve as its mean so far, at the stop.
  if (!isSettled && !Number.isNaN(lastEventS) && stepper.timeS > lastEventS) {
    curveT.push(stepper.timeS);
    curveV.push(area / (stepper.timeS - lastEventS));
  }
  options.onProgress?.(1);
  const lastOutputV = cycleMeanV[cycleMeanV.length - 1] ?? curveV[curveV.length - 1] ?? 0;
  const times = finalOutputV !== null ? readSettlingTimes(curveT, curveV, finalOutputV) : null;
  return {
    finalOutputV,
    lastOutputV,
    isSettled,
    timeTo90PercentS: times?.to90S ?? null,
    timeTo1PercentS: times?.to1S ?? null,
    reachedS: stepper.timeS,
    notSettledWithinS: isSettled ? null : stepper.timeS,
    cyclesSimulated,
    frequencyHz,
    curve: downsampleMinMax(curveT, curveV, options.plotBuckets ?? 400),
  };
}
