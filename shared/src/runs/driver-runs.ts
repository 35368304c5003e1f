import { ladderPartFromDesign, type LadderCircuitSpec } from '../circuits/build-ladder-circuit';
import type { Design } from '../designs/design.types';
import { DomainError, isDomainError } from '../errors';
import { downsampleMinMax, windowMean } from '../sim/waveform-measures';
import { recordDriverCycles, type DriverCycles } from './driver-cycles';
import { driverPeriodGuessS, engineCapacitorVoltagesV } from './driver-design-circuit';
import { capacitorVoltagesV, openDriverRun, type DriverRunFrame } from './driver-run-frame';
import type { DriverRunOptions, DriverRunResult } from './driver-run.types';
import { DriverSettling } from './driver-settling';
import { followLadderDischarge, type LadderRunResult } from './ladder-runs';
import { progressReporter } from './progress-reporter';
import { withEffectiveTransformer } from '../transformer/given-numbers';

/**
 * A design driven by its blocking oscillator (driver + transformer + ladder), by transient simulation. A
 * self-oscillating circuit has no period known in advance, so there is no shooting (method 'transient').
 *
 * Warm start (default): the ladder capacitors start at the engine's steady-state estimate, so only the last
 * few percent settle. Settling: the output's (ladder top's) mean over windows of K estimated oscillation
 * periods; with the last three window means m1, m2, m3 the ratio r = (m3 − m2)/(m2 − m1) is the decay of
 * the slow charging mode per window, and the projected remaining change is (m3 − m2)·r/(1 − r) (Aitken's
 * Δ² extrapolation of a geometric sequence). Settled when the last two changes, each projected so, are
 * below `settleFraction` of the mean, a change being projected with the slowest clean decay seen in the run
 * (ten times the change when no clean decay has been seen). While not settled and the decay is clean (two ratios within 0.01, at least
 * five windows after the last extrapolation, so the fast modes have died out), each
 * ladder capacitor's charge is moved by its own projected remaining change and the run goes on (an
 * envelope extrapolation; the next windows check it). Cold start ('cold'): empty capacitors, the same
 * criterion without extrapolation, or exactly `windowS` seconds of the push-button start-up.
 *
 * Then `waveformPeriods` oscillation periods are recorded (output, collector, secondary, primary current),
 * and with `dischargeToV` the supply is switched off and the bleeder discharge followed (the stopped
 * transformer's secondary is a short through its winding resistance). Volts, amperes, seconds, joules.
 */
export function runDriverDesign(givenDesign: Design, options: DriverRunOptions = {}): DriverRunResult {
  const design = withEffectiveTransformer(givenDesign);
  if (design.drive.kind !== 'driver')
    throw new DomainError('invalid_design', 'runDriverDesign needs a driver drive', 'drive.kind');
  const estimatePeriodS = driverPeriodGuessS(design.drive.driver);
  const { start, initialV, warmStartFallback } = startingCharges(design, options.start ?? 'warm');
  const frame = openDriverRun(design, initialV, estimatePeriodS, options);
  const buckets = options.plotBuckets ?? 400;
  const windowS = (options.settleWindowPeriods ?? 20) * estimatePeriodS;
  const maxTimeS = options.windowS ?? (options.maxCycles ?? 20000) * estimatePeriodS;
  const isFixedWindow = options.windowS !== undefined;
  const discharges = options.dischargeToV !== undefined;
  const weights = { run: discharges ? 0.7 : 0.95, waves: 0.05, discharge: discharges ? 0.25 : 0 };
  const report = progressReporter(options.onProgress);
  frame.checkCancel();
  report(0, true);

  const settling = new DriverSettling(frame, {
    settleFraction: options.settleFraction ?? 1e-3,
    windowS,
    maxTimeS,
    isFixedWindow,
    canExtrapolate: start === 'warm',
    onShare: (share) => report(weights.run * share),
  });
  settling.run();
  const finalMean = settling.means[settling.means.length - 1]!;
  const reachedAtS = start === 'cold' && settling.isSettled ? settling.timeTo90PercentS() : null;
  const energy = settling.energy();
  const t = settling.time.toArray();
  const v = settling.topV.toArray();
  report(weights.run, true);

  const settledAtS = frame.stepper.timeS;
  const lastFrequencyHz = settling.lastWindowFrequencyHz;
  const lastPeriodS = lastFrequencyHz ? 1 / lastFrequencyHz : estimatePeriodS;
  const cycles = recordDriverCycles(frame, options.waveformPeriods ?? 4, lastPeriodS);
  const finalCapacitorVoltagesV = capacitorVoltagesV(frame);
  report(weights.run + weights.waves, true);

  const discharge =
    options.dischargeToV === undefined
      ? null
      : followDriverDischarge(design, frame, options.dischargeToV, lastPeriodS, buckets, (share) =>
          report(weights.run + weights.waves + weights.discharge * share),
        );
  report(1, true);
  const frequencyHz = cycles.figures?.oscillationFrequencyHz ?? null;
  const plots = plottedCycles(cycles, buckets);
  return {
    method: 'transient',
    start,
    warmStartFallback,
    figures: cycles.figures,
    isSettled: settling.isSettled,
    remainingDriftV: null,
    initialCapacitorVoltagesV: initialV,
    finalCapacitorVoltagesV,
    extrapolations: settling.extrapolations,
    outputMeanV: isFixedWindow ? windowMean(t, v, Math.max(0, settledAtS - windowS), settledAtS) : finalMean,
    ripplePeakToPeakV: cycles.ripplePeakToPeakV,
    timeToSteadyStateS: reachedAtS,
    timeTo1PercentS: null,
    startUpMethod: 'transient',
    cyclesSimulated: Math.round(frame.stepper.timeS * (frequencyHz ?? 1 / estimatePeriodS)),
    periodicSteadyState: null,
    startUp: downsampleMinMax(t, v, buckets),
    ripple: plots.ripple,
    discharge,
    oscillationFrequencyHz: frequencyHz,
    energy,
    waveforms: plots.waveforms,
  };
}

