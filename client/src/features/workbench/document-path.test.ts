import { describe, expect, it } from 'vitest';
import { designExamples } from '@ladderwright/shared/designs';
import { withSharedBranches } from './document-path';

describe('withSharedBranches', () => {
  it('keeps every untouched branch of an edited copy and replaces the path to the change', () => {
    const previous = designExamples.detectorBias;
    const next = structuredClone(previous);
    next.multiplier.capacitors[1]!.valueF = 4.7e-9;
    const shared = withSharedBranches(previous, next);
    expect(shared).toEqual(next);
    expect(shared.drive).toBe(previous.drive);
    expect(shared.targets).toBe(previous.targets);
    expect(shared.multiplier.diode).toBe(previous.multiplier.diode);
    expect(shared.multiplier.capacitors[0]).toBe(previous.multiplier.capacitors[0]);
    expect(shared.multiplier).not.toBe(previous.multiplier);
    expect(shared.multiplier.capacitors[1]).not.toBe(previous.multiplier.capacitors[1]);
  });

  it('returns the previous document itself for a copy that changes nothing, and sees removed keys', () => {
    const previous = designExamples.surfaceChargeTester;
    expect(withSharedBranches(previous, structuredClone(previous))).toBe(previous);
    const next = structuredClone(previous);
    if (next.drive.kind === 'driver') delete next.drive.driver.clamp;
    const shared = withSharedBranches(previous, next);
    expect(shared).not.toBe(previous);
    expect(shared.drive.kind === 'driver' && 'clamp' in shared.drive.driver).toBe(false);
  });
});
