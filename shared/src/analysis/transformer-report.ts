import type { Design } from '../designs/design.types';
import type { DriverStage } from '../designs/driver-stage.types';
import type { DriverFigures, DriverReport } from '../driver/driver-report';
import { TURN_OFF_OVERSHOOT_METHOD, stageTurnOffSlew, turnOffMagnetizingPeakA } from '../driver/turn-off-overshoot';
import { analyzeTransformer } from '../transformer/analyze-transformer';
import { pulseOperatingPoint } from '../transformer/operating-point';
import type { TransformerOperatingPoint, TransformerReport } from '../transformer/transformer.types';

/** What the transformer's operating point reads besides the driver's figures. */
export interface StageLoadFigures {
  /** Flyback peak of the secondary at the operating point (V). */
  flybackSecondaryPeakV: number;
  /** Power the load takes from the forward pulse (W). */
  forwardLoadPowerW: number;
}

/**
 * The transformer's operating point from a driver stage (with its effective transformer numbers) and its
 * figures. The peak magnetizing current is the figures' peak primary current grown by the turn-off slew
 * (`turnOffMagnetizingPeakA`: the core keeps charging while the collector node slews across the reflected
 * self-capacitance), or the collector peak when the core saturates (the flux then judged past saturation).
 */
export function stageTransformerOperatingPoint(
  stage: DriverStage,
  f: DriverFigures,
  load: StageLoadFigures,
): TransformerOperatingPoint {
  const tx = stage.transformer;
  const primaryOnVoltageV = Math.max(0, f.supplyVoltageV.value - stage.transistor.vceSatV);
  const saturated = f.onTimeLimit === 'saturation';
  return pulseOperatingPoint({
    frequencyHz: f.frequencyHz.value,
    onTimeS: f.onTimeS.value,
    flybackTimeS: f.flybackTimeS.value,
    primaryPeakCurrentA: saturated ? f.collectorPeakCurrentA.value : f.peakPrimaryCurrentA.value,
    ...(saturated
      ? {}
      : {
          magnetizingPeakCurrentA: turnOffMagnetizingPeakA(
            stageTurnOffSlew(stage, f.peakPrimaryCurrentA.value, primaryOnVoltageV),
          ),
        }),
    baseCurrentA: f.baseCurrentA.value,
    primaryOnVoltageV,
    forwardSecondaryPeakV: f.forwardSecondaryPeakV.value,
    flybackSecondaryPeakV: load.flybackSecondaryPeakV,
    primaryTurns: tx.primaryTurns,
    feedbackTurns: tx.feedbackTurns,
    secondaryTurns: tx.secondaryTurns,
    ambientTemperatureC: stage.ambientTemperatureC ?? 25,
    forwardLoadPowerW: load.forwardLoadPowerW,
  });
}

/**
 * The transformer section's report at the driver's rated-load operating point, for a design (with its
 * effective transformer numbers) whose driver uses a designed transformer; null otherwise.
 */
export function designedTransformerReport(design: Design, driver: DriverReport | null): TransformerReport | null {
  if (design.drive.kind !== 'driver' || !driver) return null;
  const stage = design.drive.driver;
  const section = stage.transformerDesign;
  if (stage.transformerChoice !== 'designed' || !section) return null;
  const point = stageTransformerOperatingPoint(stage, driver.figures, {
    flybackSecondaryPeakV: driver.operatingPoint.ratedLoad.flybackSecondaryPeakV,
    forwardLoadPowerW: driver.operatingPoint.ratedLoad.ladderTakesW.forward,
  });
  const report = analyzeTransformer(section, point, design.targets.spacing);
  return { ...report, methods: { ...report.methods, magnetizingPeak: TURN_OFF_OVERSHOOT_METHOD } };
}

/** The design on its driver stage's given transformer numbers (the section kept, not used). */
export function withGivenTransformer(design: Design): Design {
  if (design.drive.kind !== 'driver') return design;
  return { ...design, drive: { ...design.drive, driver: { ...design.drive.driver, transformerChoice: 'given' } } };
}
