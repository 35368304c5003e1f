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

/** The flyback's reflected voltage over the supply below which the estimate does not claim its bounds with a ladder. */
export const MIN_REFLECTED_TO_SUPPLY = 8;
/** The largest step-up (Ns/Np) the estimate was calibrated at with a ladder. */
export const MAX_CALIBRATED_TURNS_RATIO = 80;

/**
 * Where the closed-form estimate agrees with our simulator, and where it does not. Bare stages
 * (shared/test/driver/oscillator-estimate-vs-simulator.test.ts, base-limited, 2.4–12 V): primary peak within
 * 5 %, frequency within 10 %. With a ladder (estimate-calibration.test.ts, the ring-back after each flyback
 * in the estimate): frequency within 10 % and output within 5 % on base-limited stages with a zener clamp,
 * step-up up to 1:80 and the flyback reflected at least 8× the supply. Outside that region the figure says
 * why and asks for a simulation: nearer the supply the forward pulse's ringing with the leakage inductance
 * sets the ladder's forward peak and the transistor's turn-on in the ring-back moves; past the core's
 * saturation the current depends on the knee's shape; an RCD clamp's level follows the simulation within 6 %
 * (shared/test/ngspice/rcd-clamp-level-vs-ngspice.test.ts) but the flyback power it takes from the ladder is only
 * roughly modelled (output 2–8 % high on those designs); a turn-off current above half of V/R makes the on-time hang on the exact turn-off point.
 */
export function estimateValidity(
  driver: DriverStage,
  estimate: BlockingOscillatorEstimate,
  options: { feedsLadder: boolean },
): EstimateValidity {
  const reasons: string[] = [];
  const tx = driver.transformer;
  if (options.feedsLadder) {
    const reflectedRatio = estimate.reflectedVoltageV.value / estimate.supplyVoltageV.value;
    if (reflectedRatio < MIN_REFLECTED_TO_SUPPLY) {
      reasons.push(
        `the flyback reflects ${reflectedRatio.toFixed(1)}× the supply, under ${MIN_REFLECTED_TO_SUPPLY}×: the forward pulse’s ringing sets the ladder’s forward peak`,
      );
    }
    const turnsRatio = tx.secondaryTurns / tx.primaryTurns;
    if (turnsRatio > MAX_CALIBRATED_TURNS_RATIO) {
      reasons.push(
        `a step-up of 1:${turnsRatio.toFixed(0)}, beyond the 1:${MAX_CALIBRATED_TURNS_RATIO} it was calibrated at: the ladder’s capacitance reflected by its square dominates the ring-back`,
      );
    }
    if (driver.clamp?.kind === 'rcd') {
      reasons.push(
        'an RCD clamp: its level (from its resistor and capacitor) is within 6 % of the simulation, but the flyback it leaves the ladder is not calibrated (output up to 8 % high)',
      );
    }
  }
  if (estimate.onTimeLimit === 'saturation') {
    reasons.push('the core saturates before the turn-off point: the peak current depends on the shape of its knee');
  }
  const seriesOhm = tx.primaryResistanceOhm + (driver.collectorResistorOhm ?? 0);
  const finalA = seriesOhm > 0 ? (estimate.supplyVoltageV.value - driver.transistor.vceSatV) / seriesOhm : Infinity;
  if (estimate.collectorPeakCurrentA.value > 0.5 * finalA) {
    reasons.push('the turn-off current is above half of V/R: the on-time hangs on the exact turn-off point');
  }
  return {
    isWithinValidity: reasons.length === 0,
    reasons,
    basis: options.feedsLadder
      ? `our simulator with the ladder, base-limited stages with a zener clamp, step-up to 1:${MAX_CALIBRATED_TURNS_RATIO}, flyback reflected ≥ ${MIN_REFLECTED_TO_SUPPLY}× the supply: frequency within 10 %, output within 5 % (shared/test/driver/estimate-calibration.test.ts)`
      : 'our simulator on bare base-limited stages, 2.4–12 V: primary peak within 5 %, frequency within 10 % (shared/test/driver)',
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
