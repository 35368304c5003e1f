import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import { isDomainError } from '../errors';
import { BATCH_MAX_MEMBERS, monteCarloDesigns, sweepDesigns } from './design-variants';

const base = designExamples.detectorBias;

function errorOf(run: () => unknown): { code: string; field: string | null } {
  try {
    run();
  } catch (error) {
    if (isDomainError(error)) return { code: error.code, field: error.field };
    throw error;
  }
  throw new Error('expected a DomainError');
}

describe('sweepDesigns', () => {
  it('sets the number at the path in each member and leaves the base design and every other field alone', () => {
    const path = 'multiplier.capacitors[1].valueF';
    const members = sweepDesigns(base, path, [10e-9, 22e-9, 47e-9]);
    expect(members.map((member) => member.document.multiplier.capacitors[1]?.valueF)).toEqual([10e-9, 22e-9, 47e-9]);
    expect(members.map((member) => member.variant)).toEqual([{ [path]: 10e-9 }, { [path]: 22e-9 }, { [path]: 47e-9 }]);
    for (const member of members) {
      expect({ ...member.document, multiplier: null }).toEqual({ ...base, multiplier: null });
      expect(member.document.multiplier.capacitors[0]).toEqual(base.multiplier.capacitors[0]);
    }
    expect(base.multiplier.capacitors[1]?.valueF).not.toBe(47e-9);
  });

  it('refuses a path that holds no number, naming sweep.path', () => {
    expect(errorOf(() => sweepDesigns(base, 'multiplier.topology', [1]))).toEqual({
      code: 'invalid_argument',
      field: 'sweep.path',
    });
    expect(errorOf(() => sweepDesigns(base, 'multiplier.capacitors[99].valueF', [1e-9])).field).toBe('sweep.path');
  });

  it('refuses a value the design limits refuse, naming the member', () => {
    expect(errorOf(() => sweepDesigns(base, 'multiplier.capacitors[0].valueF', [1e-9, -1])).field).toBe(
      'sweep.values[1]',
    );
  });

  it(`holds a batch to 1 … ${BATCH_MAX_MEMBERS} members`, () => {
    const path = 'multiplier.capacitors[0].valueF';
    expect(errorOf(() => sweepDesigns(base, path, [])).field).toBe('sweep.values');
    const tooMany = Array.from({ length: BATCH_MAX_MEMBERS + 1 }, () => 1e-9);
    expect(errorOf(() => sweepDesigns(base, path, tooMany)).field).toBe('sweep.values');
  });
});

describe('monteCarloDesigns', () => {
  it('draws every capacitor within its stated tolerance band, the same members for the same seed', () => {
    const members = monteCarloDesigns(base, 64, 7);
    expect(members).toHaveLength(64);
    expect(monteCarloDesigns(base, 64, 7)).toEqual(members);
    expect(monteCarloDesigns(base, 64, 8)).not.toEqual(members);
    for (const member of members) {
      member.document.multiplier.capacitors.forEach((capacitor, index) => {
        const nominal = base.multiplier.capacitors[index];
        if (!nominal) throw new Error('capacitor count changed');
        // The tolerance band: nominal × (1 ± tolerance) (common practice, no source).
        expect(Math.abs(capacitor.valueF / nominal.valueF - 1)).toBeLessThanOrEqual(nominal.tolerance);
        expect(member.variant[`multiplier.capacitors[${index}].valueF`]).toBe(capacitor.valueF);
      });
    }
  });

  it('spreads the draws like a uniform distribution over the band', () => {
    // 256 trials × every capacitor: for a uniform draw on [−t, t] the mean is 0 and the standard deviation
    // t/√3 (the uniform distribution's variance (b − a)²/12); 4 standard errors of slack for the sample.
    const deviations: number[] = [];
    for (const member of monteCarloDesigns(base, BATCH_MAX_MEMBERS, 11)) {
      member.document.multiplier.capacitors.forEach((capacitor, index) => {
        const nominal = base.multiplier.capacitors[index];
        if (nominal) deviations.push((capacitor.valueF / nominal.valueF - 1) / nominal.tolerance);
      });
    }
    const n = deviations.length;
    const mean = deviations.reduce((sum, x) => sum + x, 0) / n;
    const sd = Math.sqrt(deviations.reduce((sum, x) => sum + (x - mean) ** 2, 0) / (n - 1));
    const expectedSd = 1 / Math.sqrt(3);
    expect(Math.abs(mean)).toBeLessThan((4 * expectedSd) / Math.sqrt(n));
    expect(Math.abs(sd - expectedSd)).toBeLessThan(0.05);
  });
});
