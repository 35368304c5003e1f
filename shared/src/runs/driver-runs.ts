import { estimateBlockingOscillator } from '../driver/blocking-oscillator';
import { DRIVER_NODES, buildDriverCircuit } from '../circuits/build-driver-circuit';
import type { Design } from '../designs/design.types';
import { DomainError } from '../errors';
import { analyzeDesign } from '../analysis/analyze-design';
import {
  capacitorName,
  LADDER_NODES,
  ladderPartFromDesign,
  type LadderCircuitSpec,
} from '../circuits/build-ladder-circuit';
import type { Circuit } from '../sim/circuit.types';
import { followLadderDischarge, type LadderRunResult, type PlotTrace } from './ladder-runs';
import { EnergyMeter, type EnergyAccount } from '../sim/energy-meter';
import { MnaSystem } from '../sim/mna-system';
import { SampleBuffer } from '../sim/sample-buffer';
import { TransientStepper } from '../sim/transient';
import { downsampleMinMax, risingCrossings, windowMean, windowPeakToPeak } from '../sim/waveform-measures';

export interface DriverRunOptions {
  /**
   * 'warm' (default): the ladder capacitors start at the engine's steady-state estimate (analyzeDesign's
   * node voltages) and the run settles the rest. 'cold': the push-button start from an empty ladder.
   */
  start?: 'warm' | 'cold';
  /** Simulate exactly this long (s) instead of until the output settles (the cold start-up window). */
  windowS?: number;
  /** Settled when the projected remaining change of the output's window mean is below this fraction; default 1e-3. */
  settleFraction?: number;
  /** Estimated oscillation periods per settling window (K); default 20. */
  settleWindowPeriods?: number;
  /** Maximum time step; default 1/200 of the estimated oscillation period. */
  maxStepS?: number;
  /** Give up settling after this many estimated oscillation periods; default 20000. */
  maxCycles?: number;
  /** Measured oscillation periods of the full-resolution steady-state waveforms at the end; default 4. */
  waveformPeriods?: number;
  /** After settling, switch the supply off and follow the bleeder discharge down to this voltage. */
  dischargeToV?: number;
  plotBuckets?: number;
  /** Called with the completed fraction, 0..1, non-decreasing, about every 1 % and last with 1. */
  onProgress?: (fraction: number) => void;
  /** Checked between time steps; true stops the run with a DomainError of code 'cancelled'. */
  shouldCancel?: () => boolean;
}

/** Waveforms of the last few oscillation periods, min/max downsampled (peaks kept). */
export interface DriverWaveforms {
  /** Ladder top, V. */
  outputV: PlotTrace;
  /** Collector to ground, V. */
  collectorV: PlotTrace;
  /** Secondary dot end to ground, V. */
  secondaryV: PlotTrace;
  /** Primary winding current from the supply into the collector, A. */
  primaryA: PlotTrace;
}

export interface DriverRunResult extends LadderRunResult {
  start: 'warm' | 'cold';
  /** Whether the settling criterion was met (false: a fixed window, or the cycle budget ran out). */
  isSettled: boolean;
  /** Capacitor voltages the run started from (design order), V. */
  initialCapacitorVoltagesV: number[];
  /** How often the slow charging mode was extrapolated (see runDriverDesign). */
  extrapolations: number;
  /** Mean oscillation frequency over the last window, from the collector's rising crossings of the supply. */
  oscillationFrequencyHz: number | null;
  /** Energy drawn from the supply, dissipated per element and stored, since the start or the last extrapolation (before any discharge). */
  energy: EnergyAccount;
  waveforms: DriverWaveforms;
}

/** Smallest rise of the progress fraction that is reported. */
const PROGRESS_STEP = 0.01;

/**
 * Steady-state capacitor voltages (design order, V) of a driver design from the engine: analyzeDesign's
 * per-node cycle means, each capacitor the difference of its two nodes (node ids are the simulator's).
 */
