import { describe, expect, it } from 'vitest';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { designExamples, validateDesign, type Design } from '@ladderwright/shared/designs';
import { loadCurveOf, nearLoadRange } from './ladder-charts';

function reportAtLoad(design: Design, currentA: number) {
  return analyzeDesign(validateDesign({ ...structuredClone(design), load: { kind: 'current', currentA } }));
}

describe('loadCurveOf', () => {
  it('draws a bare ladder at its drive, from no load to short circuit', () => {
    const report = analyzeDesign(validateDesign(designExamples.detectorBias));
    const curve = loadCurveOf(report);
    expect(curve.data).toBe(report.curves.regulation);
    expect(curve.range).toBeUndefined();
    expect(curve.loadA).toBe(report.analysis.loadCurrentA);
  });

  it('draws a driver design as the supply, with a load beyond what it delivers past the curve’s end', () => {
    const withinReport = reportAtLoad(designExamples.surfaceChargeTester, 2e-6);
    const beyondReport = reportAtLoad(designExamples.surfaceChargeTester, 1e-4);
    const capacity = beyondReport.driver?.loadCapacity;
    expect(capacity?.isLoadBeyond).toBe(true);
    const within = loadCurveOf(withinReport);
    const beyond = loadCurveOf(beyondReport);
    // The supply's curve does not depend on the load asked of it: the same no-load output either way, which the
    // ladder's fixed-drive curve at the collapsed drive of an over-loaded supply does not give.
    expect(beyond.data[0]?.y).toBeCloseTo(within.data[0]?.y ?? Number.NaN, 6);
    expect(beyondReport.curves.regulation[0]?.y).toBeLessThan(0.5 * (beyond.data[0]?.y ?? 0));
    expect(beyond.loadA).toBe(1e-4);
    expect(beyond.loadLabel).toMatch(/beyond the supply/);
    expect(beyond.range?.[1]).toBeGreaterThan(1e-4);
    // The curve ends where the output reaches zero: at the most the supply delivers (both found by bisection to
    // about 1e-4 relative, OperatingPointResult).
    expect((beyond.data.at(-1)?.x ?? 0) / (capacity?.maxLoadCurrentA ?? Number.NaN)).toBeCloseTo(1, 3);
  });

  it('first shows a load far below the curve’s end away from the y-axis, on a 1-2-5 end', () => {
    const report = analyzeDesign(validateDesign(designExamples.detectorBias));
    const curve = loadCurveOf(report);
    // 5 µA against a short-circuit current near 1 mA: drawn whole, the mark would sit 0.5 % from the axis.
    expect(curve.loadA).toBeCloseTo(5e-6, 12);
    expect(curve.nearRange?.[0]).toBe(0);
    expect(curve.nearRange?.[1]).toBeCloseTo(2e-5, 12);
    expect(nearLoadRange(3e-5, 4.4e-4)?.[1]).toBeCloseTo(1e-4, 12);
    expect(nearLoadRange(1e-3, 1e-3)).toBeUndefined();
    expect(nearLoadRange(0, 1e-3)).toBeUndefined();
    // The driver's power-limit onset at 15.2 µA beside a 2 µA load: the range reaches past it (19 µA → 20 µA).
    expect(nearLoadRange(2e-6, 1.6e-4, 15.2e-6)?.[1]).toBeCloseTo(2e-5, 12);
    expect(nearLoadRange(2e-6, 1.6e-4, 1e-6)?.[1]).toBeCloseTo(1e-5, 12);
    expect(nearLoadRange(2e-6, 3e-5, 15.2e-6)).toBeUndefined();
  });
});
