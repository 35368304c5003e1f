import { DomainError } from '../errors';
import {
  buildLadderCircuit,
  capacitorName,
  LADDER_NODES,
  type LadderCircuitSpec,
} from '../circuits/build-ladder-circuit';
import { MnaSystem } from '../sim/mna-system';
import { findPeriodicSteadyState } from '../sim/periodic-steady-state';
import { chargeBalanceCapacitorVoltagesV } from '../circuits/steady-state-estimate';
import { TransientStepper } from '../sim/transient';
import { SampleBuffer } from '../sim/sample-buffer';
import { downsampleMinMax, windowMean, windowPeakToPeak } from '../sim/waveform-measures';
import { progressReporter } from './progress-reporter';
import { estimateRemainingApproach } from './cycle-settling';
import { followLadderStartUp, type LadderStartUp } from './ladder-start-up';

/** The transient counts as settled when the estimated rest of its approach is within this fraction of the output. */
export const SETTLED_FRACTION = 2e-4;
/** Cycle-mean changes below this fraction of the output are taken as no trend (the stepper's noise). */
const NOISE_FRACTION = 1e-7;

export interface LadderRunOptions {
  /** 'steady': until the cycle-mean output settles; a number: exactly that many drive cycles. */
  until: 'steady' | { cycles: number };
  maxStepPerPeriod: number;
  /** Follow the bleeder discharge after the drive is switched off at steady state, down to this voltage. */
  dischargeToV?: number;
  /** Points kept per plotted waveform (min/max buckets). */
  plotBuckets?: number;
  /** With 'steady': false skips the periodic steady state (shooting), so the transient alone settles the run. */
  isShootingUsed?: boolean;
  /** Give up the start-up transient after this many cycles. */
  maxCycles?: number;
  /**
   * Called with the run's completed fraction, 0..1, non-decreasing, at most about every 1 % and last with 1.
   * The periodic steady state, the start-up and the discharge are weighted into the one fraction.
   */
  onProgress?: (fraction: number) => void;
  /** Checked between time steps; when it answers true the run stops with a DomainError of code 'cancelled'. */
  shouldCancel?: () => boolean;
}

export interface PlotTrace {
  timeS: number[];
  values: number[];
}

export interface LadderRunResult {
  method: 'transient' | 'periodic-steady-state';
  outputMeanV: number;
  ripplePeakToPeakV: number;
  timeToSteadyStateS: number | null;
  /** End of the cycle from which the cycle mean stays within 1 % of the final mean, s (envelope following only). */
  timeTo1PercentS: number | null;
  /** How the start-up was computed: cycle-to-cycle envelope following, or every cycle simulated. */
  startUpMethod: 'envelope-following' | 'transient';
  /** Drive periods simulated (an envelope-following start-up covers far more cycles of circuit time). */
  cyclesSimulated: number;
  /** The periodic solution: shooting iterations, or with envelope following the envelope's points. */
  periodicSteadyState: { isConverged: boolean; iterations: number; relativeResidual: number } | null;
  /**
   * Whether outputMeanV is the settled value: true for a converged periodic steady state, else true only
   * when the transient's estimated remaining approach is within SETTLED_FRACTION of the output.
   */
  isSettled: boolean;
  /**
   * Estimated change of the output mean still to come after the reported value, V (0 for a converged
   * periodic steady state); null when the last cycles show no decaying trend to extrapolate.
   */
  remainingDriftV: number | null;
  /** Output during the start-up: cycle means with envelope following, else the simulated waveform. */
  startUp: PlotTrace;
  ripple: PlotTrace;
  discharge: {
    dischargeTimeS: number | null;
    safeVoltageV: number;
    capacitorVoltagesV: Record<string, PlotTrace>;
    output: PlotTrace;
    /** Charge left on each capacitor when the output reaches the safe voltage. */
    trappedChargeC: Record<string, number>;
  } | null;
}

const driveFrequencyHz = (spec: LadderCircuitSpec): number => spec.drive.frequencyHz;

/** Phase weights of the overall fraction: the periodic solution, the start-up, the discharge. */
function phaseWeights(options: LadderRunOptions): { pss: number; startUp: number; discharge: number } {
  const pss = options.until === 'steady' ? 0.1 : 0;
  const discharge = options.dischargeToV !== undefined ? 0.3 : 0;
  return { pss, startUp: 1 - pss - discharge, discharge };
}

