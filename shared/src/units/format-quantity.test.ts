import { describe, expect, it } from 'vitest';
import { format as mathFormat } from 'mathjs';
import { formatQuantity } from './format-quantity';
import { parseQuantity } from './parse-quantity';

describe('formatQuantity', () => {
  // Expected strings: SI prefix rules (BIPM SI Brochure, 9th ed., §3, from memory) with engineering exponents.
  it.each([
    [4.7e-9, 'F', 3, '4.7 nF'],
    [2200, 'Ohm', 3, '2.2 kΩ'],
    [-6000, 'V', 3, '-6 kV'],
    [2e-5, 'A', 3, '20 µA'],
    [25000, 'Hz', 3, '25 kHz'],
    [999.96, 'V', 3, '1 kV'],
    [0, 'V', 3, '0 V'],
    [1.23456e-5, 'A', 4, '12.35 µA'],
  ] as const)('formats %s %s with %s figures as "%s"', (value, unit, figures, text) => {
    expect(formatQuantity(value, unit, figures)).toBe(text);
  });

  it('agrees with mathjs engineering notation on the mantissa', () => {
    // mathjs format(..., {notation:'engineering'}) is an independent engineering-notation formatter.
    for (const value of [4.7e-9, 3.3e6, 1.5e3, 2.2e-12, 68e-6]) {
      const [mantissa] = mathFormat(value, { notation: 'engineering', precision: 3 }).split('e');
      const ours = formatQuantity(value, 'F').split(' ')[0];
      expect(Number(ours)).toBeCloseTo(Number(mantissa), 9); // same 3-figure decimal; 1e-9 absorbs binary noise
    }
  });

  it('round-trips through parseQuantity within the stated figures', () => {
    for (const value of [4.7e-9, 1.2e5, 3.3e-3, 0.15, 6.8e11]) {
      const back = parseQuantity(formatQuantity(value, 'V', 6));
      expect(Math.abs(back - value) / value).toBeLessThan(5e-6); // 6 figures → relative error < 5e-6
    }
  });
});
