import { ladderInputOf, resolveDrive } from '../analysis/analyze-design';
import type { Design } from '../designs/design.types';
import { solveLoadPoint } from '../driver/operating-point';
import { engineLadderLoadLine } from '../driver/ladder-load-line';
import { DomainError } from '../errors';
import { analyzeLadder, prepareLadder, terminalMeanAt } from '../multiplier/analyze-ladder';
import { driverPeriodGuessS } from '../runs/driver-design-circuit';
import { runDriverStartUp } from '../runs/driver-start-up';
import { followLadderDischarge } from '../runs/ladder-runs';
import { ladderPartFromDesign } from '../circuits/build-ladder-circuit';
import type { CalibrationDataUse, CalibrationDataset, CalibrationModelKind } from './calibration.types';
import { WAVEFORM_RELATIVE_TOLERANCE, waveformSimulation, type WaveformProbe } from './waveform-model';

/**
 * Which model predicts a kind of curve: the engine's estimate for load sweeps; the simulator for start-ups
 * and discharges (the oscillating column drains through the diodes, which the estimate's single RC does not
 * follow closely enough to fit a bleeder).
 */
export function modelKindOf(use: CalibrationDataUse): CalibrationModelKind {
  return use === 'load-sweep' ? 'estimate' : 'simulator';
}

/** Simulated time a start-up fit may cover (s): the simulator's cost grows with it. Common practice, no source. */
export const START_UP_MAX_WINDOW_S = 0.1;

/**
 * Output magnitude (V) at each external load current (A) by the engine's estimate: for a driver design the
 * joint operating point of the blocking oscillator and the ladder (`solveLoadPoint`), for a sine or pulse
 * drive the ladder's charge-transfer steady state at that extra load (`terminalMeanAt`).
 */
export function loadSweepEstimate(design: Design, currentsA: readonly number[]): number[] {
  const { drive, currentLimitA } = resolveDrive(design);
  const input = { ...ladderInputOf(design, drive, currentLimitA), polarity: 1 as const };
  if (design.drive.kind === 'driver') {
    const stage = design.drive.driver;
    const ladder = engineLadderLoadLine(input);
    return currentsA.map((currentA) => Math.max(0, solveLoadPoint(stage, ladder, currentA).outputV));
  }
  const prepared = prepareLadder({ ...input, load: null });
  return currentsA.map((currentA) => Math.max(0, terminalMeanAt(prepared, currentA)));
}

/** Linear interpolation on a sorted trace; before its start the first value, after its end the last. */
function sampleTrace(timeS: readonly number[], values: readonly number[], t: number): number {
  const n = timeS.length;
  if (n === 0) return 0;
  if (t <= (timeS[0] as number)) return values[0] as number;
  if (t >= (timeS[n - 1] as number)) return values[n - 1] as number;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((timeS[mid] as number) <= t) lo = mid;
    else hi = mid;
  }
  const t0 = timeS[lo] as number;
  const t1 = timeS[hi] as number;
  const v0 = values[lo] as number;
  const v1 = values[hi] as number;
  return t1 === t0 ? v1 : v0 + ((v1 - v0) * (t - t0)) / (t1 - t0);
}

export interface SimulatorRunOptions {
  shouldCancel?: () => boolean;
  /**
   * The simulator's relative tolerance (default START_UP_RELATIVE_TOLERANCE for a start-up or discharge,
   * WAVEFORM_RELATIVE_TOLERANCE for a waveform).
   */
  relativeTolerance?: number;
}

/**
 * Relative tolerance of a start-up fit's simulator runs. At SPICE's default 1e-3 the cycle means of the
 * tester's start-up (gain 80) sat 1.3–2.0 % below ngspice's at 1e-5 on the same netlist, a bias larger than
 * a bench instrument's noise that the fit takes for a parameter (gain fitted 81.0 for a true 80); at 1e-4
 * they sit within 0.11 %, at 1.4 times the cost.
 */
export const START_UP_RELATIVE_TOLERANCE = 1e-4;

/**
 * Output magnitude (V) at each time (s) after the push-button by the simulator: the cold start of the
 * driver design (`runDriverStartUp`), its cycle means interpolated at the measured times. Past a settled
 * run's end the settled output holds.
 */
export function startUpSimulation(
  design: Design,
  timesS: readonly number[],
  options: SimulatorRunOptions = {},
): number[] {
  if (design.drive.kind !== 'driver') {
    throw new DomainError('invalid_argument', 'A start-up fit needs a design with a driver stage', 'runs');
  }
  const endS = timesS[timesS.length - 1] ?? 0;
  // Past the last measured time by a few oscillation periods, so that it falls in a whole cycle's mean, not
  // in the part-cycle the run stops in.
  const run = runDriverStartUp(design, {
    maxTimeS: Math.min(
      Math.max(endS * 1.02, endS + 3 * driverPeriodGuessS(design.drive.driver)),
      START_UP_MAX_WINDOW_S,
    ),
    // Never stop on settling before the data end: the projection would stand in for the measured tail.
    settleFraction: 0,
    plotBuckets: 4000,
    tolerances: { relative: options.relativeTolerance ?? START_UP_RELATIVE_TOLERANCE },
    ...(options.shouldCancel ? { shouldCancel: options.shouldCancel } : {}),
  });
  const magnitudes = run.curve.values.map((v) => Math.abs(v));
  return timesS.map((t) => sampleTrace(run.curve.timeS, magnitudes, t));
}

