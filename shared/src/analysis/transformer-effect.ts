import type { Design } from '../designs/design.types';
import type { DriverReport } from '../driver/driver-report';
import { formatQuantity } from '../units';
import { derivedTransformerNumbers } from '../transformer/given-numbers';
import type { TransformerDriverEffect } from '../transformer/transformer.types';

/** Output below this share of the target is "far below" it (common practice, no source). */
export const OUTPUT_SHORTFALL_FRACTION = 0.9;
/** Efficiency below this share of the given numbers' efficiency has collapsed (common practice, no source). */
export const EFFICIENCY_COLLAPSE_FRACTION = 0.75;
/** A turns ratio or inductance this far from the given numbers is named as a cause (common practice, no source). */
const CHANGE_FRACTION = 0.05;

/** The figures of one analysis the comparison reads. */
export interface EffectSide {
  outputMeanV: number;
  driver: DriverReport | null;
}

const pct = (fraction: number) => `${Math.round(fraction * 100)} %`;
const volts = (v: number) => formatQuantity(Math.abs(v), 'V', 3);

/**
 * What the designed transformer does to the driver: the design on its section beside the same design on the
 * stage's given numbers, with plain findings (output short of the target, efficiency collapse) and the
 * likely causes (turns ratio, feedback ratio, primary inductance, less energy a cycle, the core saturating first). Null without a driver.
 */
export function transformerDriverEffect(
  design: Design,
  designed: EffectSide,
  given: EffectSide,
): TransformerDriverEffect | null {
  if (design.drive.kind !== 'driver' || !designed.driver || !given.driver) return null;
  const stage = design.drive.driver;
  const section = stage.transformerDesign;
  if (!section) return null;
  const turnsOf = (role: 'primary' | 'feedback' | 'secondary') =>
    section.windings.find((w) => w.role === role)?.turns ?? 1;
  const turnsRatio = turnsOf('secondary') / turnsOf('primary');
  const givenTurnsRatio = stage.transformer.secondaryTurns / stage.transformer.primaryTurns;
  const efficiency = designed.driver.figures.efficiency.value;
  const givenEfficiency = given.driver.figures.efficiency.value;
  const targetV = design.targets.outputV;
  const outputShare = Math.abs(designed.outputMeanV) / Math.max(1e-9, Math.abs(targetV));
  const findings: string[] = [];
  const short = outputShare < 1;
  const collapsed = efficiency < EFFICIENCY_COLLAPSE_FRACTION * givenEfficiency;
  if (short) {
    findings.push(
      `The output is ${volts(designed.outputMeanV)}, ${pct(1 - outputShare)} below the ${volts(targetV)} target (${volts(given.outputMeanV)} with the given numbers).`,
    );
  }
  if (collapsed) {
    findings.push(
      `The driver’s efficiency falls to ${pct(efficiency)} from ${pct(givenEfficiency)} with the given numbers.`,
    );
  }
  if (short || collapsed) {
    if (Math.abs(turnsRatio / givenTurnsRatio - 1) > CHANGE_FRACTION) {
      findings.push(
        `The turns ratio is 1:${turnsRatio.toFixed(0)} where the given numbers have 1:${givenTurnsRatio.toFixed(0)}: the secondary’s peaks scale with it, so change the secondary turns with the primary’s.`,
      );
    }
    const feedbackOf = (t: { feedbackTurns: number; primaryTurns: number }) => t.feedbackTurns / t.primaryTurns;
    const feedbackRatio = turnsOf('feedback') / turnsOf('primary');
    const givenFeedbackRatio = feedbackOf(stage.transformer);
    if (Math.abs(feedbackRatio / givenFeedbackRatio - 1) > CHANGE_FRACTION) {
      findings.push(
        `The feedback winding has ${feedbackRatio.toFixed(2)} of the primary’s turns where the given numbers have ${givenFeedbackRatio.toFixed(2)}: the base drive, and with it the peak current, follow it, so change the feedback turns with the primary’s.`,
      );
    }
    const inductanceH = derivedTransformerNumbers(section).primaryInductanceH;
    const givenInductanceH = stage.transformer.primaryInductanceH;
    if (Math.abs(inductanceH / givenInductanceH - 1) > CHANGE_FRACTION) {
      findings.push(
        `The primary inductance is ${formatQuantity(inductanceH, 'H', 3)} where the given numbers have ${formatQuantity(givenInductanceH, 'H', 3)}: check the gap.`,
      );
    }
    const energyJ = designed.driver.figures.energyPerCycleJ.value;
    const givenEnergyJ = given.driver.figures.energyPerCycleJ.value;
    if (energyJ < (1 - CHANGE_FRACTION) * givenEnergyJ) {
      findings.push(`Each cycle stores ${pct(energyJ / givenEnergyJ)} of the energy it stores with the given numbers.`);
    }
    if (designed.driver.figures.onTimeLimit === 'saturation' && given.driver.figures.onTimeLimit !== 'saturation') {
      findings.push('The core saturates before the base drive ends the on-time: more primary turns or a larger core.');
    }
  }
  return {
    outputV: designed.outputMeanV,
    targetOutputV: targetV,
    givenOutputV: given.outputMeanV,
    efficiency,
    givenEfficiency,
    turnsRatio,
    givenTurnsRatio,
    spoilsDriver: outputShare < OUTPUT_SHORTFALL_FRACTION || collapsed,
    findings,
  };
}