/**
 * Design-level runs of a ladder: start-up from empty capacitors to 90 % of the final output (transient),
 * the steady-state ripple waveform (periodic steady state by shooting when `until` is 'steady', else the
 * last simulated cycle), and optionally the discharge after the drive is switched off (transient from
 * the steady-state charges with the secondary shorted through its source resistance). Output is the
 * ladder top, volts; times in seconds.
 */
export function runLadder(spec: LadderCircuitSpec, options: LadderRunOptions): LadderRunResult {
  const f = driveFrequencyHz(spec);
  const periodS = 1 / f;
  const buckets = options.plotBuckets ?? 400;
  const circuit = buildLadderCircuit(spec);
  const system = new MnaSystem(circuit);
  const topIndex = system.probeIndex(LADDER_NODES.ladderTop);
  const sign = spec.isNegative ? -1 : 1;
  const capCount = spec.capacitorsF.length;
  const weights = phaseWeights(options);
  const report = progressReporter(options.onProgress);
  const checkCancel = (): void => {
    if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The run was cancelled');
  };
  checkCancel();
  report(0, true);

  const runDischarge = (startCharges: Float64Array, ripple: PlotTrace): LadderRunResult['discharge'] => {
    if (options.dischargeToV === undefined) return null;
    const voltages = Array.from({ length: capCount }, (_, i) => startCharges[i]! / spec.capacitorsF[i]!);
    return followLadderDischarge(spec, voltages, {
      startOutputV: sign * Math.abs(windowMean(ripple.timeS, ripple.values, -Infinity, Infinity)),
      safeVoltageV: options.dischargeToV,
      minStepS: periodS / options.maxStepPerPeriod,
      plotBuckets: buckets,
      checkCancel,
      onShare: (share) => report(weights.pss + weights.startUp + weights.discharge * share),
    });
  };

  // 'steady': the start-up by envelope following, which ends at the periodic steady state.
  if (options.until === 'steady' && options.isShootingUsed !== false) {
    const startUp = followLadderStartUpOrNull(new MnaSystem(circuit), {
      periodS,
      stepsPerPeriod: options.maxStepPerPeriod,
      isNegative: spec.isNegative === true,
      // The share of the work is not known ahead: a fraction that rises with the periods run and never arrives.
      onPoint: (_cycle, periods) => {
        checkCancel();
        report(weights.pss + weights.startUp * (1 - 1 / (1 + periods / 200)));
      },
    });
    if (startUp !== null) {
      report(weights.pss + weights.startUp, true);
      const env = startUp.envelope;
      const ripple = { timeS: Array.from(env.timeS), values: Array.from(env.signals[LADDER_NODES.ladderTop]!) };
      const discharge = runDischarge(env.charges, ripple);
      report(1, true);
      return {
        method: 'periodic-steady-state',
        outputMeanV: startUp.finalMeanV,
        ripplePeakToPeakV: windowPeakToPeak(ripple.timeS, ripple.values, -Infinity, Infinity),
        timeToSteadyStateS: startUp.timeTo90PercentS,
        timeTo1PercentS: startUp.timeTo1PercentS,
        startUpMethod: 'envelope-following',
        cyclesSimulated: env.periods,
        periodicSteadyState: {
          isConverged: true,
          iterations: env.cycles.length,
          relativeResidual: env.relativeResidual,
        },
        isSettled: true,
        remainingDriftV: 0,
        startUp: downsampleMinMax(startUp.curve.timeS, startUp.curve.values, buckets),
        ripple: downsampleMinMax(ripple.timeS, ripple.values, buckets),
        discharge,
      };
    }
  }

  // Periodic steady state first when asked for 'steady': it gives the final value the start-up aims at.
  let pss: ReturnType<typeof findPeriodicSteadyState> | null = null;
  if (options.until === 'steady' && options.isShootingUsed !== false) {
    const ideal = chargeBalanceCapacitorVoltagesV(spec);
    const charges = new Float64Array(system.reactiveCount);
    ideal.forEach((v, i) => {
      charges[i] = v * spec.capacitorsF[i]!;
    });
    try {
      pss = findPeriodicSteadyState(new MnaSystem(circuit), {
        periodS,
        stepsPerPeriod: options.maxStepPerPeriod,
        initialCharges: charges,
        probes: [LADDER_NODES.ladderTop],
      });
    } catch {
      pss = null;
    }
  }
  const pssOk = pss !== null && pss.isConverged;
  checkCancel();
  report(weights.pss, true);
  const finalFromPss = pssOk ? windowMean(pss!.timeS, pss!.signals[LADDER_NODES.ladderTop]!, 0, periodS) : NaN;

  // Start-up transient from empty capacitors.
  const stepper = new TransientStepper(system, { maxStepS: periodS / options.maxStepPerPeriod });
  stepper.startFromCharges(system.initialCharge);
  // Every step's time and output, in growable typed buffers (off the JavaScript heap, so hundreds of
  // thousands of steps cost the collector nothing).
  const timeBuffer = new SampleBuffer();
  const topBuffer = new SampleBuffer();
  const cycleMeans: number[] = [];
  const maxCycles = options.until === 'steady' ? (options.maxCycles ?? 20000) : options.until.cycles;
  let reachedAtS: number | null = null;
  let lastCycleStart = 0;
  let cycles = 0;
  let area = 0;
  let prevT = 0;
  let prevV = 0;
  // Rest of the approach from the cycle means, over a window of a quarter of the cycles so far (at least 20).
  const remainingOf = (mean: number): number | null =>
    estimateRemainingApproach(
      cycleMeans,
      Math.max(20, Math.floor(cycleMeans.length / 4)),
      NOISE_FRACTION * Math.abs(mean),
    ).remaining;
  while (cycles < maxCycles) {
    const end = (cycles + 1) * periodS;
    while (stepper.timeS < end * (1 - 1e-12)) {
      checkCancel();
      stepper.step(end);
      const v = stepper.value(topIndex);
      area += ((v + prevV) / 2) * (stepper.timeS - prevT);
      prevT = stepper.timeS;
      prevV = v;
      timeBuffer.push(stepper.timeS);
      topBuffer.push(v);
    }
    cycles++;
    const mean = area / periodS;
    area = 0;
    cycleMeans.push(mean);
    lastCycleStart = end - periodS;
    // Start-up share: towards 90 % of the periodic solution when there is one, else the cycle budget.
    const startUpShare = pssOk ? (sign * mean) / (0.9 * sign * finalFromPss) : cycles / maxCycles;
    report(weights.pss + weights.startUp * Math.min(1, startUpShare));
    if (options.until === 'steady') {
      if (pssOk && reachedAtS === null && sign * mean >= 0.9 * sign * finalFromPss) reachedAtS = end;
      if (pssOk && reachedAtS !== null) break;
      // Without a periodic solution: settled when the extrapolated rest of the approach (not the last
      // cycles' move, which is small long before a slow ladder has settled) is within SETTLED_FRACTION.
      if (!pssOk && cycles > 40) {
        const rest = remainingOf(mean);
        if (rest !== null && Math.abs(rest) <= SETTLED_FRACTION * Math.abs(mean)) break;
      }
    }
  }
  report(weights.pss + weights.startUp, true);
  const lastMean = cycleMeans[cycleMeans.length - 1]!;
  const finalMean = pssOk ? finalFromPss : lastMean;
  const remainingDriftV = pssOk ? 0 : remainingOf(lastMean);
  const isSettled =
    pssOk || (remainingDriftV !== null && Math.abs(remainingDriftV) <= SETTLED_FRACTION * Math.abs(lastMean));
  if (reachedAtS === null) {
    const target = 0.9 * finalMean;
    const idx = cycleMeans.findIndex((m) => sign * m >= sign * target);
    reachedAtS = idx >= 0 ? (idx + 1) * periodS : null;
  }
  const time = timeBuffer.toArray();
  const top = topBuffer.toArray();
  const ripple = pssOk
    ? { timeS: Array.from(pss!.timeS), values: Array.from(pss!.signals[LADDER_NODES.ladderTop]!) }
    : (() => {
        const i0 = time.findIndex((t) => t >= lastCycleStart);
        return { timeS: Array.from(time.subarray(i0)), values: Array.from(top.subarray(i0)) };
      })();
  const rippleV = windowPeakToPeak(ripple.timeS, ripple.values, -Infinity, Infinity);

  // Discharge from the steady state (or the last transient state).
  const discharge = runDischarge(pssOk ? pss!.charges : stepper.q0, ripple);

  report(1, true);
  return {
    method: pssOk ? 'periodic-steady-state' : 'transient',
    outputMeanV: finalMean,
    ripplePeakToPeakV: rippleV,
    timeToSteadyStateS: reachedAtS,
    timeTo1PercentS: null,
    startUpMethod: 'transient',
    cyclesSimulated: cycles,
    periodicSteadyState: pss
      ? { isConverged: pss.isConverged, iterations: pss.iterations, relativeResidual: pss.relativeResidual }
      : null,
    isSettled,
    remainingDriftV,
    startUp: downsampleMinMax(time, top, buckets),
    ripple: downsampleMinMax(ripple.timeS, ripple.values, buckets),
    discharge,
  };
}

