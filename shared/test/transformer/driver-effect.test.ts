import { describe, expect, it } from 'vitest';
import { analyzeDesign } from '../../src/analysis/analyze-design';
import type { Design } from '../../src/designs/design.types';
import { designExamples } from '../../src/designs/design-examples';
import { demoTransformerSection, type TransformerSection } from '../../src/transformer';

/** The demo tester on a designed transformer section. */
function testerOn(section: TransformerSection): Design {
  const tester = designExamples.surfaceChargeTester;
  if (tester.drive.kind !== 'driver') throw new Error('the demo tester has a driver stage');
  return {
    ...tester,
    drive: {
      kind: 'driver',
      driver: { ...tester.drive.driver, transformerChoice: 'designed', transformerDesign: section },
    },
  };
}

const withPrimaryTurns = (turns: number): TransformerSection => ({
  ...demoTransformerSection,
  windings: demoTransformerSection.windings.map((w) =>
    w.role === 'primary' ? { ...w, turns } : w.role === 'feedback' ? { ...w, turns: Math.round(turns * 0.4) } : w,
  ),
});

describe('what the designed transformer does to the driver', () => {
  it('the demo section on the demo tester meets the output target and every transformer Check', () => {
    const report = analyzeDesign(testerOn(demoTransformerSection));
    const effect = report.transformer?.driverEffect;
    expect(effect?.spoilsDriver).toBe(false);
    expect(effect?.findings).toEqual([]);
    expect(Math.abs(report.outputMeanV)).toBeGreaterThanOrEqual(3000);
    expect(report.transformer?.checks.filter((c) => c.verdict !== 'pass').map((c) => c.id)).toEqual([]);
  });

  it('more primary turns on the same secondary: the peaks fall with the turns ratio and the tab says why', () => {
    const report = analyzeDesign(testerOn(withPrimaryTurns(60)));
    const effect = report.transformer?.driverEffect;
    if (!effect) throw new Error('a designed transformer reports its effect on the driver');
    expect(effect.turnsRatio).toBe(40);
    expect(effect.givenTurnsRatio).toBe(60);
    // Ideal transformer: the forward pulse is Vp·Ns/Np (common practice, no source), so 40/60 of the given one
    // within the winding drops the section changes.
    const given = analyzeDesign({
      ...testerOn(withPrimaryTurns(60)),
      drive: { ...designExamples.surfaceChargeTester.drive },
    });
    const forward = report.driver?.figures.forwardSecondaryPeakV.value ?? 0;
    const givenForward = given.driver?.figures.forwardSecondaryPeakV.value ?? 1;
    expect(forward / givenForward).toBeCloseTo(40 / 60, 1);
    expect(effect.givenOutputV).toBeCloseTo(given.outputMeanV, 6);
    expect(effect.spoilsDriver).toBe(true);
    expect(Math.abs(effect.outputV)).toBeLessThan(0.9 * effect.targetOutputV);
    expect(effect.findings.join(' ')).toMatch(/below the 3 kV target/);
    expect(effect.findings.join(' ')).toMatch(/turns ratio is 1:40 where the given numbers have 1:60/);
  });

  it('names the feedback ratio when the primary’s turns change alone, and leaves the held inductance out', () => {
    const section: TransformerSection = {
      ...demoTransformerSection,
      windings: demoTransformerSection.windings.map((w) => (w.role === 'primary' ? { ...w, turns: 60 } : w)),
    };
    const findings = analyzeDesign(testerOn(section)).transformer?.driverEffect?.findings.join(' ') ?? '';
    // 16 feedback turns over 60 primary turns: 0.27 of them, where the given 8 over 20 are 0.40.
    expect(findings).toMatch(/feedback winding has 0\.27 of the primary’s turns where the given numbers have 0\.40/);
    expect(findings).not.toMatch(/primary inductance/);
    const scaled = analyzeDesign(testerOn(withPrimaryTurns(60))).transformer?.driverEffect?.findings.join(' ') ?? '';
    expect(scaled).not.toMatch(/feedback winding/);
  });

  it('a given transformer has no section and no effect', () => {
    expect(analyzeDesign(designExamples.surfaceChargeTester).transformer).toBeUndefined();
  });
});