/**
 * The ladder capacitor voltages a run starts from (design order, V): the engine's steady-state estimate for
 * a warm start, or empty capacitors; a warm start falls back to a cold one when the engine refuses the design
 * (its closed form has limits the circuit does not), saying why.
 */
function startingCharges(
  design: Design,
  requested: 'warm' | 'cold',
): { start: 'warm' | 'cold'; initialV: number[]; warmStartFallback: string | null } {
  const empty = design.multiplier.capacitors.map(() => 0);
  if (requested === 'cold') return { start: 'cold', initialV: empty, warmStartFallback: null };
  try {
    return { start: 'warm', initialV: engineCapacitorVoltagesV(design), warmStartFallback: null };
  } catch (error) {
    if (!isDomainError(error) || error.code === 'cancelled') throw error;
    const warmStartFallback = `the engine's steady-state estimate failed (${error.message}); started cold`;
    return { start: 'cold', initialV: empty, warmStartFallback };
  }
}

/** The plotted ripple (the last whole cycle) and waveforms (all recorded cycles), min/max downsampled. */
function plottedCycles(
  { timeS, wave, lastCycleFrom }: DriverCycles,
  buckets: number,
): Pick<DriverRunResult, 'ripple' | 'waveforms'> {
  return {
    ripple: downsampleMinMax(timeS.slice(lastCycleFrom), wave.out.slice(lastCycleFrom), buckets),
    waveforms: {
      outputV: downsampleMinMax(timeS, wave.out, buckets),
      collectorV: downsampleMinMax(timeS, wave.col, buckets),
      secondaryV: downsampleMinMax(timeS, wave.sec, buckets),
      primaryA: downsampleMinMax(timeS, wave.pri, buckets),
    },
  };
}

/**
 * The supply switched off after the run: the bleeder discharge of the ladder from its charges now, down to
 * `safeVoltageV`. The stopped transformer's secondary is a short through its winding resistance.
 */
function followDriverDischarge(
  design: Design,
  frame: DriverRunFrame,
  safeVoltageV: number,
  lastPeriodS: number,
  buckets: number,
  onShare: (share: number) => void,
): LadderRunResult['discharge'] {
  if (design.drive.kind !== 'driver') throw new DomainError('invalid_design', 'needs a driver drive', 'drive.kind');
  const spec: LadderCircuitSpec = {
    ...ladderPartFromDesign(design),
    // The stopped secondary: no EMF (a sine of zero amplitude has no breakpoints), its winding resistance.
    drive: {
      kind: 'sine',
      peakV: 0,
      frequencyHz: 1 / lastPeriodS,
      sourceResistanceOhm: design.drive.driver.transformer.secondaryResistanceOhm,
    },
  };
  return followLadderDischarge(spec, capacitorVoltagesV(frame), {
    startOutputV: frame.system.x[frame.probes.top]!,
    safeVoltageV,
    minStepS: frame.estimatePeriodS,
    plotBuckets: buckets,
    checkCancel: frame.checkCancel,
    onShare,
  });
}
