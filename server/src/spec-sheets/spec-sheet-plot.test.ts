import PDFDocument from 'pdfkit';
import { benchLimits } from '@ladderwright/shared/bench';
import { FONT_FILES } from './spec-sheet-layout';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { designExamples } from '@ladderwright/shared/designs';
import { outputVsLoadPlot, predictedLoadCurve, roundedAxisEnd } from './spec-sheet-plot';
import type { SpecSheetContent } from './spec-sheet.types';

// A revision may carry several bench runs of `benchLimits.maxDataRows` points each. The plot once took its axis ranges
// with Math.max(...points): past about 10^5 arguments V8 throws a RangeError, and the spec sheet answered 500.
describe('outputVsLoadPlot', () => {
  it('draws eight full load sweeps (160,000 points) on the output-vs-load plot', () => {
    const runs = 8;
    const points = (run: number) =>
      Array.from({ length: benchLimits.maxDataRows }, (_, i) => ({ x: (i + 1) * 1e-9, y: -(1000 + run) }));
    const content = {
      report: {
        curves: {
          regulation: [
            { x: 0, y: -1100 },
            { x: 2e-5, y: -1000 },
          ],
        },
        analysis: { loadCurrentA: 1e-5 },
      },
      acceptance: { outputLowV: -900, outputHighV: -1050 },
      benchRuns: Array.from({ length: runs }, (_, run) => ({ kind: 'load-sweep', points: points(run) })),
    } as unknown as SpecSheetContent;
    const doc = new PDFDocument({ size: 'A4', margin: 40 });
    for (const [name, file] of Object.entries(FONT_FILES)) doc.registerFont(name, file);
    const before = doc.y;
    expect(() => outputVsLoadPlot(doc, content)).not.toThrow();
    expect(doc.y).toBeGreaterThan(before);
    doc.end();
  });
});

describe('roundedAxisEnd', () => {
  // Steps of 1, 2, 2.5 and 5 per decade: the usual round chart scale (common practice, no source).
  it.each([
    [3780, 4000], // 945 V steps become 1 kV
    [163e-6, 200e-6], // 40.8 µA steps become 50 µA
    [1000, 1000], // already round: 250 per step stays
    [0.9, 1], // 0.225 → 0.25
    [7.2, 8], // 1.8 → 2
    [31, 40], // 7.75 → 10
  ])('puts %d on an axis ending at %d', (largest, end) => {
    expect(roundedAxisEnd(largest, 4)).toBeCloseTo(end, 12);
  });
});

describe('predictedLoadCurve', () => {
  it('draws a driver design as the supply: its no-load output and its end where the supply gives out', () => {
    const report = analyzeDesign(designExamples.surfaceChargeTester);
    const driver = report.driver!;
    const curve = predictedLoadCurve(report);
    expect(curve[0]?.y).toBeCloseTo(Math.abs(driver.operatingPoint.curve[0]!.outputV), 9);
    // The curve ends where the output reaches zero: the most the supply delivers (bisection to about 1e-4, as in
    // the operating point), not where the ladder at the rated drive would fall to zero.
    expect(curve.at(-1)!.x / driver.loadCapacity!.maxLoadCurrentA).toBeCloseTo(1, 3);
    expect(curve.at(-1)!.x).not.toBeCloseTo(report.curves.regulation.at(-1)!.x, 6);
  });

  it('draws a bare ladder as its regulation at its drive', () => {
    const report = analyzeDesign(designExamples.detectorBias);
    expect(predictedLoadCurve(report)).toEqual(report.curves.regulation.map((p) => ({ x: p.x, y: Math.abs(p.y) })));
  });
});
