import { describe, expect, it } from 'vitest';
import { axisScale, quantityTickFormatter, tickSignificantFigures } from './tick-format';

describe('tickSignificantFigures', () => {
  it.each([
    { min: 0, max: -6000, figures: 2 },
    { min: -6000, max: -5000, figures: 3 },
    { min: 954, max: 955, figures: 5 },
    { min: 1.96e-3, max: 2e-3, figures: 4 },
    { min: 0, max: 0, figures: 3 },
    { min: 5, max: 5, figures: 8 },
  ])('gives $figures figures over [$min, $max]', ({ min, max, figures }) => {
    expect(tickSignificantFigures(min, max)).toBe(figures);
  });
});

describe('quantityTickFormatter', () => {
  it('tells the ticks of a 1 V ripple around 954 V apart', () => {
    const format = quantityTickFormatter([954.1, 954.6, 955.05], 'V');
    const ticks = [954, 954.25, 954.5, 954.75, 955].map(format);
    expect(ticks).toEqual(['954 V', '954.25 V', '954.5 V', '954.75 V', '955 V']);
    expect(new Set(ticks).size).toBe(ticks.length);
  });

  it('keeps short ticks on a wide span', () => {
    const format = quantityTickFormatter([0, -3000, -6000], 'V');
    expect([0, -1500, -3000, -4500, -6000].map(format)).toEqual(['0 V', '-1.5 kV', '-3 kV', '-4.5 kV', '-6 kV']);
  });

  it('tells the time ticks of the last drive period apart', () => {
    const format = quantityTickFormatter([1.96e-3, 2e-3], 's');
    expect([1.96e-3, 1.97e-3, 1.98e-3, 1.99e-3, 2e-3].map(format)).toEqual([
      '1.96 ms',
      '1.97 ms',
      '1.98 ms',
      '1.99 ms',
      '2 ms',
    ]);
  });

  it('ignores non-finite samples when it reads the span', () => {
    const format = quantityTickFormatter([NaN, 954, Infinity, 955], 'V');
    expect(format(954.5)).toBe('954.5 V');
  });
});

describe('axisScale', () => {
  it.each([
    // The prefix puts the axis' largest magnitude in 1 … 1000; ticks are plain numbers in that unit.
    {
      values: [0, 2e-3],
      unit: 's',
      label: 'ms',
      ticks: [0, 2.5e-4, 1e-3 - 2.5e-6, 2e-3], // 1e-3 − 2.5e-6 is 0.0009975000000000001 in binary
      text: ['0', '0.25', '1', '2'],
    },
    { values: [0, 7.5e-3], unit: 'A', label: 'mA', ticks: [0, 2.5e-3, 7.5e-3], text: ['0', '2.5', '7.5'] },
    { values: [0, 2.5e-4], unit: 'A', label: 'µA', ticks: [0, 5e-5, 2.5e-4], text: ['0', '50', '250'] },
    { values: [954.1, 955.05], unit: 'V', label: 'V', ticks: [954, 954.25, 955], text: ['954', '954.25', '955'] },
    { values: [0, -6000], unit: 'V', label: 'kV', ticks: [0, -1500, -6000], text: ['0', '-1.5', '-6'] },
    { values: [1.96e-3, 2e-3], unit: 's', label: 'ms', ticks: [1.96e-3, 1.97e-3], text: ['1.96', '1.97'] },
    { values: [1, 20], unit: '', label: '', ticks: [1, 5, 20], text: ['1', '5', '20'] },
  ] as const)('labels $values in $label', ({ values, unit, label, ticks, text }) => {
    const scale = axisScale(values, unit);
    expect(scale.unitLabel).toBe(label);
    expect(ticks.map(scale.format)).toEqual(text);
  });

  it('never prints a float artefact or an exponent', () => {
    const scale = axisScale([0, 1e-3], 's');
    for (let k = 0; k <= 40; k += 1) expect(scale.format(k * 0.025e-3)).toMatch(/^-?\d+(\.\d{1,3})?$/);
  });
});
