import { describe, expect, it } from 'vitest';
import { chartCsv, chartFileName } from './chart-export';

describe('chartCsv', () => {
  it('writes a header line and one CRLF-ended line per row, numbers in full precision (RFC 4180)', () => {
    const csv = chartCsv(
      [
        { key: 't', header: 'Time (s)' },
        { key: 'v', header: 'output (V)' },
      ],
      [
        { t: 0.0012345678901234567, v: -2901.25 },
        { t: 0.001, v: -2899.5 },
      ],
    );
    expect(csv).toBe('Time (s),output (V)\r\n0.0012345678901234567,-2901.25\r\n0.001,-2899.5\r\n');
  });

  it('leaves a missing or non-finite value empty and quotes a header with a comma or a quote', () => {
    const csv = chartCsv(
      [
        { key: 'x', header: 'Load current (A)' },
        { key: 'a', header: 'predicted, mean (V)' },
        { key: 'b', header: 'the "measured" (V)' },
      ],
      [
        { x: 5e-5, a: 950 },
        { x: 1e-4, b: Number.NaN },
      ],
    );
    expect(csv.split('\r\n')).toEqual([
      'Load current (A),"predicted, mean (V)","the ""measured"" (V)"',
      '0.00005,950,',
      '0.0001,,',
      '',
    ]);
  });

  it('keeps a header from being read as a spreadsheet formula (OWASP CSV injection)', () => {
    expect(chartCsv([{ key: 'x', header: '=cmd()' }], [])).toBe("'=cmd()\r\n");
  });
});

describe('chartFileName', () => {
  it('turns a title into a lower-case hyphenated name', () => {
    expect(chartFileName('Output vs load current (driver and ladder)')).toBe(
      'output-vs-load-current-driver-and-ladder',
    );
    expect(chartFileName('Prototype 2: load sweep against prediction')).toBe(
      'prototype-2-load-sweep-against-prediction',
    );
    expect(chartFileName('  ')).toBe('chart');
  });
});
