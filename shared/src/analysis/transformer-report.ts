import type { Design } from '../designs/design.types';
import type { DriverReport } from '../driver/driver-report';
import { analyzeTransformer } from '../transformer/analyze-transformer';
import { pulseOperatingPoint } from '../transformer/operating-point';
import type { TransformerReport } from '../transformer/transformer.types';

/**
 * The transformer section's report at the driver's rated-load operating point, for a design whose driver
 * uses a designed transformer; null otherwise. The peak magnetizing current is the estimate's peak primary
 * current, or its collector peak when the core saturates (the flux then judged past saturation).
 */
export function designedTransformerReport(design: Design, driver: DriverReport | null): TransformerReport | null {
  if (design.drive.kind !== 'driver' || !driver) return null;
  const stage = design.drive.driver;
  const section = stage.transformerDesign;
  if (stage.transformerChoice !== 'designed' || !section) return null;
  const f = driver.figures;
  const tx = stage.transformer;
  const point = pulseOperatingPoint({
    frequencyHz: f.frequencyHz.value,
    onTimeS: f.onTimeS.value,
    flybackTimeS: f.flybackTimeS.value,
    primaryPeakCurrentA: f.onTimeLimit === 'saturation' ? f.collectorPeakCurrentA.value : f.peakPrimaryCurrentA.value,
    baseCurrentA: f.baseCurrentA.value,
    primaryOnVoltageV: Math.max(0, f.supplyVoltageV.value - stage.transistor.vceSatV),
    forwardSecondaryPeakV: f.forwardSecondaryPeakV.value,
    flybackSecondaryPeakV: driver.operatingPoint.ratedLoad.flybackSecondaryPeakV,
    primaryTurns: tx.primaryTurns,
    feedbackTurns: tx.feedbackTurns,
    secondaryTurns: tx.secondaryTurns,
    ambientTemperatureC: stage.ambientTemperatureC ?? 25,
    forwardLoadPowerW: driver.operatingPoint.ratedLoad.ladderTakesW.forward,
  });
  return analyzeTransformer(section, point, design.targets.spacing);
}

/** The design on its driver stage's given transformer numbers (the section kept, not used). */
export function withGivenTransformer(design: Design): Design {
  if (design.drive.kind !== 'driver') return design;
  return { ...design, drive: { ...design.drive, driver: { ...design.drive.driver, transformerChoice: 'given' } } };
}
