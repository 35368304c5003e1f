import { DRIVER_NODES } from '../circuits/build-driver-circuit';
import type { Design } from '../designs/design.types';
import { DomainError } from '../errors';
import { driverDesignCircuit, driverPeriodGuessS, engineCapacitorVoltagesV } from '../runs/driver-design-circuit';
import { MnaSystem } from '../sim/mna-system';
import { TransientStepper } from '../sim/transient';
import { withEffectiveTransformer } from '../transformer/given-numbers';

/** The node a scope capture was taken at: the collector (to ground) or the secondary's dot end (to ground). */
export type WaveformProbe = 'collector' | 'secondary';

/**
 * Oscillation periods (the design's period guess) the warm run settles before its trace is read: the driver
 * settles within a few cycles from the engine's ladder voltages, and a capture is taken in steady state.
 * Common practice, no source.
 */
export const WAVEFORM_SETTLE_PERIODS = 12;
/**
 * Longest capture a waveform fit reads, in period guesses. Over several cycles a small error in the period
 * moves the later edges past the samples, and the least-squares cost of the parameters breaks into narrow
 * wells (the tester's collector over 3 periods: a well of ±5 around the true gain 80, flat beyond; over 1.2
 * periods one valley from 60 to 110); one cycle and a little holds the shape, the on-time and the ring.
 */
export const WAVEFORM_MAX_PERIODS = 1.5;
/** Shortest capture: a fit needs most of one cycle's shape. */
export const WAVEFORM_MIN_PERIODS = 0.5;
/**
 * Relative tolerance of a waveform fit's simulator runs. The sample cost of the tester's collector (1 % scope
 * noise, coupling near 0.95) jitters by about 5 times the noise variance from one coupling to the next
 * 0.0001 away at 1e-4, where the 95 % interval reads a rise of 4 times it; at 1e-5 the jitter stays below 1,
 * at 1.35 times the cost of a run.
 */
export const WAVEFORM_RELATIVE_TOLERANCE = 1e-6;
/** Trigger positions tried per period guess before the best is refined. */
const SHIFTS_PER_PERIOD = 400;
/** The shifts tried span this many period guesses (the true period may be longer than the guess). */
const SHIFT_SPAN_PERIODS = 2;

/** Node of a probe in the driver circuit. */
function probeNode(probe: WaveformProbe): string {
  return probe === 'collector' ? DRIVER_NODES.collector : DRIVER_NODES.secondary;
}

export interface WaveformRunOptions {
  relativeTolerance: number;
  shouldCancel?: () => boolean;
}

/**
 * The probe's voltage (V) by the simulator over [0, spanS + SHIFT_SPAN_PERIODS periods], time 0 being the
 * end of a settling run of WAVEFORM_SETTLE_PERIODS from the engine's steady-state ladder voltages (a warm
 * start). Every step's value is kept.
 */
export function simulatedWaveform(
  design: Design,
  probe: WaveformProbe,
  spanS: number,
  options: WaveformRunOptions,
): { timeS: number[]; values: number[]; periodGuessS: number } {
  const effective = withEffectiveTransformer(design);
  if (effective.drive.kind !== 'driver') {
    throw new DomainError('invalid_argument', 'A waveform fit needs a design with a driver stage', 'runs');
  }
  const periodGuessS = driverPeriodGuessS(effective.drive.driver);
  const circuit = driverDesignCircuit(effective, engineCapacitorVoltagesV(effective));
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, {
    maxStepS: periodGuessS / 200,
    tolerances: { relative: options.relativeTolerance },
  });
  stepper.startFromCharges(system.initialCharge);
  const node = system.probeIndex(probeNode(probe));
  const settleS = WAVEFORM_SETTLE_PERIODS * periodGuessS;
  const endS = settleS + spanS + SHIFT_SPAN_PERIODS * periodGuessS;
  const timeS: number[] = [];
  const values: number[] = [];
  while (stepper.timeS < endS) {
    if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The calibration was cancelled');
    stepper.step(stepper.timeS < settleS ? settleS : endS);
    if (stepper.timeS >= settleS) {
      timeS.push(stepper.timeS - settleS);
      values.push(system.x[node]!);
    }
  }
  return { timeS, values, periodGuessS };
}

