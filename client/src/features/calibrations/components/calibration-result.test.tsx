import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Calibration } from '@ladderwright/shared/api';
import type { CalibrationResult, FittedParameter } from '@ladderwright/shared/calibration';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { CalibrationList } from './calibration-list';
import { CalibrationResultView } from './calibration-result';

const coupling: FittedParameter = {
  id: 'couplingCoefficient',
  label: 'Transformer coupling k',
  unit: '',
  prior: { min: 0.85, max: 0.999 },
  initialValue: 0.98,
  value: 0.951,
  interval: { low: 0.947, high: 0.955 },
  intervalMethod: 'profile',
  isAtBound: false,
};

const gain: FittedParameter = {
  ...coupling,
  id: 'transistorGain',
  label: 'Transistor current gain hFE',
  prior: { min: 20, max: 500 },
  initialValue: 150,
  value: 81.2,
  interval: { low: 76.5, high: 86.0 },
  intervalMethod: 'linearized',
};

function resultWith(parameters: FittedParameter[]): CalibrationResult {
  return {
    parameters,
    correlation: parameters.map((_, i) => parameters.map((__, j) => (i === j ? 1 : 0.2))),
    warnings: [],
    residuals: [],
    curves: [],
    costBefore: 1,
    costAfter: 0.01,
    degreesOfFreedom: 14,
    confidence: 0.95,
    iterations: 6,
    evaluations: 40,
    isConverged: true,
  };
}

function methodCellOf(label: string): string {
  const table = screen.getByRole('table', { name: 'Fitted parameters' });
  const header = within(table).getAllByRole('columnheader');
  const column = header.findIndex((cell) => cell.textContent === 'Interval from');
  const row = within(table).getByRole('row', { name: new RegExp(label) });
  return within(row).getAllByRole('cell')[column]?.textContent ?? '';
}

describe('CalibrationResultView', () => {
  it('names how each interval was found beside the fitted value', () => {
    renderWithApp(<CalibrationResultView result={resultWith([coupling, gain])} />);
    expect(methodCellOf('Transformer coupling k')).toBe('profile likelihood');
    expect(methodCellOf('Transistor current gain hFE')).toBe('Jacobian, linearized');
    const table = screen.getByRole('table', { name: 'Fitted parameters' });
    expect(within(table).getByRole('row', { name: /Transformer coupling k/ })).toHaveTextContent('0.947 to 0.955');
  });

  it('reads a result stored before profiles as Jacobian intervals, and gives no method without an interval', () => {
    const { intervalMethod: _, ...stored } = coupling;
    renderWithApp(<CalibrationResultView result={resultWith([stored, { ...gain, interval: null }])} />);
    expect(methodCellOf('Transformer coupling k')).toBe('Jacobian, linearized');
    expect(methodCellOf('Transistor current gain hFE')).toBe('—');
  });
});

describe('CalibrationList (Sign-off)', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('writes each fitted value with its interval and the interval method', async () => {
    const calibration: Calibration = {
      id: 'c1',
      jobId: 'j1',
      designId: 'd1',
      revisionNumber: 2,
      status: 'succeeded',
      progressPct: 100,
      input: {
        parameters: [{ id: 'couplingCoefficient', prior: coupling.prior }],
        runs: [{ benchRunId: 'b1', use: 'collector-waveform', label: 'Collector capture', pointCount: 64 }],
        confidence: 0.95,
      },
      requestedBy: null,
      requestedByName: 'Engineer',
      createdAt: '2026-12-05T10:00:00Z',
      finishedAt: '2026-12-05T10:01:00Z',
      result: resultWith([coupling]),
      draftRevisionNumber: null,
    };
    const fetch = vi.fn(() => Promise.resolve(jsonResponse([calibration])));
    vi.stubGlobal('fetch', fetch);
    renderWithApp(<CalibrationList projectId="p1" designId="d1" revisionNumber={2} />);
    const table = await screen.findByRole('table', { name: 'Calibrations' });
    expect(table).toHaveTextContent(
      'Transformer coupling k 0.951 (0.947 to 0.955, profile likelihood) (95 % intervals)',
    );
  });
});
