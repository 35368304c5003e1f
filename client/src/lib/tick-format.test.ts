import { describe, expect, it } from 'vitest';
import { quantityAxis, quantityTickFormatter, roundStep, tickSignificantFigures } from './tick-format';

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

describe('roundStep', () => {
  it.each([
    { span: 2e-3, count: 5, step: 5e-4 },
    { span: 6.61e3, count: 5, step: 2e3 },
    { span: 442e-6, count: 5, step: 1e-4 },
    { span: 3.1e-5, count: 5, step: 1e-5 },
    { span: 1, count: 4, step: 0.25 },
  ])('cuts $span into about $count parts of $step', ({ span, count, step }) => {
    expect(roundStep(span, count)).toBeCloseTo(step, 15);
  });
});

describe('quantityAxis', () => {
  it.each([
    // The prefix puts the axis' largest magnitude in 1 … 1000; ticks are plain numbers on round steps.
    {
      values: [0, 1e-3 - 2.5e-6, 2e-3], // 1e-3 − 2.5e-6 is 0.0009975000000000001 in binary
      unit: 's',
      options: { isExact: true },
      label: 'ms',
      ticks: ['0.0', '0.5', '1.0', '1.5', '2.0'],
    },
    {
      values: [3e-5, 4.42e-4],
      unit: 'A',
      options: { includesZero: true },
      label: 'µA',
      ticks: ['0', '100', '200', '300', '400', '500'],
    },
    { values: [0, 7.5e-3], unit: 'A', options: {}, label: 'mA', ticks: ['0', '2', '4', '6', '8'] },
    {
      values: [954.1, 955.05],
      unit: 'V',
      options: {},
      label: 'V',
      ticks: ['954.0', '954.2', '954.4', '954.6', '954.8', '955.0', '955.2'],
    },
    { values: [0, -6000], unit: 'V', options: {}, label: 'kV', ticks: ['-6', '-4', '-2', '0'] },
    { values: [1, 20], unit: '', options: { isInteger: true }, label: '', ticks: ['0', '5', '10', '15', '20'] },
    { values: [1, 3], unit: '', options: { isInteger: true }, label: '', ticks: ['1', '2', '3'] },
  ] as const)('labels $values in $label', ({ values, unit, options, label, ticks }) => {
    const axis = quantityAxis(values, unit, options);
    expect(axis.unitLabel).toBe(label);
    expect(axis.ticks.map(axis.format)).toEqual(ticks);
    expect(axis.domain[0]).toBeLessThanOrEqual(Math.min(...values));
    expect(axis.domain[1]).toBeGreaterThanOrEqual(Math.max(...values));
  });

  it('never prints a float artefact or an exponent, nor "-0"', () => {
    const axis = quantityAxis([-1e-3, 1e-3 + 1e-12], 's');
    expect(axis.ticks.length).toBeGreaterThan(3);
    for (const tick of axis.ticks) expect(axis.format(tick)).toMatch(/^-?\d+(\.\d{1,3})?$/);
    expect(axis.format(-1e-19)).toBe('0.0');
  });

  it('ends a time axis at its samples and rounds a value axis out to the next tick', () => {
    expect(quantityAxis([4.1e-2, 4.16e-2], 's', { isExact: true }).domain).toEqual([4.1e-2, 4.16e-2]);
    expect(quantityAxis([3.1, 6.61e3], 'V', { includesZero: true }).domain).toEqual([0, 8000]);
  });
});