/**
 * The bleeder discharge (V at each time after switch-off, s) by the simulator (`followLadderDischarge`),
 * from the engine's capacitor voltages at the design's operating point scaled to the run's first measured
 * output (then at the level the fit gives, see below), trimmed by the least-squares scale k = Σ y·s / Σ s² of the simulated curve s against the
 * measured magnitudes y (the switch-off voltage is data, not model).
 */
export function dischargeSimulation(
  design: Design,
  timesS: readonly number[],
  measuredV: readonly number[],
  options: SimulatorRunOptions = {},
): number[] {
  if (!design.outputNetwork.bleeder) {
    throw new DomainError('invalid_argument', 'A discharge fit needs a design with a bleeder', 'runs');
  }
  const { drive, currentLimitA } = resolveDrive(design);
  const analysis = analyzeLadder({ ...ladderInputOf(design, drive, currentLimitA), polarity: 1 });
  const topV = Math.max(Math.abs(analysis.ladderTopMeanV), 1e-9);
  const sourceResistanceOhm =
    design.drive.kind === 'driver'
      ? design.drive.driver.transformer.secondaryResistanceOhm
      : design.drive.sourceResistanceOhm;
  const spec = {
    ...ladderPartFromDesign(design),
    isNegative: false,
    load: null,
    drive: { kind: 'sine' as const, peakV: 0, frequencyHz: 1e3, sourceResistanceOhm },
  };
  // Started at the run's first measured output, then once more at the level the least-squares scale gives
  // (the diodes conduct while the oscillating column drains, so the shape depends on the level, and one
  // noisy first sample must not set it).
  const t0 = timesS[0] ?? 0;
  const endS = (timesS[timesS.length - 1] ?? 0) - t0;
  const lastV = Math.abs(measuredV[measuredV.length - 1] ?? 0);
  const simulate = (startV: number): number[] => {
    const voltages = analysis.capacitors.map((c) => ((c.maxVoltageV - c.swingV / 2) * startV) / topV);
    const run = followLadderDischarge(spec, voltages, {
      startOutputV: startV,
      safeVoltageV: Math.max(lastV * 0.5, 1e-6),
      minStepS: endS / 2000,
      plotBuckets: 4000,
      checkCancel: () => {
        if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The calibration was cancelled');
      },
    });
    return timesS.map((t) => Math.abs(sampleTrace(run.output.timeS, run.output.values, t - t0)));
  };
  const bestScale = (shape: readonly number[]): number => {
    let numerator = 0;
    let denominator = 0;
    shape.forEach((v, i) => {
      numerator += Math.abs(measuredV[i] ?? 0) * v;
      denominator += v * v;
    });
    return denominator > 0 ? numerator / denominator : 0;
  };
  const firstV = Math.abs(measuredV[0] ?? 0);
  const levelV = firstV * bestScale(simulate(firstV));
  const shape = simulate(levelV);
  const scale = bestScale(shape);
  return shape.map((s) => scale * s);
}

/** The probe of a waveform use, or null for a curve of the output. */
export function waveformProbeOf(use: CalibrationDataUse): WaveformProbe | null {
  if (use === 'collector-waveform') return 'collector';
  if (use === 'secondary-waveform') return 'secondary';
  return null;
}

/** A measured value as the fit compares it: a waveform's signed voltage, else the output's magnitude. */
export function fittedValueOf(use: CalibrationDataUse, y: number): number {
  return waveformProbeOf(use) ? y : Math.abs(y);
}

/** The prediction of one dataset for a design, by its model. */
export function predictDataset(
  design: Design,
  dataset: CalibrationDataset,
  options: SimulatorRunOptions = {},
): number[] {
  const xs = dataset.points.map((point) => Math.abs(point.x));
  if (dataset.use === 'load-sweep') return loadSweepEstimate(design, xs);
  const probe = waveformProbeOf(dataset.use);
  if (probe) {
    return waveformSimulation(
      design,
      probe,
      dataset.points.map((point) => point.x),
      dataset.points.map((point) => point.y),
      {
        relativeTolerance: options.relativeTolerance ?? WAVEFORM_RELATIVE_TOLERANCE,
        ...(options.shouldCancel ? { shouldCancel: options.shouldCancel } : {}),
      },
    );
  }
  if (dataset.use === 'discharge') {
    return dischargeSimulation(
      design,
      dataset.points.map((point) => point.x),
      dataset.points.map((point) => point.y),
      options,
    );
  }
  return startUpSimulation(
    design,
    dataset.points.map((point) => point.x),
    options,
  );
}
