import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { BenchRunDetail } from '@ladderwright/shared/api';
import { compareBenchRun } from '@ladderwright/shared/bench';
import { renderWithApp } from '../../../testing/render';
import { BenchOverlay } from './bench-overlay';

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
    expect(screen.getAllByLabelText('marginal, margin 5.9 %')[0]?.textContent).toBe('marginal · margin 5.9 %');
  });
});