export interface DischargeRunOptions {
  /** Output (ladder top) at the switch-off, V; the first point of the output trace. */
  startOutputV: number;
  /** Level to discharge to (its magnitude is used), V. */
  safeVoltageV: number;
  /** Smallest maximum time step, s (the bleeder RC / 2000 when that is longer). */
  minStepS: number;
  plotBuckets: number;
  checkCancel: () => void;
  /** The discharge's completed share, 0..1: the fraction of ln(V0/Vsafe) covered (the decay of an RC). */
  onShare?: (share: number) => void;
}

/**
 * Bleeder discharge of a ladder after its drive is switched off: transient of the ladder alone from the
 * given capacitor voltages (design order, V), the secondary shorted through the drive's source
 * resistance, until the ladder top reaches the safe voltage (or 50 bleeder time constants). A
 * constant-current load is a model of the running equipment, not a discharge path: it is dropped (a
 * resistive load stays), so the discharge is the bleeder's. Seconds, volts, coulombs.
 */
export function followLadderDischarge(
  spec: LadderCircuitSpec,
  voltages: ReadonlyArray<number>,
  options: DischargeRunOptions,
): NonNullable<LadderRunResult['discharge']> {
  const capCount = spec.capacitorsF.length;
  const load = spec.load?.kind === 'current' ? null : (spec.load ?? null);
  const off = buildLadderCircuit({ ...spec, load, driveOffAtS: 0, initialCapacitorVoltagesV: voltages });
  const offSystem = new MnaSystem(off);
  const capIndex = Array.from({ length: capCount }, (_, i) => offSystem.reactiveNames.indexOf(capacitorName(i)));
  const offTop = offSystem.probeIndex(LADDER_NODES.ladderTop);
  const rcS = (spec.bleederOhm ?? 1e12) * spec.capacitorsF.reduce((a, b) => a + b, 0);
  const dis = new TransientStepper(offSystem, { maxStepS: Math.max(options.minStepS, rcS / 2000) });
  dis.startFromCharges(offSystem.initialCharge);
  const dt: number[] = [0];
  const dv: number[] = [options.startOutputV];
  const caps: number[][] = voltages.map((v) => [v]);
  const safe = Math.abs(options.safeVoltageV);
  let crossedS: number | null = null;
  const stopS = 50 * rcS;
  const logSpan = Math.log(Math.abs(dv[0]!) / safe);
  while (dis.timeS < stopS) {
    options.checkCancel();
    dis.step(stopS);
    const v = dis.value(offTop);
    const share =
      logSpan > 0 && Math.abs(v) > 0 ? Math.log(Math.abs(dv[0]!) / Math.abs(v)) / logSpan : dis.timeS / stopS;
    options.onShare?.(Math.min(1, Math.max(0, share)));
    dt.push(dis.timeS);
    dv.push(v);
    capIndex.forEach((k, i) => caps[i]!.push(dis.q0[k]! / spec.capacitorsF[i]!));
    if (Math.abs(v) <= safe) {
      const a = dv[dv.length - 2]!;
      const ta = dt[dt.length - 2]!;
      crossedS = ta + ((dis.timeS - ta) * (Math.abs(a) - safe)) / (Math.abs(a) - Math.abs(v));
      break;
    }
  }
  const capacitorVoltagesV: Record<string, PlotTrace> = {};
  const trappedChargeC: Record<string, number> = {};
  caps.forEach((series, i) => {
    capacitorVoltagesV[capacitorName(i)] = downsampleMinMax(dt, series, options.plotBuckets);
    trappedChargeC[capacitorName(i)] = series[series.length - 1]! * spec.capacitorsF[i]!;
  });
  return {
    dischargeTimeS: crossedS,
    safeVoltageV: safe,
    capacitorVoltagesV,
    output: downsampleMinMax(dt, dv, options.plotBuckets),
    trappedChargeC,
  };
}

/** The envelope-following start-up when it reaches the periodic steady state; null when it does not (a cancel still throws). */
function followLadderStartUpOrNull(
  system: MnaSystem,
  options: Parameters<typeof followLadderStartUp>[1],
): LadderStartUp | null {
  try {
    const startUp = followLadderStartUp(system, options);
    return startUp.envelope.isConverged ? startUp : null;
  } catch (error) {
    if (error instanceof DomainError && error.code === 'cancelled') throw error;
    return null;
  }
}
