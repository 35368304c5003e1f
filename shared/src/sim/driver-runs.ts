import { estimateBlockingOscillator } from '../driver/blocking-oscillator';
import { DRIVER_NODES } from '../driver/build-driver-circuit';
import type { Design } from '../designs/design.types';
import { DomainError } from '../errors';
import { LADDER_NODES } from './build-circuit';
import { buildCircuit } from './design-circuit';
import type { LadderRunResult } from './design-runs';
import { EnergyMeter, type EnergyAccount } from './energy-meter';
import { MnaSystem } from './mna-system';
import { SampleBuffer, TransientStepper } from './transient';
import { downsampleMinMax, risingCrossings, windowPeakToPeak } from './waveform-measures';

export interface DriverRunOptions {
  /** Maximum time step; default 1/200 of the estimated oscillation period. */
  maxStepS?: number;
  /** Give up settling after this many estimated oscillation periods; default 20000. */
  maxCycles?: number;
  plotBuckets?: number;
  onProgress?: (fraction: number) => void;
  shouldCancel?: () => boolean;
}

export interface DriverRunResult extends LadderRunResult {
  /** Mean oscillation frequency over the last window, from the collector's rising crossings of the supply. */
  oscillationFrequencyHz: number | null;
  /** Energy drawn from the supply, dissipated per element and stored, over the whole run. */
  energy: EnergyAccount;
}

/**
 * Start-up of a design driven by its blocking oscillator (a driver drive): transient of the transistor
 * stage, transformer and ladder from a cold supply, in windows of 50 estimated oscillation periods, until
 * the output's window mean moves by less than 0.1 % twice in a row. A self-oscillating circuit has no
 * period known in advance, so there is no shooting here: method 'transient'. Ripple is the peak-to-peak
 * of the ladder top over the last measured oscillation period. Volts, seconds, joules.
 */
export function runDriverDesign(design: Design, options: DriverRunOptions = {}): DriverRunResult {
  if (design.drive.kind !== 'driver') throw new DomainError('invalid_design', 'runDriverDesign needs a driver drive', 'drive.kind');
  const estimatePeriodS = 1 / estimateBlockingOscillator(design.drive.driver).frequencyHz.value;
  const circuit = buildCircuit(design);
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, { maxStepS: options.maxStepS ?? estimatePeriodS / 200 });
  stepper.startFromCharges(system.initialCharge);
  const meter = new EnergyMeter(circuit, system);
  meter.record(0);
  const top = system.probeIndex(LADDER_NODES.ladderTop);
  const collector = system.probeIndex(DRIVER_NODES.collector);
  const supply = system.probeIndex(DRIVER_NODES.supply);
  const windowS = 50 * estimatePeriodS;
  const maxTimeS = (options.maxCycles ?? 20000) * estimatePeriodS;
  const time = new SampleBuffer();
  const topV = new SampleBuffer();
  const means: number[] = [];
  let windowCol = { time: new SampleBuffer(), values: new SampleBuffer() };
  let settledCount = 0;
  let area = 0;
  let previousT = 0;
  let previousV = 0;
  while (stepper.timeS < maxTimeS * (1 - 1e-12) && settledCount < 2) {
    const end = (means.length + 1) * windowS;
    windowCol = { time: new SampleBuffer(), values: new SampleBuffer() };
    while (stepper.timeS < end * (1 - 1e-12)) {
      if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The run was cancelled');
      stepper.step(end);
      meter.record(stepper.timeS);
      const v = system.x[top]!;
      area += 0.5 * (v + previousV) * (stepper.timeS - previousT);
      previousT = stepper.timeS;
      previousV = v;
      time.push(stepper.timeS);
      topV.push(v);
      windowCol.time.push(stepper.timeS);
      windowCol.values.push(system.x[collector]! - system.x[supply]!);
    }
    const mean = area / windowS;
    area = 0;
    const before = means[means.length - 1];
    means.push(mean);
    settledCount = before !== undefined && Math.abs(mean - before) <= 1e-3 * Math.abs(mean) ? settledCount + 1 : 0;
    options.onProgress?.(Math.min(1, stepper.timeS / maxTimeS));
  }
  const finalMean = means[means.length - 1]!;
  const firstAt = means.findIndex((m) => Math.abs(m) >= 0.9 * Math.abs(finalMean));
  const crossings = risingCrossings(windowCol.time.toArray(), windowCol.values.toArray(), 0);
  const frequencyHz = crossings.length >= 3 ? (crossings.length - 1) / (crossings[crossings.length - 1]! - crossings[0]!) : null;
  const t = time.toArray();
  const v = topV.toArray();
  const lastPeriodS = frequencyHz ? 1 / frequencyHz : estimatePeriodS;
  const ripple = windowPeakToPeak(t, v, stepper.timeS - lastPeriodS, stepper.timeS);
  const buckets = options.plotBuckets ?? 400;
  const i0 = t.findIndex((x) => x >= stepper.timeS - lastPeriodS);
  return {
    method: 'transient',
    outputMeanV: finalMean,
    ripplePeakToPeakV: ripple,
    timeToSteadyStateS: firstAt >= 0 ? (firstAt + 1) * windowS : null,
    cyclesSimulated: Math.round(stepper.timeS * (frequencyHz ?? 1 / estimatePeriodS)),
    periodicSteadyState: null,
    startUp: downsampleMinMax(t, v, buckets),
    ripple: downsampleMinMax(t.subarray(i0), v.subarray(i0), buckets),
    discharge: null,
    oscillationFrequencyHz: frequencyHz,
    energy: meter.account(),
  };
}
