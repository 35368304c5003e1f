import type { Design } from '../designs/design.types';
import { stageTurnOffSlew, turnOffMagnetizingPeakA } from '../driver/turn-off-overshoot';
import { withEffectiveTransformer } from '../transformer/given-numbers';
import type { TransformerSection, TransformerSizerRequest } from '../transformer/transformer.types';
import { analyzeDesign, type DesignReport } from './analyze-design';
import { withGivenTransformer } from './transformer-report';

/** What the transformer Sizer takes from a design's driver: everything but the wires and tapes. */
export type DriverSizerFigures = Pick<
  TransformerSizerRequest,
  | 'primaryInductanceH'
  | 'primaryPeakCurrentA'
  | 'turnsRatio'
  | 'feedbackRatio'
  | 'frequencyHz'
  | 'dutyOnFraction'
  | 'secondaryPeakV'
>;

/**
 * The transformer Sizer's driver figures from a design and its report, at the rated load, for the driver as
 * its given transformer numbers state it (the transformer the section is to realise; a designed section that
 * spoils the driver would otherwise steer the Sizer): the primary inductance and turns ratios, the peak
 * magnetizing current (the estimate's collector peak grown by the turn-off slew, as the Transformer tab judges
 * the flux), frequency, the on-time's share of the period and the larger secondary peak. With a designed
 * transformer the design is analysed once more on its given numbers. Null without a driver stage.
 */
export function driverSizerFigures(openDesign: Design, openReport: DesignReport): DriverSizerFigures | null {
  const isDesigned = openDesign.drive.kind === 'driver' && openDesign.drive.driver.transformerChoice === 'designed';
  const design = isDesigned ? withGivenTransformer(openDesign) : openDesign;
  const report = isDesigned ? analyzeDesign(design) : openReport;
  const effective = withEffectiveTransformer(design);
  if (effective.drive.kind !== 'driver' || !report.driver) return null;
  const stage = effective.drive.driver;
  const tx = stage.transformer;
  const f = report.driver.figures;
  const rated = report.driver.operatingPoint.ratedLoad;
  const peakA =
    f.onTimeLimit === 'saturation'
      ? f.collectorPeakCurrentA.value
      : turnOffMagnetizingPeakA(
          stageTurnOffSlew(
            stage,
            f.peakPrimaryCurrentA.value,
            Math.max(0, f.supplyVoltageV.value - stage.transistor.vceSatV),
          ),
        );
  return {
    primaryInductanceH: tx.primaryInductanceH,
    primaryPeakCurrentA: peakA,
    turnsRatio: tx.secondaryTurns / tx.primaryTurns,
    feedbackRatio: tx.feedbackTurns / tx.primaryTurns,
    frequencyHz: f.frequencyHz.value,
    dutyOnFraction: Math.min(0.99, Math.max(0.01, f.onTimeS.value * f.frequencyHz.value)),
    secondaryPeakV: Math.max(f.forwardSecondaryPeakV.value, rated.flybackSecondaryPeakV),
  };
}

/**
 * The design with its driver's transformer designed from `section` (a Sizer's choice): the section replaces any
 * earlier one, keeping that one's winding names and pins; the given numbers stay as they were. Unchanged
 * without a driver stage.
 */
export function withTransformerSection(design: Design, section: TransformerSection): Design {
  if (design.drive.kind !== 'driver') return design;
  const stage = design.drive.driver;
  const earlier = stage.transformerDesign;
  const windings = section.windings.map((winding) => {
    const before = earlier?.windings.find((w) => w.role === winding.role);
    return before
      ? {
          ...winding,
          ...(before.name ? { name: before.name } : {}),
          startPin: before.startPin,
          endPin: before.endPin,
        }
      : winding;
  });
  return {
    ...design,
    drive: {
      ...design.drive,
      driver: {
        ...stage,
        transformerChoice: 'designed',
        transformerDesign: {
          ...section,
          windings,
          ...(earlier?.inductanceTolerance !== undefined ? { inductanceTolerance: earlier.inductanceTolerance } : {}),
        },
      },
    },
  };
}
