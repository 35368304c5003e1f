import { describe, expect, it } from 'vitest';
import { designExamples } from '@ladderwright/shared/designs';
import { estimateBlockingOscillator } from '@ladderwright/shared/driver';
import { requiredCreepageMm } from '@ladderwright/shared/safety';
import { startingSection } from './transformer-start';

const tester = designExamples.surfaceChargeTester;
const driver = tester.drive.kind === 'driver' ? tester.drive.driver : null;

describe('the first designed transformer of a driver stage', () => {
  it('starts with end margins that give the flange creepage IEC 60664-1 asks at the estimate’s secondary peak', () => {
    if (!driver) throw new Error('the demo tester has a driver stage');
    const estimate = estimateBlockingOscillator(driver);
    const peakV = Math.max(estimate.forwardSecondaryPeakV.value, estimate.flybackSecondaryPeakV.value);
    const section = startingSection(driver, [], tester.targets.spacing);
    // Potted tester: pollution degree 1 (Table F.4, read in REFERENCES.md §5), with the Check's 20 % pass margin.
    expect(2 * (section.endMarginM ?? 0) * 1000).toBeGreaterThanOrEqual(1.2 * requiredCreepageMm(peakV, 'pd1'));
    expect(section.windings.map((w) => w.turns)).toEqual([20, 8, 1200]);
  });

  it('keeps 1.5 mm margins when no spacing is given', () => {
    if (!driver) throw new Error('the demo tester has a driver stage');
    expect(startingSection(driver, []).endMarginM).toBe(1.5e-3);
  });
});
