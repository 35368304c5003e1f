import { describe, expect, it } from 'vitest';
import { unit as mathUnit } from 'mathjs';
import { DomainError } from '../errors';
import { parseQuantity, parseQuantityWithUnit } from './parse-quantity';

// Outside check: mathjs's own unit parser reads the same quantity written in its syntax.
// Tolerance 1e-12 relative: both sides are the same decimal value up to binary rounding.
const cases: Array<{ text: string; mathjs: string; mathjsUnit: string }> = [
  { text: '4.7n', mathjs: '4.7 nF', mathjsUnit: 'F' },
  { text: '4n7', mathjs: '4.7 nF', mathjsUnit: 'F' },
  { text: '10 nF', mathjs: '10 nF', mathjsUnit: 'F' },
  { text: '3.3M', mathjs: '3.3 Mohm', mathjsUnit: 'ohm' },
  { text: '2k2', mathjs: '2.2 kohm', mathjsUnit: 'ohm' },
  { text: '4R7', mathjs: '4.7 ohm', mathjsUnit: 'ohm' },
  { text: '1.5 kV', mathjs: '1.5 kV', mathjsUnit: 'V' },
  { text: '20 µA', mathjs: '20 uA', mathjsUnit: 'A' },
  { text: '20 μA', mathjs: '20 uA', mathjsUnit: 'A' },
  { text: '20 uA', mathjs: '20 uA', mathjsUnit: 'A' },
  { text: '25 kHz', mathjs: '25 kHz', mathjsUnit: 'Hz' },
  { text: '-6 kV', mathjs: '-6 kV', mathjsUnit: 'V' },
  { text: '0.05 µF', mathjs: '0.05 uF', mathjsUnit: 'F' },
  { text: '1e-9', mathjs: '1e-9 F', mathjsUnit: 'F' },
  { text: '2.5 MΩ', mathjs: '2.5 Mohm', mathjsUnit: 'ohm' },
];

describe('parseQuantity', () => {
  it.each(cases)('reads "$text" as mathjs reads "$mathjs"', ({ text, mathjs, mathjsUnit }) => {
    const expected = mathUnit(mathjs).toNumber(mathjsUnit);
    expect(parseQuantity(text)).toBeCloseTo(expected, 12 - Math.ceil(Math.log10(Math.abs(expected))));
    expect(Math.abs(parseQuantity(text) - expected) / Math.abs(expected)).toBeLessThan(1e-12);
  });

  it('keeps the unit the text carried', () => {
    expect(parseQuantityWithUnit('1.5 kV')).toEqual({ valueSi: 1500, unit: 'V' });
    expect(parseQuantityWithUnit('4n7').unit).toBeNull();
    expect(parseQuantityWithUnit('2k2 Ω').unit).toBe('Ohm');
  });

  it.each(['', 'abc', '4.7 q', '1..2', '5 kk', 'nF', '4n7n', '--3'])('rejects "%s" with invalid_quantity', (text) => {
    let caught: unknown;
    try {
      parseQuantity(text, { field: 'multiplier.capacitors[0].valueF' });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(DomainError);
    const error = caught as DomainError;
    expect(error.code).toBe('invalid_quantity');
    expect(error.field).toBe('multiplier.capacitors[0].valueF');
    expect(error.message).toMatch(/expected a number/);
  });

  it('rejects a unit that is not the one the field expects', () => {
    expect(() => parseQuantity('10 kV', { unit: 'F' })).toThrow(/unit V given where F is expected/);
  });
});
