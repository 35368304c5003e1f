import { EnergyMeter } from '../sim/energy-meter';
import { oscillationFigures } from '../sim/oscillation-measures';
import { driverFigures, driverPowers, type DriverWaveSamples } from './driver-figures';
import { pushTurnOn, type DriverRunFrame } from './driver-run-frame';
import type { DriverFigures } from './driver-run.types';

/** Whole oscillation cycles recorded at the end of a driver run. */
export interface DriverCycles {
  /** Time of every step recorded, s. */
  timeS: number[];
  wave: DriverWaveSamples;
  /** Bench figures over the whole cycles, null when fewer than one whole cycle was seen. */
  figures: DriverFigures | null;
  /** Peak-to-peak ripple of the output over the last whole cycle (over all samples when none was measured), V. */
  ripplePeakToPeakV: number;
  /** Index of the first sample of the last whole cycle (0 when none was measured). */
  lastCycleFrom: number;
}

/** The most whole cycles an irregular oscillation is measured over (a bound of the domain: 2.5 % of a run's default budget). */
export const IRREGULAR_MAX_CYCLES = 512;
/** An irregular oscillation is measured over at least this many whole cycles (several bursts). */
export const IRREGULAR_MIN_CYCLES = 32;
/** An irregular oscillation's mean frequency is stable once a doubling of the cycles counted moves it by less than this. */
export const IRREGULAR_STABLE_FRACTION = 0.01;

/**
 * Whole oscillation cycles at full resolution: output, collector, secondary, primary current, from one
 * cycle mark of the turn-on trigger (a turn-on's conduction ending, turn-on-events.ts) to the `cyclesWanted`-th
 * after it, with their own energy account; gives up after three times the longer of `lastPeriodS` and the
 * estimated period per wanted cycle (plus two). When those cycles are irregular (bursts), the run goes on
 * counting the trigger's cycles (extendIrregular) and the frequency, powers and peaks are taken over all of them.
 */
export function recordDriverCycles(frame: DriverRunFrame, cyclesWanted: number, lastPeriodS: number): DriverCycles {
  const { circuit, system, stepper, probes, estimatePeriodS, checkCancel } = frame;
  const periodS = Math.max(lastPeriodS, estimatePeriodS);
  const giveUpS = stepper.timeS + (cyclesWanted + 2) * 3 * periodS;
  const waveT: number[] = [];
  const wave: DriverWaveSamples = { out: [], col: [], sec: [], pri: [], vcc: [] };
  let cycleMeter: EnergyMeter | null = null;
  const marksS: number[] = [];
  while (marksS.length <= cyclesWanted && stepper.timeS < giveUpS) {
    checkCancel();
    stepper.step();
    if (cycleMeter) cycleMeter.record(stepper.timeS);
    waveT.push(stepper.timeS);
    wave.vcc.push(system.x[probes.supply]!);
    wave.out.push(system.x[probes.top]!);
    wave.col.push(system.x[probes.collector]!);
    wave.sec.push(system.x[probes.secondary]!);
    wave.pri.push(system.x[probes.primary]!);
    if (Number.isNaN(pushTurnOn(frame))) continue;
    marksS.push(stepper.timeS);
    if (marksS.length === 1) {
      cycleMeter = new EnergyMeter(circuit, system);
      cycleMeter.record(stepper.timeS);
    }
  }
  const short =
    cycleMeter && marksS.length > 1
      ? driverFigures(circuit, waveT, wave, cycleMeter.account(), stepper.timeS - marksS[0]!)
      : null;
  const figures = short?.isIrregular && cycleMeter ? extendIrregular(frame, short, cycleMeter, marksS, periodS) : short;
  const measured = oscillationFigures(
    waveT,
    wave.pri,
    wave.col.map((v, i) => v - wave.vcc[i]!),
    wave.out,
  );
  return {
    timeS: waveT,
    wave,
    figures,
    ripplePeakToPeakV: measured?.ripplePeakToPeak ?? Math.max(...wave.out) - Math.min(...wave.out),
    lastCycleFrom: measured ? waveT.findIndex((x) => x >= measured.toS - 1 / measured.frequencyHz) : 0,
  };
}

/**
 * An irregular oscillation measured over enough cycles: the run goes on, the trigger's cycle marks counted
 * (each the end of a turn-on's conduction, so one phase of every cycle), until the mean frequency over all the
 * marks moves by less than IRREGULAR_STABLE_FRACTION between one doubling of the count and the next (over at
 * least IRREGULAR_MIN_CYCLES), or
 * IRREGULAR_MAX_CYCLES, or three estimated periods per cycle. The figures of the recorded cycles (`short`) then
 * take that mean, its cycle count and span, the powers and losses of the whole span (`meter`, running since the
 * first mark) and the peaks seen over it; the duty stays the recorded cycles'.
 */
function extendIrregular(
  frame: DriverRunFrame,
  short: DriverFigures,
  meter: EnergyMeter,
  marksS: number[],
  periodS: number,
): DriverFigures {
  const { circuit, system, stepper, probes, checkCancel } = frame;
  const meanHz = (): number => (marksS.length - 1) / (marksS.at(-1)! - marksS[0]!);
  const giveUpS = marksS[0]! + 3 * IRREGULAR_MAX_CYCLES * periodS;
  const peaks = {
    primaryA: short.primaryCurrentPeakA,
    collectorV: short.collectorVoltagePeakV,
    secondaryMaxV: short.secondaryVoltagePeakPositiveV,
    secondaryMinV: short.secondaryVoltagePeakNegativeV,
  };
  let checkAt = 2 * (marksS.length - 1);
  let lastHz = meanHz();
  while (marksS.length - 1 < IRREGULAR_MAX_CYCLES && stepper.timeS < giveUpS) {
    checkCancel();
    stepper.step();
    meter.record(stepper.timeS);
    const col = system.x[probes.collector]!;
    if (col < system.x[probes.supply]!) peaks.primaryA = Math.max(peaks.primaryA, system.x[probes.primary]!);
    peaks.collectorV = Math.max(peaks.collectorV, col);
    peaks.secondaryMaxV = Math.max(peaks.secondaryMaxV, system.x[probes.secondary]!);
    peaks.secondaryMinV = Math.min(peaks.secondaryMinV, system.x[probes.secondary]!);
    if (Number.isNaN(pushTurnOn(frame))) continue;
    marksS.push(stepper.timeS);
    if (marksS.length - 1 < checkAt) continue;
    const hz = meanHz();
    const isStable = Math.abs(hz - lastHz) <= IRREGULAR_STABLE_FRACTION * hz;
    lastHz = hz;
    checkAt *= 2;
    if (isStable && marksS.length - 1 >= IRREGULAR_MIN_CYCLES) break;
  }
  const spanS = marksS.at(-1)! - marksS[0]!;
  const whole = driverPowers(circuit, meter.account(), stepper.timeS - marksS[0]!);
  return {
    ...short,
    ...whole,
    cycles: marksS.length - 1,
    oscillationFrequencyHz: (marksS.length - 1) / spanS,
    measuredFromS: marksS[0]!,
    measuredToS: marksS.at(-1)!,
    primaryCurrentPeakA: peaks.primaryA,
    collectorVoltagePeakV: peaks.collectorV,
    secondaryVoltagePeakPositiveV: peaks.secondaryMaxV,
    secondaryVoltagePeakNegativeV: peaks.secondaryMinV,
  };
}
