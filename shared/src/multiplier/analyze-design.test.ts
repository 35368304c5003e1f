import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import { validateDesign } from '../designs/validate-design';
import type { Design } from '../designs/design.types';
import { HV_CAUTION } from '../safety/hazard-limits';
import { analyzeDesign } from './analyze-design';
import { DERATING } from './ladder-stress';

describe('analyzeDesign on the demo designs', () => {
  it.each(Object.entries(designExamples))('%s: meets its own targets and every verdict carries the caution', (_, design) => {
    const report = analyzeDesign(validateDesign(structuredClone(design)));
    expect(Math.sign(report.outputMeanV)).toBe(Math.sign(design.targets.outputV));
    expect(report.meetsTargets).toEqual({ output: true, ripple: true });
    expect(report.checks.length).toBeGreaterThan(5);
    for (const check of report.checks) {
      expect(check.caution).toBe(HV_CAUTION);
      expect(['pass', 'marginal', 'fail']).toContain(check.verdict);
      expect(Number.isFinite(check.marginPct)).toBe(true);
      expect(check.rule.length).toBeGreaterThan(10);
    }
    expect(report.methods.map((m) => m.methodId)).toContain('charge-transfer-v1');
    // Signed: min ≤ mean ≤ max for either polarity; ripple = max − min (to 1e-9 V, float noise).
    expect(report.outputMinV).toBeLessThanOrEqual(report.outputMeanV);
    expect(report.outputMeanV).toBeLessThanOrEqual(report.outputMaxV);
    expect(Math.abs(report.ripplePeakToPeakV - (report.outputMaxV - report.outputMinV))).toBeLessThan(1e-9);
  });

  it('resolves the driver drive of the surface-charge tester into pulses and checks the driver power', () => {
    const report = analyzeDesign(designExamples.surfaceChargeTester);
    expect(report.resolvedDrive.kind).toBe('pulse');
    const power = report.checks.find((c) => c.id === 'driver-power');
    expect(power?.unit).toBe('W');
  });

  it('names a driver-stage problem under drive. in the design', () => {
    const design = structuredClone(designExamples.surfaceChargeTester);
    if (design.drive.kind === 'driver') design.drive.driver.transformer.primaryInductanceH = 0;
    expect(() => analyzeDesign(design)).toThrow(expect.objectContaining({ field: 'drive.driver.transformer.primaryInductanceH' }));
  });

  it('the ionizer bar is a negative ladder: outputs negative, PIV and capacitor figures positive magnitudes', () => {
    const report = analyzeDesign(designExamples.ionizerBar);
    expect(report.outputMeanV).toBeLessThan(-6000);
    expect(report.noLoadOutputV).toBeLessThan(report.outputMeanV); // more negative at no load
    for (const d of report.analysis.diodes) expect(d.peakInverseV).toBeGreaterThan(0);
  });
});

describe('component checks', () => {
  function withCapRating(ratedVoltageV: number): Design {
    const design = structuredClone(designExamples.detectorBias);
    const cap = design.multiplier.capacitors[1];
    if (cap) cap.ratedVoltageV = ratedVoltageV;
    return design;
  }

  it('capacitor voltage: pass below rating × 0.8, marginal up to the rating, fail above (derating common practice)', () => {
    // C2 of the tripler (oscillating) sees about 2·Vmax ≈ 630 V.
    const maxV = analyzeDesign(withCapRating(1000)).analysis.capacitors[1]?.maxVoltageV ?? NaN;
    const verdictAt = (rated: number) => analyzeDesign(withCapRating(rated)).checks.find((c) => c.id === 'cap-voltage-c2');
    expect(verdictAt(maxV / DERATING.capacitorVoltage + 1)?.verdict).toBe('pass');
    expect(verdictAt(maxV / 0.9)?.verdict).toBe('marginal');
    expect(verdictAt(maxV * 0.95)?.verdict).toBe('fail');
    expect(verdictAt(maxV * 0.95)?.marginPct).toBeLessThan(0);
  });

  it('bleeder: a string of resistors shares the voltage; too few resistors fail on element voltage', () => {
    const design = structuredClone(designExamples.ionizerBar);
    if (design.outputNetwork.bleeder) design.outputNetwork.bleeder = { ...design.outputNetwork.bleeder, count: 1, valueOhm: 1e9 };
    const checks = analyzeDesign(design).checks.filter((c) => c.id.startsWith('bleeder-voltage'));
    expect(checks).toHaveLength(1);
    expect(checks[0]?.verdict).toBe('fail'); // ~6.6 kV over one 2.5 kV element
  });

  it('reports the per-stage creepage requirement and fails a layout below it', () => {
    const design = structuredClone(designExamples.detectorBias);
    design.targets.spacing.providedCreepageMm = 1;
    const report = analyzeDesign(design);
    expect(report.spacing.length).toBe(2);
    expect(report.checks.filter((c) => c.id.startsWith('creepage-stage')).every((c) => c.verdict === 'fail')).toBe(true);
  });
});
