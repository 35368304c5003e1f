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

/** Linear interpolation on a sorted trace from index hint `from` on; returns the value and the index used. */
function interpolateFrom(
  timeS: readonly number[],
  values: readonly number[],
  t: number,
  from: number,
): [number, number] {
  let i = Math.max(0, from);
  const last = timeS.length - 1;
  while (i < last - 1 && (timeS[i + 1] as number) < t) i += 1;
  if (t <= (timeS[0] as number)) return [values[0] as number, 0];
  if (i >= last) return [values[last] as number, last];
  const t0 = timeS[i] as number;
  const t1 = timeS[i + 1] as number;
  const v0 = values[i] as number;
  const v1 = values[i + 1] as number;
  return [t1 > t0 ? v0 + ((v1 - v0) * (Math.min(t, t1) - t0)) / (t1 - t0) : v1, i];
}

/** The trace at offsets `shiftS + τᵢ` (τ sorted), and the sum of squared differences from `measured`. */
function sampleAt(
  trace: { timeS: readonly number[]; values: readonly number[] },
  offsetsS: readonly number[],
  shiftS: number,
  measured: readonly number[],
): { values: number[]; sse: number } {
  let hint = 0;
  let sse = 0;
  const values = offsetsS.map((tau, i) => {
    const [v, at] = interpolateFrom(trace.timeS, trace.values, shiftS + tau, hint);
    hint = at;
    sse += ((measured[i] as number) - v) ** 2;
    return v;
  });
  return { values, sse };
}

/**
 * The simulated waveform at the measured sample times, aligned in time as a scope's trigger would be: the
 * capture's time origin is arbitrary, so the simulated trace is read at tᵢ − t₀ + s for the shift s (within
 * two period guesses) that matches the samples best in least squares, found on a grid of 1/400 period and
 * refined by the parabola through the best grid point and its neighbours. The shift is thus fitted with
 * the parameters (profiled out of the fit), and the samples themselves, amplitude and shape, are compared.
 */
export function alignedWaveform(
  trace: { timeS: readonly number[]; values: readonly number[]; periodGuessS: number },
  timesS: readonly number[],
  measured: readonly number[],
): number[] {
  const t0 = timesS[0] ?? 0;
  const offsetsS = timesS.map((t) => t - t0);
  const gridS = trace.periodGuessS / SHIFTS_PER_PERIOD;
  const count = SHIFT_SPAN_PERIODS * SHIFTS_PER_PERIOD;
  const sse = Array.from({ length: count + 1 }, (_, k) => sampleAt(trace, offsetsS, k * gridS, measured).sse);
  let best = 0;
  sse.forEach((value, k) => {
    if (value < (sse[best] as number)) best = k;
  });
  let shiftS = best * gridS;
  if (best > 0 && best < count) {
    const [a, b, c] = [sse[best - 1] as number, sse[best] as number, sse[best + 1] as number];
    const curvature = a - 2 * b + c;
    if (curvature > 0) shiftS += (0.5 * (a - c) * gridS) / curvature;
  }
  const refined = sampleAt(trace, offsetsS, shiftS, measured);
  return refined.sse <= (sse[best] as number)
    ? refined.values
    : sampleAt(trace, offsetsS, best * gridS, measured).values;
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
