import type { BleederString, MultiplierSpec } from '../designs/design.types';
import { deratedVerdict } from '../safety/hazard-limits';
import type { CheckVerdict } from '../safety/check.types';
import type { LadderAnalysis } from './ladder.types';

/** Derating factors (common practice, no source): the part is used at no more than this share of its rating. */
export const DERATING = {
  capacitorVoltage: 0.8,
  diodePiv: 0.8,
  diodeAverageCurrent: 0.8,
  diodeSurgeCurrent: 1,
  resistorVoltage: 0.8,
  resistorPower: 0.5,
} as const;

/** Ids of the part checks, as the Checks panel and the spec sheet look them up (capacitors and diodes 1-based). */
export const STRESS_CHECK_IDS = {
  capacitorVoltage: (index: number): string => `cap-voltage-c${index}`,
  diodePiv: (index: number): string => `diode-piv-d${index}`,
  bleederVoltage: 'bleeder-voltage',
  bleederPower: 'bleeder-power',
  /** The first resistor's check in reports stored by engines that checked each bleeder resistor. */
  bleederVoltageFirstResistor: 'bleeder-voltage-r1',
} as const;

const ratingRule = (what: string, factor: number): string =>
  `${what} against rating × ${factor} (derating, common practice, no source): pass at or below the derated figure, marginal up to the rating, fail above it`;

/** Capacitor voltage and diode PIV / average / surge current verdicts for every part of the ladder. */
export function ladderStressChecks(analysis: LadderAnalysis, multiplier: MultiplierSpec): CheckVerdict[] {
  const checks: CheckVerdict[] = [];
  for (const cap of analysis.capacitors) {
    const part = multiplier.capacitors[cap.index - 1];
    if (!part) continue;
    checks.push(
      deratedVerdict(
        {
          id: STRESS_CHECK_IDS.capacitorVoltage(cap.index),
          subject: `C${cap.index} (${cap.column}, stage ${cap.stage})`,
          rule: ratingRule('largest voltage over the cycle', DERATING.capacitorVoltage),
          value: cap.maxVoltageV,
          unit: 'V',
        },
        part.ratedVoltageV,
        DERATING.capacitorVoltage,
      ),
    );
  }
  const diode = multiplier.diode;
  for (const d of analysis.diodes) {
    checks.push(
      deratedVerdict(
        {
          id: STRESS_CHECK_IDS.diodePiv(d.index),
          subject: `D${d.index}`,
          rule: ratingRule('peak inverse voltage over the cycle', DERATING.diodePiv),
          value: d.peakInverseV,
          unit: 'V',
        },
        diode.ratedPivV,
        DERATING.diodePiv,
      ),
      deratedVerdict(
        {
          id: `diode-average-d${d.index}`,
          subject: `D${d.index}`,
          rule: ratingRule('average forward current', DERATING.diodeAverageCurrent),
          value: d.averageCurrentA,
          unit: 'A',
        },
        diode.ratedAverageCurrentA,
        DERATING.diodeAverageCurrent,
      ),
      deratedVerdict(
        {
          id: `diode-surge-d${d.index}`,
          subject: `D${d.index}`,
          rule: ratingRule(
            'switch-on surge (drive peak over source and diode resistance, empty capacitors)',
            DERATING.diodeSurgeCurrent,
          ),
          value: d.surgeCurrentA,
          unit: 'A',
        },
        diode.ratedSurgeCurrentA,
        DERATING.diodeSurgeCurrent,
      ),
    );
  }
  return checks;
}

/**
 * Voltage and power of one resistor of the bleeder string: the resistors are equal and share the
 * ladder-top voltage equally, so one verdict of each kind speaks for all `count` of them (its cost does
 * not grow with the count).
 */
export function bleederStressChecks(
  bleeder: BleederString | null,
  ladderTopV: number,
  peakLadderTopV: number,
): CheckVerdict[] {
  if (!bleeder) return [];
  const perResistorV = Math.abs(peakLadderTopV) / bleeder.count;
  const perResistorW = (Math.abs(ladderTopV) / bleeder.count) ** 2 / bleeder.valueOhm;
  const subject = bleeder.count === 1 ? 'bleeder resistor' : `each of the ${bleeder.count} bleeder resistors`;
  return [
    deratedVerdict(
      {
        id: STRESS_CHECK_IDS.bleederVoltage,
        subject,
        rule: ratingRule(
          'voltage across one resistor vs its limiting element voltage (IEC 60115-1 term)',
          DERATING.resistorVoltage,
        ),
        value: perResistorV,
        unit: 'V',
      },
      bleeder.limitingVoltageV,
      DERATING.resistorVoltage,
    ),
    deratedVerdict(
      {
        id: STRESS_CHECK_IDS.bleederPower,
        subject,
        rule: ratingRule('dissipation of one resistor', DERATING.resistorPower),
        value: perResistorW,
        unit: 'W',
      },
      bleeder.ratedPowerW,
      DERATING.resistorPower,
    ),
  ];
}
