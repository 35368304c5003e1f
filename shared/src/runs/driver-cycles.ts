import { EnergyMeter } from '../sim/energy-meter';
import { oscillationFigures } from '../sim/oscillation-measures';
import { driverFigures, type DriverWaveSamples } from './driver-figures';
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

/**
 * Whole oscillation cycles at full resolution: output, collector, secondary, primary current, from one
 * cycle mark of the turn-on trigger (a turn-on's conduction ending, turn-on-events.ts) to the `cyclesWanted`-th after it, with their own energy account; gives up after three times the
 * longer of `lastPeriodS` and the estimated period per wanted cycle (plus two).
 */
export function recordDriverCycles(frame: DriverRunFrame, cyclesWanted: number, lastPeriodS: number): DriverCycles {
  const { circuit, system, stepper, probes, estimatePeriodS, checkCancel } = frame;
  const giveUpS = stepper.timeS + (cyclesWanted + 2) * 3 * Math.max(lastPeriodS, estimatePeriodS);
  const waveT: number[] = [];
  const wave: DriverWaveSamples = { out: [], col: [], sec: [], pri: [], vcc: [] };
  let cycleMeter: EnergyMeter | null = null;
  let cycleFromS = NaN;
  let cyclesSeen = -1;
  while (cyclesSeen < cyclesWanted && stepper.timeS < giveUpS) {
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
