import { describe, expect, it } from 'vitest';
import { analyzeDesign } from '../../src/analysis/analyze-design';
import { predictedLoadCurve, predictionFromReport } from '../../src/bench/compare-bench-run';
import { loadSweepEstimate } from '../../src/calibration/calibration-models';
import { designExamples } from '../../src/designs/design-examples';

// One predicted load curve on the Bench runs page: the overlay and the pass/fail margin of a load sweep use the
// same curve as the Calibrate panel's model of a sweep (the engine's joint driver–ladder operating point for a
// driver design), so the page never shows two predictions that disagree.
describe('the predicted load curve a load sweep is compared with', () => {
  it('is the joint driver–ladder curve for a driver design, as the Calibrate panel solves it', () => {
    const tester = designExamples.surfaceChargeTester;
    const report = analyzeDesign(tester);
    const curve = predictedLoadCurve(report);
    expect(curve).toHaveLength(report.driver!.operatingPoint.curve.length);
    const inner = curve.slice(1, 11);
    const model = loadSweepEstimate(
      tester,
      inner.map((p) => p.x),
    );
    // 1e-9 relative: the same engine solve at the same currents (the curve is sampled by the operating point).
    inner.forEach((p, i) => expect(Math.abs(p.y / model[i]! - 1)).toBeLessThan(1e-9));
    // And it is what the comparison takes.
    expect(predictionFromReport(report).regulation).toEqual(curve.map((p) => ({ x: Math.abs(p.x), y: Math.abs(p.y) })));
  });

  it('stays the ladder’s regulation curve for a sine-driven design', () => {
    const report = analyzeDesign(designExamples.ionizerBar);
    expect(report.driver).toBeNull();
    expect(predictedLoadCurve(report)).toEqual(report.curves.regulation);
  });
});
