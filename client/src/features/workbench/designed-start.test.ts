import { describe, expect, it } from 'vitest';
import { designExamples } from '@ladderwright/shared/designs';
import { startDesignedTransformer } from './designed-start';

const tester = designExamples.surfaceChargeTester;

describe('the switch of a design to a designed transformer', () => {
  it('starts on the Sizer’s first core with a note naming it, and does nothing without a driver', () => {
    const start = startDesignedTransformer(tester, []);
    expect(start?.section.core.code).toBe('Core E25 ferrite grade A');
    expect(start?.note).toMatch(/^Core E25 ferrite grade A is the only core of 5 that fits the driver’s 1 mH/);
    expect(startDesignedTransformer(designExamples.ionizerBar, [])).toBeNull();
  });

  it('falls back to the given turns on the first core, and says why, when the engine refuses the design as it stands', () => {
    if (tester.drive.kind !== 'driver') throw new Error('the demo tester has a driver stage');
    const broken = structuredClone(tester);
    if (broken.drive.kind === 'driver') broken.drive.driver.transformer.primaryInductanceH = 0;
    const start = startDesignedTransformer(broken, []);
    expect(start?.section.windings.map((w) => w.turns)).toEqual([20, 8, 1200]);
    expect(start?.note).toMatch(
      /^The driver cannot be estimated as it stands, so the section starts on Core E13 ferrite grade A with the given turns/,
    );
  });
});
