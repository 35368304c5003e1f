import { analyzeDesign } from '@ladderwright/shared/analysis';
import { designExamples, validateDesign } from '@ladderwright/shared/designs';
import { DEFAULT_ACCEPTANCE_SETTINGS } from '@ladderwright/shared/reviews';
import { acceptanceOf } from './spec-sheets.service';

// The acceptance window is the predicted output's spread over part tolerances (acceptance-limits.ts, GUM coverage
// factors). A unit built exactly to the prediction must pass its own acceptance test, so the window holds the
// headline output the sheet prints beside it.
describe('acceptanceOf', () => {
  it.each(Object.keys(designExamples) as (keyof typeof designExamples)[])(
    '%s: the window holds the predicted output at the rated load',
    (name) => {
      const design = validateDesign(designExamples[name]);
      const report = analyzeDesign(design);
      const window = acceptanceOf(design, report, DEFAULT_ACCEPTANCE_SETTINGS);
      const predictedV = Math.abs(report.outputMeanV);
      expect(predictedV).toBeGreaterThanOrEqual(Math.abs(window.outputLowV));
      expect(predictedV).toBeLessThanOrEqual(Math.abs(window.outputHighV));
    },
  );
});
