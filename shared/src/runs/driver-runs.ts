import type { BenchLossKind } from '../driver/driver-report';
import { estimateBlockingOscillator } from '../driver/blocking-oscillator';
import { DRIVER_NODES, buildDriverCircuit } from '../circuits/build-driver-circuit';
import type { DriverStage } from '../designs/driver-stage.types';
import { supplyThevenin } from '../driver/battery';
import type { Design } from '../designs/design.types';
import { DomainError, isDomainError } from '../errors';
import { analyzeDesign } from '../analysis/analyze-design';
import {
  capacitorName,
  LADDER_NODES,
  ladderPartFromDesign,
  type LadderCircuitSpec,
} from '../circuits/build-ladder-circuit';
import type { Circuit, CircuitElement } from '../sim/circuit.types';
import { followLadderDischarge, type LadderRunResult, type PlotTrace } from './ladder-runs';
import { EnergyMeter, type EnergyAccount } from '../sim/energy-meter';
import { MnaSystem } from '../sim/mna-system';
import { SampleBuffer } from '../sim/sample-buffer';
import { TransientStepper } from '../sim/transient';
import { oscillationFigures, readSettlingTimes, TurnOnTrigger } from '../sim/oscillation-measures';
import { downsampleMinMax, windowExtremes, windowMean } from '../sim/waveform-measures';
import { withEffectiveTransformer } from '../transformer/given-numbers';

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

/** Loss kinds of a driver circuit's elements (see lossKindOf), W each in DriverFigures.lossesW; the estimate groups its losses the same way. */
export type DriverLossKind = BenchLossKind;

/** Bench figures over whole oscillation cycles at the end of a run (SI units; efficiency 0–1). */
export interface DriverFigures {
  cycles: number;
  oscillationFrequencyHz: number;
  dutyOnFraction: number;
  primaryCurrentPeakA: number;
  collectorVoltagePeakV: number;
  secondaryVoltagePeakPositiveV: number;
  secondaryVoltagePeakNegativeV: number;
  inputPowerW: number;
  /** Power into the load at the output terminal (the bleeder and output resistor are losses). */
  outputPowerW: number;
  efficiency: number;
  lossesW: Partial<Record<DriverLossKind, number>>;
}

