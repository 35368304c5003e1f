import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { BenchRunDetail } from '@ladderwright/shared/api';
import { compareBenchRun } from '@ladderwright/shared/bench';
import { renderWithApp } from '../../../testing/render';
import { BenchOverlay, loadSweepRows } from './bench-overlay';

// The hand-checked case of shared/src/bench: line 1000 V -> 800 V over 0..200 µA; measured 940 V at
// 50 µA (−1.05 %), 830 V at 150 µA (−2.35 %), 700 V at 250 µA (beyond the curve).
const points = [
  { x: 50e-6, y: 940 },
  { x: 150e-6, y: 830 },
  { x: 250e-6, y: 700 },
];
const comparison = compareBenchRun(
  'load-sweep',
  points,
  {
    regulation: [
      { x: 0, y: 1000 },
      { x: 200e-6, y: 800 },
    ],
    outputMeanV: 900,
    ripplePeakToPeakV: 10,
    loadCurrentA: 1e-4,
  },
  0.025,
);
const run: BenchRunDetail = {
  id: 'run-1',
  designId: 'design-1',
  revisionNumber: 2,
  kind: 'load-sweep',
  title: 'Prototype 2',
  tolerance: 0.025,
  pointCount: 3,
  verdict: comparison.verdict,
  marginPct: comparison.marginPct,
  worstDeviation: comparison.worstDeviation,
  files: [],
  uploadedById: 'user-1',
  uploadedByName: 'Northfold Engineer',
  createdAt: '2026-01-01T00:00:00.000Z',
  points,
  comparison,
  metadata: [],
};

describe('BenchOverlay', () => {
  it('shows the deviation per point and the verdict as a word with its margin', () => {
    renderWithApp(<BenchOverlay run={run} />);
    const rows = screen.getByRole('table', { name: 'Deviation per point' }).querySelectorAll('tbody tr');
    expect([...rows].map((row) => row.lastElementChild?.textContent)).toEqual(['-1.05 %', '-2.35 %', 'not compared']);
    // (0.025 − 0.0235294)/0.025 = 5.88 % -> marginal.
    expect(screen.getAllByLabelText('marginal, margin 5.9 %')[0]?.textContent).toBe('!marginal · margin 5.9 %');
  });
});

describe('loadSweepRows', () => {
  it('cuts the predicted curve at 1.15 × the largest measured current, interpolating its end', () => {
    // A straight regulation line 1000 V -> 0 V at a 5 mA short circuit; points measured up to 200 µA.
    const rows = loadSweepRows({
      predictedCurve: [
        { x: 0, y: 1000 },
        { x: 1e-4, y: 980 },
        { x: 5e-3, y: 0 },
      ],
      points: [
        { x: 5e-5, measuredV: 985, predictedV: 990, deviation: -0.005 },
        { x: 2e-4, measuredV: 955, predictedV: 960, deviation: -0.005 },
      ],
    });
    const largestA = Math.max(...rows.map((row) => row.currentA));
    expect(largestA).toBeCloseTo(2.3e-4, 12);
    // On the line from (100 µA, 980 V) to (5 mA, 0 V): 980 − 980·(130 µA / 4.9 mA).
    const end = rows.find((row) => 'predictedV' in row && row.currentA === largestA);
    expect(end && 'predictedV' in end ? end.predictedV : NaN).toBeCloseTo(980 - (980 * 1.3e-4) / 4.9e-3, 9);
    expect(rows.filter((row) => 'measuredV' in row)).toHaveLength(2);
  });
});