export function engineCapacitorVoltagesV(design: Design): number[] {
  if (design.drive.kind !== 'driver') throw new DomainError('invalid_design', 'needs a driver drive', 'drive.kind');
  const report = analyzeDesign(design);
  const mean = new Map<string, number>(report.analysis.nodes.map((n) => [n.id, n.meanV]));
  mean.set('0', 0);
  const circuit = buildDriverCircuit(design.drive.driver, { ladder: ladderPartFromDesign(design) });
  return design.multiplier.capacitors.map((_, i) => {
    const c = circuit.elements.find((e) => e.kind === 'capacitor' && e.name === capacitorName(i));
    if (!c || c.kind !== 'capacitor')
      throw new DomainError('invalid_design', `no capacitor ${capacitorName(i)} in the circuit`);
    const a = mean.get(c.nodeA);
    const b = mean.get(c.nodeB);
    if (a === undefined || b === undefined)
      throw new DomainError('invalid_design', `the engine reports no voltage for ${capacitorName(i)}'s nodes`);
    return a - b;
  });
}

/** The driver circuit of a design with the ladder capacitors starting at the given voltages (design order). */
export function driverDesignCircuit(design: Design, initialCapacitorVoltagesV: ReadonlyArray<number>): Circuit {
  if (design.drive.kind !== 'driver') throw new DomainError('invalid_design', 'needs a driver drive', 'drive.kind');
  return buildDriverCircuit(design.drive.driver, {
    ladder: { ...ladderPartFromDesign(design), initialCapacitorVoltagesV },
  });
}

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
export function runDriverDesign(design: Design, options: DriverRunOptions = {}): DriverRunResult {
  if (design.drive.kind !== 'driver')
    throw new DomainError('invalid_design', 'runDriverDesign needs a driver drive', 'drive.kind');
  const start = options.start ?? 'warm';
  const estimatePeriodS = 1 / estimateBlockingOscillator(design.drive.driver).frequencyHz.value;
  const capsF = design.multiplier.capacitors.map((c) => c.valueF);
  const initialV = start === 'warm' ? engineCapacitorVoltagesV(design) : capsF.map(() => 0);
  const circuit = driverDesignCircuit(design, initialV);
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, { maxStepS: options.maxStepS ?? estimatePeriodS / 200 });
  stepper.startFromCharges(system.initialCharge);
  // The account opens after the first step: before it the unknowns are a zero guess, not the initial state.
  let meter = new EnergyMeter(circuit, system);
  let isMeterStale = true;
  const capIndex = capsF.map((_, i) => system.reactiveNames.indexOf(capacitorName(i)));
  const top = system.probeIndex(LADDER_NODES.ladderTop);
  const collector = system.probeIndex(DRIVER_NODES.collector);
  const supply = system.probeIndex(DRIVER_NODES.supply);
  const secondary = system.probeIndex(DRIVER_NODES.secondary);
  const primary = system.probeIndex('I(T1.Lp)');
  const buckets = options.plotBuckets ?? 400;
  const settleFraction = options.settleFraction ?? 1e-3;
  const windowS = (options.settleWindowPeriods ?? 20) * estimatePeriodS;
  const maxTimeS = options.windowS ?? (options.maxCycles ?? 20000) * estimatePeriodS;
  const isFixedWindow = options.windowS !== undefined;
  const discharges = options.dischargeToV !== undefined;
  const weights = { run: discharges ? 0.7 : 0.95, waves: discharges ? 0.05 : 0.05, discharge: discharges ? 0.25 : 0 };
  let reported = -Infinity;
  const report = (fraction: number, isForced = false): void => {
    if (!options.onProgress) return;
    const f = Math.min(1, Math.max(reported, fraction, 0));
    if (f >= reported + PROGRESS_STEP || (isForced && f > reported)) {
      reported = f;
      options.onProgress(f);
    }
  };
  const checkCancel = (): void => {
    if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The run was cancelled');
  };
  checkCancel();
  report(0, true);

  const time = new SampleBuffer();
  const topV = new SampleBuffer();
  let colWindow = { time: new SampleBuffer(), values: new SampleBuffer() };
  const means: number[] = [];
  let capMeans: number[][] = [];
  let sinceJump = 0;
  let extrapolations = 0;
  let isSettled = false;
  let firstProjection: number | null = null;
  let reachedAtS: number | null = null;
  let prevT = 0;
  let prevV = system.x[top]!;
  let prevCol = system.x[collector]! - system.x[supply]!;
  let windowIndex = 0;
  let windowStartS = 0;
  let area = 0;
  let capArea = capsF.map(() => 0);
  const ratios: number[] = [];
  let slowestRatio = 0;
  while (stepper.timeS < maxTimeS * (1 - 1e-12) && !isSettled) {
    windowIndex++;
    const end = Math.min(windowIndex * windowS, maxTimeS);
    colWindow = { time: new SampleBuffer(), values: new SampleBuffer() };
    // A window closes at the first rising crossing of the collector through the supply after `end`, so
    // each window mean is a mean over whole oscillation periods (the cycle mean); a fixed window closes at `end`.
    let closedAtS: number | null = null;
    while (closedAtS === null) {
      checkCancel();
      stepper.step(isFixedWindow || stepper.timeS < end * (1 - 1e-12) ? end : Infinity);
      if (isMeterStale) {
        // An extrapolation moved charge that no source supplied: the account restarts after it.
        meter = new EnergyMeter(circuit, system);
        isMeterStale = false;
      }
      meter.record(stepper.timeS);
      const v = system.x[top]!;
      const col = system.x[collector]! - system.x[supply]!;
      const dt = stepper.timeS - prevT;
      const isCrossing = stepper.timeS >= end * (1 - 1e-12) && prevCol < 0 && col >= 0 && !isFixedWindow;
      // Fraction of this step before the crossing (linear interpolation of the collector).
      const before = isCrossing ? -prevCol / (col - prevCol) : 1;
      const vAt = prevV + (v - prevV) * before;
      area += 0.5 * (vAt + prevV) * dt * before;
      capIndex.forEach((k, i) => {
        capArea[i]! += (stepper.q0[k]! / capsF[i]!) * dt * before;
      });
      time.push(stepper.timeS);
      topV.push(v);
      colWindow.time.push(stepper.timeS);
      colWindow.values.push(col);
      if (
        isCrossing ||
        (isFixedWindow && stepper.timeS >= end * (1 - 1e-12)) ||
        stepper.timeS >= maxTimeS * (1 - 1e-12)
      ) {
        closedAtS = prevT + dt * before;
        const span = closedAtS - windowStartS;
        means.push(area / span);
        capMeans.push(capArea.map((a) => a / span));
        windowStartS = closedAtS;
        area = 0.5 * (vAt + v) * dt * (1 - before);
        capArea = capIndex.map((k, i) => (stepper.q0[k]! / capsF[i]!) * dt * (1 - before));
      }
      prevT = stepper.timeS;
      prevV = v;
      prevCol = col;
    }
    sinceJump++;
    const mean = means[means.length - 1]!;
    if (isFixedWindow) {
      report(weights.run * (stepper.timeS / maxTimeS));
      continue;
    }
    const n = means.length;
    if (sinceJump >= 3) {
      const d1 = means[n - 2]! - means[n - 3]!;
      const d2 = mean - means[n - 2]!;
      const ratio = d1 !== 0 ? d2 / d1 : 0;
      ratios.push(ratio);
      const previousRatio = sinceJump >= 4 ? ratios[ratios.length - 2]! : NaN;
      // A clean geometric decay: two successive ratios in (0, 0.995) within 0.01 of each other. It projects
      // its remaining change; any other change (noise, or a fast mode still decaying) counts ten times.
      const isClean = ratio > 0 && ratio < 0.995 && Math.abs(ratio - previousRatio) <= 0.01;
      // The slowest clean decay seen is the circuit's slow charging mode: every later change is projected
      // with it too, so a fast mode dying out after an extrapolation cannot pass for settling.
      if (isClean) slowestRatio = Math.max(slowestRatio, ratio);
      const gain = Math.max(isClean ? ratio / (1 - ratio) : 10, slowestRatio / (1 - slowestRatio));
      const projected = Math.abs(d2) * gain;
      const scale = Math.abs(mean) || 1;
      if (sinceJump >= 4 && Math.max(Math.abs(d1), Math.abs(d2)) * gain <= settleFraction * scale) isSettled = true;
      firstProjection ??= projected;
      const share =
        firstProjection > settleFraction * scale && projected > 0
          ? Math.log(firstProjection / projected) / Math.log(firstProjection / (settleFraction * scale))
          : 0;
      report(weights.run * Math.max(stepper.timeS / maxTimeS, Math.min(0.99, share)));
      if (!isSettled && start === 'warm' && isClean && sinceJump >= 5) {
        const jumpGain = ratio / (1 - ratio);
        const last = capMeans[capMeans.length - 1]!;
        const previous = capMeans[capMeans.length - 2]!;
        capIndex.forEach((k, i) => {
          stepper.q0[k]! += (last[i]! - previous[i]!) * jumpGain * capsF[i]!;
        });
        stepper.restart();
        extrapolations++;
        isMeterStale = true;
        sinceJump = 0;
        capMeans = [];
      }
    } else {
      report(weights.run * (stepper.timeS / maxTimeS));
    }
  }
  const finalMean = means[means.length - 1]!;
  if (start === 'cold') {
    const firstAt = means.findIndex((m) => Math.abs(m) >= 0.9 * Math.abs(finalMean));
    reachedAtS = firstAt >= 0 ? Math.min((firstAt + 1) * windowS, maxTimeS) : null;
  }
  const crossings = risingCrossings(colWindow.time.toArray(), colWindow.values.toArray(), 0);
  const frequencyHz =
    crossings.length >= 3 ? (crossings.length - 1) / (crossings[crossings.length - 1]! - crossings[0]!) : null;
  const energy = meter.account();
  const t = time.toArray();
  const v = topV.toArray();
  report(weights.run, true);

  // A few oscillation periods at full resolution: output, collector, secondary, primary current.
  const lastPeriodS = frequencyHz ? 1 / frequencyHz : estimatePeriodS;
  const waveEndS = stepper.timeS + (options.waveformPeriods ?? 4) * lastPeriodS;
  const waveT: number[] = [];
  const wave = { out: [] as number[], col: [] as number[], sec: [] as number[], pri: [] as number[] };
  const sample = (): void => {
    waveT.push(stepper.timeS);
    wave.out.push(system.x[top]!);
    wave.col.push(system.x[collector]!);
    wave.sec.push(system.x[secondary]!);
    wave.pri.push(system.x[primary]!);
  };
  sample();
  while (stepper.timeS < waveEndS * (1 - 1e-12)) {
    checkCancel();
    stepper.step(waveEndS);
    sample();
  }
  const rippleFromS = waveEndS - lastPeriodS;
  const ripple = windowPeakToPeak(waveT, wave.out, rippleFromS, waveEndS);
  const i0 = waveT.findIndex((x) => x >= rippleFromS);
  report(weights.run + weights.waves, true);

  let discharge: LadderRunResult['discharge'] = null;
  if (options.dischargeToV !== undefined) {
    const part = ladderPartFromDesign(design);
    const spec: LadderCircuitSpec = {
      ...part,
      // The stopped secondary: no EMF (a sine of zero amplitude has no breakpoints), its winding resistance.
      drive: {
        kind: 'sine',
        peakV: 0,
        frequencyHz: 1 / lastPeriodS,
        sourceResistanceOhm: design.drive.driver.transformer.secondaryResistanceOhm,
      },
    };
    discharge = followLadderDischarge(
      spec,
      capIndex.map((k, i) => stepper.q0[k]! / capsF[i]!),
      {
        startOutputV: system.x[top]!,
        safeVoltageV: options.dischargeToV,
        minStepS: estimatePeriodS,
        plotBuckets: buckets,
        checkCancel,
        onShare: (share) => report(weights.run + weights.waves + weights.discharge * share),
      },
    );
  }
  report(1, true);
  return {
    method: 'transient',
    start,
    isSettled,
    initialCapacitorVoltagesV: initialV,
    extrapolations,
    outputMeanV: isFixedWindow ? windowMean(t, v, Math.max(0, stepper.timeS - windowS), stepper.timeS) : finalMean,
    ripplePeakToPeakV: ripple,
    timeToSteadyStateS: reachedAtS,
    cyclesSimulated: Math.round(stepper.timeS * (frequencyHz ?? 1 / estimatePeriodS)),
    periodicSteadyState: null,
    startUp: downsampleMinMax(t, v, buckets),
    ripple: downsampleMinMax(waveT.slice(i0), wave.out.slice(i0), buckets),
    discharge,
    oscillationFrequencyHz: frequencyHz,
    energy,
    waveforms: {
      outputV: downsampleMinMax(waveT, wave.out, buckets),
      collectorV: downsampleMinMax(waveT, wave.col, buckets),
      secondaryV: downsampleMinMax(waveT, wave.sec, buckets),
      primaryA: downsampleMinMax(waveT, wave.pri, buckets),
    },
  };
}