export interface DriverRunResult extends LadderRunResult {
  start: 'warm' | 'cold';
  /** Why a warm start fell back to a cold one (the engine's estimate failed), else null. */
  warmStartFallback: string | null;
  /** Figures over whole cycles of the final waveforms; null when fewer than one whole cycle was seen. */
  figures: DriverFigures | null;
  /** Whether the settling criterion was met (false: a fixed window, or the cycle budget ran out). */
  isSettled: boolean;
  /** Capacitor voltages the run started from (design order), V. */
  initialCapacitorVoltagesV: number[];
  /** How often the slow charging mode was extrapolated (see runDriverDesign). */
  extrapolations: number;
  /** Oscillation frequency over whole cycles of the final waveforms, from the transistor's turn-on events. */
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
export function engineCapacitorVoltagesV(givenDesign: Design): number[] {
  const design = withEffectiveTransformer(givenDesign);
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
export function driverDesignCircuit(givenDesign: Design, initialCapacitorVoltagesV: ReadonlyArray<number>): Circuit {
  const design = withEffectiveTransformer(givenDesign);
  if (design.drive.kind !== 'driver') throw new DomainError('invalid_design', 'needs a driver drive', 'drive.kind');
  return buildDriverCircuit(design.drive.driver, {
    ladder: { ...ladderPartFromDesign(design), initialCapacitorVoltagesV },
  });
}

/**
 * A first guess of the oscillation period (s), for step sizes and time-outs: the engine's estimate, or
 * when that refuses the design, twice the time the primary current takes to ramp to the core's saturation
 * current from the supply's open-circuit voltage (ramp and an equal flyback).
 */
export function driverPeriodGuessS(driver: DriverStage): number {
  try {
    const f = estimateBlockingOscillator(driver).frequencyHz.value;
    if (f > 0 && Number.isFinite(f)) return 1 / f;
  } catch (error) {
    if (!isDomainError(error)) throw error;
  }
  const { openCircuitV } = supplyThevenin(driver.supply, 1);
  return (
    (2 * driver.transformer.primaryInductanceH * driver.transformer.saturationCurrentA) / Math.max(openCircuitV, 1e-3)
  );
}

/** Loss kind of a driver circuit element by its name (build-driver-circuit.ts, build-circuit.ts); null for the load. */
export function lossKindOf(element: CircuitElement): DriverLossKind | null {
  const name = element.name;
  if (name === 'Rload' || name === 'Iload') return null;
  if (element.kind === 'npn') return 'transistor';
  if (element.kind === 'coupled-inductors' || element.kind === 'inductor') return 'windingCopper';
  if (name === 'Dz' || name === 'Dc' || name === 'Rclp') return 'clamp';
  if (name === 'Rsn') return 'snubber';
  if (name === 'Rb') return 'baseResistor';
  if (name === 'Rcol') return 'collectorResistor';
  if (name === 'Rsrc') return 'supplyResistance';
  if (name === 'Rbleed') return 'bleeder';
  if (name === 'Rout') return 'outputResistor';
  if (name === 'Ilamp') return 'indicatorLamp';
  if (element.kind === 'diode') return 'ladderDiodes';
  return 'other';
}

/** Bench figures of whole cycles (oscillation-measures.ts) with the power account of the same span. */
function driverFigures(
  circuit: Circuit,
  timeS: ReadonlyArray<number>,
  wave: { out: number[]; col: number[]; sec: number[]; pri: number[]; vcc: number[] },
  energy: EnergyAccount,
  spanS: number,
): DriverFigures | null {
  const osc = oscillationFigures(
    timeS,
    wave.pri,
    wave.col.map((v, i) => v - wave.vcc[i]!),
    wave.out,
  );
  if (!osc || !(spanS > 0)) return null;
  const col = windowExtremes(timeS, wave.col, osc.fromS, osc.toS);
  const sec = windowExtremes(timeS, wave.sec, osc.fromS, osc.toS);
  const lossesW: Partial<Record<DriverLossKind, number>> = {};
  let outputJ = 0;
  for (const e of circuit.elements) {
    const j = energy.dissipatedJ[e.name];
    if (j === undefined) continue;
    const kind = lossKindOf(e);
    if (kind === null) outputJ += j;
    else lossesW[kind] = (lossesW[kind] ?? 0) + j / spanS;
  }
  const inputPowerW = energy.suppliedJ / spanS;
  const outputPowerW = outputJ / spanS;
  return {
    cycles: osc.cycles,
    oscillationFrequencyHz: osc.frequencyHz,
    dutyOnFraction: osc.dutyOnFraction,
    primaryCurrentPeakA: osc.primaryCurrentPeakA,
    collectorVoltagePeakV: col.max,
    secondaryVoltagePeakPositiveV: sec.max,
    secondaryVoltagePeakNegativeV: sec.min,
    inputPowerW,
    outputPowerW,
    efficiency: inputPowerW > 0 ? outputPowerW / inputPowerW : 0,
    lossesW,
  };
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
export function runDriverDesign(givenDesign: Design, options: DriverRunOptions = {}): DriverRunResult {
  const design = withEffectiveTransformer(givenDesign);
  if (design.drive.kind !== 'driver')
    throw new DomainError('invalid_design', 'runDriverDesign needs a driver drive', 'drive.kind');
  let start = options.start ?? 'warm';
  const estimatePeriodS = driverPeriodGuessS(design.drive.driver);
  const capsF = design.multiplier.capacitors.map((c) => c.valueF);
  let initialV = capsF.map(() => 0);
  let warmStartFallback: string | null = null;
  if (start === 'warm') {
    // The engine may refuse a design that the circuit runs (its closed form has limits): start cold then.
    try {
      initialV = engineCapacitorVoltagesV(design);
    } catch (error) {
      if (!isDomainError(error) || error.code === 'cancelled') throw error;
      warmStartFallback = `the engine's steady-state estimate failed (${error.message}); started cold`;
      start = 'cold';
    }
  }
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
  const means: number[] = [];
  let capMeans: number[][] = [];
  let sinceJump = 0;
  let extrapolations = 0;
  let isSettled = false;
  let firstProjection: number | null = null;
  let reachedAtS: number | null = null;
  let prevT = 0;
  let prevV = system.x[top]!;
  const trigger = new TurnOnTrigger(design.drive.driver.transformer.saturationCurrentA, 3 * estimatePeriodS);
  let lastTurnOnS = NaN;
  let windowFirstTurnOnS: number;
  let windowTurnOns: number;
  let lastWindowFrequencyHz: number | null = null;
  let windowIndex = 0;
  let windowStartS = 0;
  let area = 0;
  let capArea = capsF.map(() => 0);
  const ratios: number[] = [];
  let slowestRatio = 0;
  while (stepper.timeS < maxTimeS * (1 - 1e-12) && !isSettled) {
    windowIndex++;
    const end = Math.min(windowIndex * windowS, maxTimeS);
    windowFirstTurnOnS = NaN;
    windowTurnOns = 0;
    // A window closes at the first turn-on of the transistor after `end` (see oscillation-measures.ts), so
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
      const dt = stepper.timeS - prevT;
      const fired = trigger.push(stepper.timeS, system.x[primary]!, system.x[collector]! - system.x[supply]!);
      if (!Number.isNaN(fired)) {
        lastTurnOnS = fired;
        if (Number.isNaN(windowFirstTurnOnS)) windowFirstTurnOnS = fired;
        else windowTurnOns++;
      }
      const isCrossing = stepper.timeS >= end * (1 - 1e-12) && !Number.isNaN(fired) && !isFixedWindow;
      // Fraction of this step before the turn-on (interpolated by the trigger).
      const before = isCrossing ? (fired - prevT) / dt : 1;
      const vAt = prevV + (v - prevV) * before;
      area += 0.5 * (vAt + prevV) * dt * before;
      capIndex.forEach((k, i) => {
        capArea[i]! += (stepper.q0[k]! / capsF[i]!) * dt * before;
      });
      time.push(stepper.timeS);
      topV.push(v);
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
    }
    if (windowTurnOns > 0) lastWindowFrequencyHz = windowTurnOns / (lastTurnOnS - windowFirstTurnOnS);
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
  if (start === 'cold' && isSettled) {
    // Window means at their closing times; 90 % of the settled mean, interpolated (never the window length).
    const closes = means.map((_, i) => Math.min((i + 1) * windowS, maxTimeS));
    reachedAtS = readSettlingTimes(closes, means, finalMean).to90S;
  }
  const energy = meter.account();
  const t = time.toArray();
  const v = topV.toArray();
  report(weights.run, true);

  // Whole oscillation cycles at full resolution: output, collector, secondary, primary current, from one
  // turn-on to the `waveformPeriods`-th after it, with their own energy account.
  const cyclesWanted = options.waveformPeriods ?? 4;
  const lastPeriodS = lastWindowFrequencyHz ? 1 / lastWindowFrequencyHz : estimatePeriodS;
  const giveUpS = stepper.timeS + (cyclesWanted + 2) * 3 * Math.max(lastPeriodS, estimatePeriodS);
  const waveT: number[] = [];
  const wave = {
    out: [] as number[],
    col: [] as number[],
    sec: [] as number[],
    pri: [] as number[],
    vcc: [] as number[],
  };
  const sample = (): void => {
    waveT.push(stepper.timeS);
    wave.vcc.push(system.x[supply]!);
    wave.out.push(system.x[top]!);
    wave.col.push(system.x[collector]!);
    wave.sec.push(system.x[secondary]!);
    wave.pri.push(system.x[primary]!);
  };
  let cycleMeter: EnergyMeter | null = null;
  let cycleFromS = NaN;
  let cyclesSeen = -1;
  while (cyclesSeen < cyclesWanted && stepper.timeS < giveUpS) {
    checkCancel();
    stepper.step();
    if (cycleMeter) cycleMeter.record(stepper.timeS);
    sample();
    if (Number.isNaN(trigger.push(stepper.timeS, system.x[primary]!, system.x[collector]! - system.x[supply]!)))
      continue;
    cyclesSeen++;
    if (cyclesSeen === 0) {
      cycleMeter = new EnergyMeter(circuit, system);
      cycleMeter.record(stepper.timeS);
      cycleFromS = stepper.timeS;
    }
  }
  const figures =
    cycleMeter && cyclesSeen > 0
      ? driverFigures(circuit, waveT, wave, cycleMeter.account(), stepper.timeS - cycleFromS)
      : null;
  const frequencyHz = figures?.oscillationFrequencyHz ?? null;
  const measured = oscillationFigures(
    waveT,
    wave.pri,
    wave.col.map((v, i) => v - wave.vcc[i]!),
    wave.out,
  );
  const ripple = measured?.ripplePeakToPeak ?? Math.max(...wave.out) - Math.min(...wave.out);
  const i0 = measured ? waveT.findIndex((x) => x >= measured.toS - 1 / measured.frequencyHz) : 0;
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
    warmStartFallback,
    figures,
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