/** Index of the last trace time at or before t (0 before the start), by bisection. */
function indexAtOrBefore(timeS: readonly number[], t: number): number {
  let lo = 0;
  let hi = timeS.length - 1;
  if (hi <= 0 || t <= (timeS[0] as number)) return 0;
  if (t >= (timeS[hi] as number)) return hi;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((timeS[mid] as number) <= t) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * The trace at offsets `shiftS + τᵢ` (τ sorted), linearly interpolated (the first value before the trace, the
 * last after it), and the sum of squared differences from `measured`.
 */
function sampleAt(
  trace: { timeS: readonly number[]; values: readonly number[] },
  offsetsS: readonly number[],
  shiftS: number,
  measured: readonly number[],
): { values: number[]; sse: number } {
  const { timeS, values: traceValues } = trace;
  const last = timeS.length - 1;
  let i = indexAtOrBefore(timeS, shiftS + (offsetsS[0] ?? 0));
  let sse = 0;
  const values = offsetsS.map((tau, k) => {
    const t = shiftS + tau;
    while (i < last && (timeS[i + 1] as number) <= t) i += 1;
    let v: number;
    if (t <= (timeS[0] as number)) v = traceValues[0] as number;
    else if (i >= last) v = traceValues[last] as number;
    else {
      const t0 = timeS[i] as number;
      const t1 = timeS[i + 1] as number;
      const v0 = traceValues[i] as number;
      v = t1 > t0 ? v0 + (((traceValues[i + 1] as number) - v0) * (t - t0)) / (t1 - t0) : v0;
    }
    sse += ((measured[k] as number) - v) ** 2;
    return v;
  });
  return { values, sse };
}

/** Coarse valleys of the shift's cost refined finely (the best few; a narrow valley may hide behind a wider one). */
const VALLEYS_REFINED = 4;
/** Fine points per coarse grid cell on each side of a coarse valley. */
const FINE_PER_CELL = 16;
/** Golden-section steps on the best fine cell (its width shrinks by 0.618 a step). */
const GOLDEN_STEPS = 20;

/** The shift s in [lowS, highS] of least cost by golden-section search (cost continuous, one valley there). */
function goldenMinimum(cost: (s: number) => number, lowS: number, highS: number): number {
  const ratio = (Math.sqrt(5) - 1) / 2;
  let a = lowS;
  let b = highS;
  let c = b - ratio * (b - a);
  let d = a + ratio * (b - a);
  let fc = cost(c);
  let fd = cost(d);
  for (let step = 0; step < GOLDEN_STEPS; step += 1) {
    if (fc <= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - ratio * (b - a);
      fc = cost(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + ratio * (b - a);
      fd = cost(d);
    }
  }
  return fc <= fd ? c : d;
}

/**
 * The simulated waveform at the measured sample times, aligned in time as a scope's trigger would be: the
 * capture's time origin is arbitrary, so the simulated trace is read at tᵢ − t₀ + s for the shift s (within
 * two period guesses) that matches the samples best in least squares. The shift is thus fitted with the
 * parameters (profiled out of the fit), and the samples themselves, amplitude and shape, are compared. The
 * cost of a shift is V-shaped where an edge passes a sample, so a grid with a parabola through its best point
 * misses the least cost by an amount that jumps from one parameter set to the next (the tester's collector:
 * up to 230 times the noise variance, against the 4 that a 95 % interval reads). So the best shift is found
 * to a small fraction of a time step: a grid of 1/400 period, its best few valleys on a grid 16 times finer,
 * then golden-section search on the best fine cell.
 */
export function alignedWaveform(
  trace: { timeS: readonly number[]; values: readonly number[]; periodGuessS: number },
  timesS: readonly number[],
  measured: readonly number[],
): number[] {
  const t0 = timesS[0] ?? 0;
  const offsetsS = timesS.map((t) => t - t0);
  const costAt = (shiftS: number) => sampleAt(trace, offsetsS, shiftS, measured).sse;
  const gridS = trace.periodGuessS / SHIFTS_PER_PERIOD;
  const count = SHIFT_SPAN_PERIODS * SHIFTS_PER_PERIOD;
  const coarse = Array.from({ length: count + 1 }, (_, k) => costAt(k * gridS));
  const valleys = coarse
    .flatMap((value, k) =>
      (k === 0 || value <= (coarse[k - 1] as number)) && (k === count || value <= (coarse[k + 1] as number)) ? [k] : [],
    )
    .sort((a, b) => (coarse[a] as number) - (coarse[b] as number))
    .slice(0, VALLEYS_REFINED);
  const fineS = gridS / FINE_PER_CELL;
  let bestS = (valleys[0] ?? 0) * gridS;
  let bestCost = coarse[valleys[0] ?? 0] ?? Infinity;
  for (const k of valleys) {
    for (let f = -FINE_PER_CELL; f <= FINE_PER_CELL; f += 1) {
      const shiftS = Math.min(count * gridS, Math.max(0, k * gridS + f * fineS));
      const value = costAt(shiftS);
      if (value < bestCost) {
        bestCost = value;
        bestS = shiftS;
      }
    }
  }
  const refinedS = goldenMinimum(costAt, Math.max(0, bestS - fineS), Math.min(count * gridS, bestS + fineS));
  return sampleAt(trace, offsetsS, costAt(refinedS) < bestCost ? refinedS : bestS, measured).values;
}

/** The probe's waveform of `design` at the measured times, aligned to the measured samples (V). */
export function waveformSimulation(
  design: Design,
  probe: WaveformProbe,
  timesS: readonly number[],
  measured: readonly number[],
  options: WaveformRunOptions,
): number[] {
  const spanS = (timesS[timesS.length - 1] ?? 0) - (timesS[0] ?? 0);
  return alignedWaveform(simulatedWaveform(design, probe, spanS, options), timesS, measured);
}
