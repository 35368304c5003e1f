import { describe, expect, it } from 'vitest';
import { isDomainError } from '../errors';
import { readMeasurementTable } from './read-measurement-table';

const rows = (text: string) => text.split('\n').map((line) => line.split(','));

function issuesOf(action: () => unknown): { path: string; message: string }[] {
  try {
    action();
  } catch (error) {
    if (isDomainError(error)) return error.issues;
    throw error;
  }
  throw new Error('expected a DomainError');
}

describe('readMeasurementTable', () => {
  // Unit factors are SI prefixes; comparisons to 12 digits (a product of two exact decimals).
  it.each([
    ['time,voltage\n0,100\n0.001,101', { x: 1e-3, y: 101 }, 's', 'V'],
    ['t (s),V (V)\n0,100\n0.001,101', { x: 1e-3, y: 101 }, 's', 'V'],
    ['Time [ms], CH1 [kV]\n0,-6.1\n2.5,-6.2', { x: 2.5e-3, y: -6200 }, 'ms', 'kV'],
    ['time (us),voltage (mV)\n0,5\n10,7', { x: 10e-6, y: 7e-3 }, 'us', 'mV'],
  ])('reads %j', (text, secondPoint, xUnit, yUnit) => {
    const table = readMeasurementTable(rows(text), 'scope-capture');
    expect(table.points).toHaveLength(2);
    expect(table.points[1]?.x).toBeCloseTo(secondPoint.x, 12);
    expect(table.points[1]?.y).toBeCloseTo(secondPoint.y, 9);
    expect(table.x.unit).toBe(xUnit);
    expect(table.y.unit).toBe(yUnit);
  });

  it('keeps metadata lines above the header and counts file lines from 1', () => {
    const table = readMeasurementTable(
      rows('Instrument,bench scope 2\nProbe,1000:1\n\nTime [ms],CH1 [kV]\n0,1\n1,2'),
      'scope-capture',
    );
    expect(table.metadata).toEqual(['Instrument, bench scope 2', 'Probe, 1000:1']);
    expect(table.headerLine).toBe(4);
  });

  it('reads a load sweep with the current in microamps', () => {
    const table = readMeasurementTable(rows('current (uA),voltage (kV)\n0,6.0\n20,5.8'), 'load-sweep');
    expect(table.points[1]?.x).toBeCloseTo(20e-6, 15);
    expect(table.points[1]?.y).toBeCloseTo(5800, 9);
  });

  it('names the line and column of a bad number', () => {
    const issues = issuesOf(() => readMeasurementTable(rows('time,voltage\n0,1\n1,abc\n2,'), 'scope-capture'));
    expect(issues.map((issue) => issue.path)).toEqual(['line 3, column voltage', 'line 4, column voltage']);
    expect(issues[0]?.message).toContain("'abc' is not a number");
    expect(issues[1]?.message).toContain('empty');
  });

  it('refuses an unknown unit in the header', () => {
    const issues = issuesOf(() => readMeasurementTable(rows('Time [ms],CH1 [kW]\n0,1\n1,2'), 'scope-capture'));
    expect(issues[0]?.path).toBe('line 1, column CH1 [kW]');
    expect(issues[0]?.message).toContain("unit 'kW' is not a voltage unit");
  });

  it('refuses a file without the columns the kind needs', () => {
    expect(() => readMeasurementTable(rows('time,voltage\n0,1\n1,2'), 'load-sweep')).toThrow(
      /No header row with current and voltage/,
    );
  });

  it('refuses time that runs backwards in a capture', () => {
    const issues = issuesOf(() => readMeasurementTable(rows('time,voltage\n0,1\n2,1\n1,1'), 'scope-capture'));
    expect(issues[0]).toEqual({ path: 'line 4, column time', message: 'line 4, column time: time runs backwards' });
  });

  it('needs two data rows', () => {
    expect(() => readMeasurementTable(rows('time,voltage\n0,1'), 'scope-capture')).toThrow(/at least two data rows/);
  });
});
