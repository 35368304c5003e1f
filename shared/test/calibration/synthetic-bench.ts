import { buildLadderCircuit, ladderSpecFromDesign } from '../../src/circuits/build-ladder-circuit';
import { ladderInputOf, resolveDrive } from '../../src/analysis/analyze-design';
import { analyzeLadder } from '../../src/multiplier/analyze-ladder';
import type { Design } from '../../src/designs/design.types';
import { toSpiceNetlist } from '../../src/sim/to-spice-netlist';
import { windowMean } from '../../src/sim/waveform-measures';
import type { MeasuredPoint } from '../../src/bench/bench.types';
import {
  driverDesignCircuit,
  driverPeriodGuessS,
  engineCapacitorVoltagesV,
} from '../../src/runs/driver-design-circuit';
import { WAVEFORM_SETTLE_PERIODS, type WaveformProbe } from '../../src/calibration/waveform-model';
import { TurnOnTrigger } from '../../src/sim/turn-on-events';
import { runNgspice } from '../ngspice/run-ngspice';

/**
 * Synthetic bench data for the calibration tests: ngspice (REFERENCES.md §7, an independent simulator)
 * runs the netlist our exporter writes for a design whose uncertain parameters were set to known "true"
 * values; seeded Gaussian noise stands for the instrument.
 */

/** A test design: a sine-fed four-cell half-wave ladder (values invented, Northfold scenario style). */
export const testLadder: Design = {
  schemaVersion: 1,
  name: 'Calibration test ladder',
  notes: '',
  drive: { kind: 'sine', peakV: 500, frequencyHz: 20e3, sourceResistanceOhm: 200 },
  multiplier: {
    topology: 'half-wave',
    cellCount: 4,
    capacitors: Array.from({ length: 4 }, () => ({ valueF: 10e-9, tolerance: 0.1, ratedVoltageV: 3000 })),
    diode: {
      saturationCurrentA: 1e-9,
      emissionCoefficient: 1.8,
      seriesResistanceOhm: 50,
      ratedPivV: 3000,
      ratedAverageCurrentA: 0.05,
      ratedSurgeCurrentA: 5,
    },
  },
  outputNetwork: {
    bleeder: { count: 2, valueOhm: 10e6, ratedPowerW: 0.5, limitingVoltageV: 1600 },
    seriesOutputResistanceOhm: 0,
  },
  load: { kind: 'current', currentA: 0 },
  targets: {
    outputV: 1900,
    rippleMaxV: 50,
    loadCurrentA: 100e-6,
    safeVoltageV: 50,
    dischargeRule: '60V-5s',
    spacing: { pollutionDegree: 2, materialGroup: 'IIIa', pcb: true, providedCreepageMm: 12 },
  },
};

