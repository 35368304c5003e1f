import { describe, expect, it } from 'vitest';
import { priorInputScale } from './calibration-panel';
import { formatParameterValue } from '@ladderwright/shared/api';
import { calibrationCurveRows } from './calibration-result';

describe('priorInputScale', () => {
  // SI prefixes (BIPM, The International System of Units, 9th ed., Table 7; common practice).
  it.each([
    ['A', 2e-7, 1e-9, 'nA'],
    ['F', 20e-12, 1e-12, 'pF'],
    ['Ω', 123e6, 1e6, 'MΩ'],
    ['Ω', 3, 1, 'Ω'],
    ['', 500, 1, ''],
  ])('types a %s range up to %s in units of %s (%s)', (unit, max, factor, label) => {
    const scale = priorInputScale(unit, max);
    expect(scale.factor).toBeCloseTo(factor, 20);
    expect(scale.label).toBe(label);
  });
});

describe('calibrationCurveRows', () => {
  it('sorts the overlay rows by x and keeps measured, predicted and calibrated together', () => {
    const rows = calibrationCurveRows({
      benchRunId: 'a',
      label: 'run',
      use: 'load-sweep',
      x: [2e-6, 0],
      measuredV: [900, 1000],
      predictedV: [910, 1005],
      calibratedV: [901, 999],
    });
    expect(rows).toEqual([
      { x: 0, measuredV: 1000, predictedV: 1005, calibratedV: 999 },
      { x: 2e-6, measuredV: 900, predictedV: 910, calibratedV: 901 },
    ]);
  });
});

describe('formatParameterValue', () => {
  it('writes resistances with a prefix and plain numbers to four figures, without trailing zeros', () => {
    expect(formatParameterValue(82e6, 'Ω')).toBe('82 MΩ');
    expect(formatParameterValue(0.95, '')).toBe('0.95');
    expect(formatParameterValue(100, '')).toBe('100');
    expect(formatParameterValue(76.2849, '')).toBe('76.28');
  });
});
