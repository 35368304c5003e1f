import { describe, expect, it } from 'vitest';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { shelfPart } from '../../testing/shelf-part';
import { answerLiveAnalysis } from './live-analysis-messages';

function withPrimaryInductance(document: Design, primaryInductanceH: number): Design {
  const copy = structuredClone(document);
  if (copy.drive.kind === 'driver') copy.drive.driver.transformer.primaryInductanceH = primaryInductanceH;
  return copy;
}

describe('answerLiveAnalysis', () => {
  it('answers a driver design with its number and the engine’s own report', () => {
    const answer = answerLiveAnalysis({ sequence: 4, document: designExamples.surfaceChargeTester });
    expect(answer.sequence).toBe(4);
    expect(answer.result.issues).toEqual({});
    expect(answer.result.engineError).toBeNull();
    // Same engine, same input: the figures agree exactly.
    expect(answer.result.report?.outputMeanV).toBe(analyzeDesign(designExamples.surfaceChargeTester).outputMeanV);
    expect(answer.result.report?.driver?.operatingPoint.curve.length).toBeGreaterThan(1);
  });

  it('returns validateDesign’s issue by path, and no report, for a negative target ripple', () => {
    const document = structuredClone(designExamples.detectorBias);
    document.targets.rippleMaxV = -1;
    const { result } = answerLiveAnalysis({ sequence: 1, document });
    expect(result.report).toBeNull();
    expect(result.engineError).toBeNull();
    expect(Object.keys(result.issues)).toContain('targets.rippleMaxV');
  });

  it('returns the driver stage’s refusal under its document path, beside the field rather than as an engine error', () => {
    const { result } = answerLiveAnalysis({
      sequence: 2,
      document: withPrimaryInductance(designExamples.surfaceChargeTester, 0),
    });
    expect(result.report).toBeNull();
    expect(result.issues['drive.driver.transformer.primaryInductanceH']).toBe('must be greater than zero');
    expect(result.engineError).toBeNull();
  });

  it('lists a part code the shelf does not hold as a part issue and still reports', () => {
    const document = structuredClone(designExamples.detectorBias);
    document.multiplier.diode.partCode = 'NF-NOT-THERE';
    const { result } = answerLiveAnalysis({
      sequence: 3,
      document,
      shelf: [shelfPart({ code: 'NF-D-OTHER', kind: 'diode' })],
    });
    expect(result.report).not.toBeNull();
    expect(result.partIssues.map((issue) => issue.path)).toContain('multiplier.diode.partCode');
  });
});
