import { expect } from 'vitest';
import {
  calibrateDesign,
  inProcessPredictor,
  type CalibrationDataset,
  type CalibrationParameterId,
  type CalibrationResult,
} from '../../src/calibration';
import type { Design } from '../../src/designs/design.types';

/** Fits one parameter of `design` over its prior range to one run, in this thread. */
export function fitOne(
  design: Design,
  id: CalibrationParameterId,
  min: number,
  max: number,
  dataset: CalibrationDataset,
): Promise<CalibrationResult> {
  return calibrateDesign(
    { design, parameters: [{ id, prior: { min, max } }], datasets: [dataset] },
    inProcessPredictor(),
  );
}

/** The fit's interval holds the true value, and the fit lowered the run's residual. */
export function expectRecovered(result: CalibrationResult, truth: number): void {
  const fitted = result.parameters[0]!;
  expect(fitted.interval).not.toBeNull();
  expect(truth).toBeGreaterThanOrEqual(fitted.interval!.low);
  expect(truth).toBeLessThanOrEqual(fitted.interval!.high);
  expect(result.residuals[0]!.rmsAfterV).toBeLessThan(result.residuals[0]!.rmsBeforeV);
}
