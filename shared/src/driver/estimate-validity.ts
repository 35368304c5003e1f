import type { DriverStage } from '../designs/driver-stage.types';
import type { BlockingOscillatorEstimate } from './blocking-oscillator.types';
import type { DriverBenchFigures } from './driver-report';

/** Whether the instant estimate may stand for the simulation, and why not. */
export interface EstimateValidity {
  /** True where the calibration against the simulator holds (frequency within 10 %, output within 5 %). */
  isWithinValidity: boolean;
  /** Each reason the design lies outside, in words for the figure. */
  reasons: string[];
  /** What the estimate was checked against, and how closely. */
  basis: string;
}

/** Frequency and output bounds of the estimate's validity against the simulation (fractions). */
export const ESTIMATE_VALIDITY_BOUNDS = { frequency: 0.1, output: 0.05 } as const;

/**
 * Where the closed-form estimate agrees with our simulator (shared/test/driver: bare stages, base-limited,
 * 2.4–12 V: peak within 5 %, frequency within 10 %), and where it does not: with a ladder on the secondary the
 * collector rings down after each flyback and the forward pulse trades charge with the ladder, so the next
 * ramp starts from a negative magnetizing current and the period runs longer than the closed form (the demo
 * handheld tester with 220 pF cells: frequency 31 % high, output 7 % low); a turn-off current above half of
 * V/R makes the on-time hang on the exact turn-off point; past the core's saturation the current depends on
 * the knee's shape. Outside, the figure says so and asks for a simulation.
 */
export function estimateValidity(
  driver: DriverStage,
  estimate: BlockingOscillatorEstimate,
  options: { feedsLadder: boolean },
): EstimateValidity {
  const reasons: string[] = [];
  if (options.feedsLadder) {
    reasons.push(
      'a ladder on the secondary: the ring-down after each flyback and the forward pulse’s exchange with the ladder lengthen the period beyond the closed form',
    );
  }
  if (estimate.onTimeLimit === 'saturation') {
    reasons.push('the core saturates before the turn-off point: the peak current depends on the shape of its knee');
  }
  const seriesOhm = driver.transformer.primaryResistanceOhm + (driver.collectorResistorOhm ?? 0);
  const finalA = seriesOhm > 0 ? (estimate.supplyVoltageV.value - driver.transistor.vceSatV) / seriesOhm : Infinity;
  if (estimate.collectorPeakCurrentA.value > 0.5 * finalA) {
    reasons.push('the turn-off current is above half of V/R: the on-time hangs on the exact turn-off point');
  }
  return {
    isWithinValidity: reasons.length === 0,
    reasons,
    basis:
      'our simulator on bare base-limited stages, 2.4–12 V: primary peak within 5 %, frequency within 10 % (shared/test/driver)',
  };
}

/** One figure of the estimate beside the simulation's, with their difference. */
export interface FigureComparison {
  field: keyof DriverBenchFigures | 'outputMeanV';
  estimate: number;
  simulation: number;
  /** (estimate − simulation)/|simulation|; null when the simulation's figure is zero. */
  difference: number | null;
}

const COMPARED_FIELDS = [
  'oscillationFrequencyHz',
  'dutyOnFraction',
  'primaryCurrentPeakA',
  'collectorVoltagePeakV',
  'secondaryVoltagePeakPositiveV',
  'secondaryVoltagePeakNegativeV',
  'inputPowerW',
  'outputPowerW',
  'efficiency',
] as const;

/**
 * The estimate's figures beside a simulation's of the same revision (same field names), each with its
 * relative difference: what the Workbench and the spec sheet show where both exist.
 */
export function compareWithSimulation(
  estimate: DriverBenchFigures & { outputMeanV: number },
  simulation: Pick<DriverBenchFigures, (typeof COMPARED_FIELDS)[number]> & { outputMeanV: number },
): FigureComparison[] {
  return (['outputMeanV', ...COMPARED_FIELDS] as const).map((field) => {
    const e = estimate[field];
    const s = simulation[field];
    return { field, estimate: e, simulation: s, difference: s !== 0 ? (e - s) / Math.abs(s) : null };
  });
}