/** Seeded standard normal deviates (mulberry32 with the Box–Muller transform). */
export function gaussian(seed: number): () => number {
  let state = seed >>> 0;
  const uniform = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

const CYCLES = 300;

/** Mean load-terminal output (V) of `design` at each load current by ngspice, over the last 20 cycles of 300. */
export async function ngspiceLoadSweep(design: Design, currentsA: readonly number[]): Promise<number[]> {
  const spec = ladderSpecFromDesign(design);
  const periodS = 1 / (design.drive.kind === 'sine' ? design.drive.frequencyHz : 1);
  const run = { stopTimeS: CYCLES * periodS, maxStepS: periodS / 100 };
  return Promise.all(
    currentsA.map(async (currentA) => {
      // Started from the engine's capacitor voltages at this load, so that ngspice settles within the run.
      const circuit = buildLadderCircuit({
        ...spec,
        load: currentA > 0 ? { kind: 'current', currentA } : null,
        initialCapacitorVoltagesV: engineCapacitorVoltages(design, currentA),
      });
      const trace = await runNgspice(toSpiceNetlist(circuit, { transient: run }), ['v(out)']);
      return Math.abs(windowMean(trace.timeS, trace.signals['v(out)']!, run.stopTimeS - 20 * periodS, run.stopTimeS));
    }),
  );
}

/** The engine's capacitor voltages (V, design order, positive) of a design at an external load current. */
function engineCapacitorVoltages(design: Design, currentA: number): number[] {
  const { drive, currentLimitA } = resolveDrive(design);
  const analysis = analyzeLadder({
    ...ladderInputOf(design, drive, currentLimitA),
    polarity: 1,
    load: { kind: 'current', currentA },
  });
  return analysis.capacitors.map((c) => c.maxVoltageV - c.swingV / 2);
}

/**
 * The output (V) of `design` switched off at t = 0 from the engine's capacitor voltages at no load, the
 * secondary shorted through the drive's source resistance, sampled at `count` times over `spanS`, by ngspice.
 */
export async function ngspiceDischarge(design: Design, spanS: number, count: number): Promise<MeasuredPoint[]> {
  const spec = ladderSpecFromDesign(design);
  const circuit = buildLadderCircuit({
    ...spec,
    load: null,
    driveOffAtS: 0,
    initialCapacitorVoltagesV: engineCapacitorVoltages(design, 0),
  });
  const trace = await runNgspice(toSpiceNetlist(circuit, { transient: { stopTimeS: spanS, maxStepS: spanS / 2000 } }), [
    'v(top)',
  ]);
  const values = trace.signals['v(top)']!;
  return Array.from({ length: count }, (_, k) => {
    const t = (k * spanS) / (count - 1);
    let i = 0;
    while (i < trace.timeS.length - 1 && trace.timeS[i + 1]! < t) i += 1;
    const t0 = trace.timeS[i]!;
    const t1 = trace.timeS[Math.min(i + 1, trace.timeS.length - 1)]!;
    const v0 = values[i]!;
    const v1 = values[Math.min(i + 1, values.length - 1)]!;
    return { x: t, y: Math.abs(t1 > t0 ? v0 + ((v1 - v0) * (t - t0)) / (t1 - t0) : v0) };
  });
}

/** Points with relative Gaussian noise of `sigma` (a fraction of each value). */
export function withNoise(xs: readonly number[], ys: readonly number[], sigma: number, seed: number): MeasuredPoint[] {
  const normal = gaussian(seed);
  return xs.map((x, i) => ({ x, y: ys[i]! * (1 + sigma * normal()) }));
}

/** The netlist ngspice runs for `ngspiceStartUp`: the empty ladder, reltol 1e-5, `periods` of the period guess. */
export function startUpNetlist(design: Design, periods: number): string {
  if (design.drive.kind !== 'driver') throw new Error('a start-up needs a driver design');
  const periodS = driverPeriodGuessS(design.drive.driver);
  const circuit = driverDesignCircuit(
    design,
    design.multiplier.capacitors.map(() => 0),
  );
  return toSpiceNetlist(circuit, {
    transient: { stopTimeS: periods * periodS, maxStepS: periodS / 200, startFrom: 'element-initial-conditions' },
    extraLines: ['.options reltol=1e-5'],
  });
}

/**
 * The push-button start-up of a driver design by ngspice (reltol 1e-5, the empty ladder, the exported
 * netlist), read as the simulator's start-up is read: the mean output over each oscillation cycle between
 * the cycle marks of the turn-on trigger (`TurnOnTrigger`), interpolated at `timesS`. The run covers `periods` of the design's
 * period guess.
 */
export async function ngspiceStartUp(design: Design, periods: number, count: number): Promise<MeasuredPoint[]> {
  if (design.drive.kind !== 'driver') throw new Error('a start-up needs a driver design');
  const driver = design.drive.driver;
  const periodS = driverPeriodGuessS(driver);
  const trace = await runNgspice(startUpNetlist(design, periods), ['v(col)', 'v(vcc)', 'i(vt1_lp_sense)', 'v(top)']);
  const t = trace.timeS;
  const top = trace.signals['v(top)']!;
  const primary = trace.signals['i(vt1_lp_sense)']!;
  const col = trace.signals['v(col)']!;
  const vcc = trace.signals['v(vcc)']!;
  const trigger = new TurnOnTrigger(driver.transformer.saturationCurrentA, 3 * periodS);
  const cycleEndS: number[] = [0];
  const cycleMeanV: number[] = [Math.abs(top[0]!)];
  let lastS = NaN;
  let area = 0;
  for (let i = 1; i < t.length; i += 1) {
    const dt = t[i]! - t[i - 1]!;
    const fired = trigger.push(t[i]!, primary[i]!, col[i]! - vcc[i]!);
    const before = Number.isNaN(fired) ? 1 : (fired - t[i - 1]!) / dt;
    const vAt = top[i - 1]! + (top[i]! - top[i - 1]!) * before;
    area += 0.5 * (top[i - 1]! + vAt) * dt * before;
    if (!Number.isNaN(fired)) {
      if (!Number.isNaN(lastS) && fired > lastS) {
        cycleEndS.push(fired);
        cycleMeanV.push(Math.abs(area / (fired - lastS)));
      }
      lastS = fired;
      area = 0.5 * (vAt + top[i]!) * dt * (1 - before);
    }
  }
  const endS = cycleEndS[cycleEndS.length - 1]!;
  return Array.from({ length: count }, (_, k) => {
    const x = ((k + 1) / count) * endS;
    let j = 0;
    while (j < cycleEndS.length - 2 && cycleEndS[j + 1]! < x) j += 1;
    const t0 = cycleEndS[j]!;
    const t1 = cycleEndS[j + 1]!;
    return { x, y: cycleMeanV[j]! + ((cycleMeanV[j + 1]! - cycleMeanV[j]!) * (x - t0)) / (t1 - t0) };
  });
}

/** Linear interpolation of a recorded trace at t (sorted times). */
function traceAt(timeS: ArrayLike<number>, values: ArrayLike<number>, t: number): number {
  let i = 0;
  while (i < timeS.length - 2 && timeS[i + 1]! < t) i += 1;
  const t0 = timeS[i]!;
  const t1 = timeS[i + 1]!;
  return t1 > t0 ? values[i]! + ((values[i + 1]! - values[i]!) * (t - t0)) / (t1 - t0) : values[i]!;
}

/**
 * A scope capture of a driver design in steady state by ngspice (reltol 1e-5, the exported netlist): the
 * ladder starts at the engine's steady-state voltages, the run settles WAVEFORM_SETTLE_PERIODS of the
 * design's period guess, and the capture begins `delayS` later (where the scope happened to trigger) and
 * spans `spanS` in `count` samples, the scope's time axis centred on the capture (x from −span/2).
 */
export async function ngspiceWaveform(
  design: Design,
  probe: WaveformProbe,
  spanS: number,
  count: number,
  delayS: number,
): Promise<MeasuredPoint[]> {
  if (design.drive.kind !== 'driver') throw new Error('a waveform needs a driver design');
  const periodS = driverPeriodGuessS(design.drive.driver);
  const circuit = driverDesignCircuit(design, engineCapacitorVoltagesV(design));
  const fromS = WAVEFORM_SETTLE_PERIODS * periodS + delayS;
  const netlist = toSpiceNetlist(circuit, {
    transient: { stopTimeS: fromS + spanS, maxStepS: periodS / 2000, startFrom: 'element-initial-conditions' },
    extraLines: ['.options reltol=1e-5'],
  });
  const signal = probe === 'collector' ? 'v(col)' : 'v(s)';
  const trace = await runNgspice(netlist, [signal]);
  return Array.from({ length: count }, (_, k) => {
    const offsetS = (k * spanS) / (count - 1);
    return { x: offsetS - spanS / 2, y: traceAt(trace.timeS, trace.signals[signal]!, fromS + offsetS) };
  });
}

/** Points with Gaussian noise of `sigma` times the largest |y| (a scope's noise is a share of its range). */
export function withRangeNoise(points: readonly MeasuredPoint[], sigma: number, seed: number): MeasuredPoint[] {
  const normal = gaussian(seed);
  const range = Math.max(...points.map((p) => Math.abs(p.y)));
  return points.map((p) => ({ x: p.x, y: p.y + sigma * range * normal() }));
}
