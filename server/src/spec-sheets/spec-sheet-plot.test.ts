import PDFDocument from 'pdfkit';
import { benchLimits } from '@ladderwright/shared/bench';
import { FONT_FILES } from './spec-sheet-layout';
import { outputVsLoadPlot } from './spec-sheet-plot';
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
