import { describe, expect, it } from 'vitest';
import { describeUnitCost } from './part-ratings';

describe('describeUnitCost', () => {
  it('gives two decimals, or two figures where two decimals would read 0.00, and wire and tape per metre', () => {
    expect(describeUnitCost({ kind: 'capacitor', unitCost: 0.22 })).toBe('0.22');
    expect(describeUnitCost({ kind: 'core', unitCost: 1.449 })).toBe('1.45');
    expect(describeUnitCost({ kind: 'wire', unitCost: 0.0042 })).toBe('0.0042 per m');
    expect(describeUnitCost({ kind: 'tape', unitCost: 0.05 })).toBe('0.05 per m');
    expect(describeUnitCost({ kind: 'resistor', unitCost: 0 })).toBe('0.00');
  });
});
