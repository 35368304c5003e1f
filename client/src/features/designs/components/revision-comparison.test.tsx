import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { RevisionSummary } from '@ladderwright/shared/api';
import type { ComparedRevisions as Comparison } from '../api/compare-revisions';
import type { CheckVerdict } from '@ladderwright/shared/safety';
import { renderWithApp } from '../../../testing/render';
import { RevisionComparison } from './revision-comparison';

function revision(number: number, changeNote: string): RevisionSummary {
  return {
    number,
    state: 'draft',
    authorId: 'u-1',
    authorName: 'Northfold Engineer',
    createdAt: '2026-12-01T09:00:00.000Z',
    changeNote,
    baseRevisionNumber: number > 1 ? number - 1 : null,
    engineVersion: '1.3.0',
  };
}

function check(id: string, subject: string, verdict: CheckVerdict['verdict'], marginPct: number): CheckVerdict {
  return { id, subject, rule: 'invented rule for the test', verdict, marginPct, value: 1, limit: 1, unit: 'V' };
}

/** Two designs of one project (invented figures: the screen is tested for what it marks, not for the numbers). */
const comparison: Comparison = {
  a: revision(2, 'first cut'),
  b: revision(3, 'higher drive'),
  designs: { a: { id: 'd-a', name: 'Bias supply' }, b: { id: 'd-b', name: 'Hood cell' } },
  inputs: [
    { path: 'drive.peakV', a: 320, b: 400, delta: 80 },
    { path: 'drive.kind', a: 'sine', b: 'pulse' },
  ],
  results: [
    { key: 'outputMeanV', a: 950, b: 1180, delta: 230, deltaPct: 24.2 },
    { key: 'optimumStages', a: 38, b: 38, delta: 0, deltaPct: 0 },
  ],
  roleChanges: [],
  checks: {
    a: [
      check('creepage', 'Creepage at the output', 'pass', 40),
      check('working', 'Capacitor working voltage', 'pass', 20),
    ],
    b: [
      check('creepage', 'Creepage at the output', 'fail', -10),
      check('working', 'Capacitor working voltage', 'pass', 12),
    ],
  },
};

describe('RevisionComparison', () => {
  it('puts two designs side by side, naming each by design and revision', () => {
    renderWithApp(<RevisionComparison comparison={comparison} />);
    expect(within(screen.getByLabelText('Side A')).getByText('Bias supply r2')).toBeInTheDocument();
    expect(within(screen.getByLabelText('Side B')).getByText('Hood cell r3')).toBeInTheDocument();
  });

  it('lists the inputs that differ with both values and the difference', () => {
    renderWithApp(<RevisionComparison comparison={comparison} />);
    const inputs = screen.getByRole('table', { name: 'Inputs that differ (2)' });
    const rows = within(inputs).getAllByRole('row').slice(1);
    expect(rows.map((row) => [...row.querySelectorAll('td')].map((cell) => cell.textContent))).toEqual([
      ['Secondary peak', '320 V', '400 V', '+80 V'],
      ['Drive kind', 'sine', 'pulse', '—'],
    ]);
  });

  it('marks the headline results that changed and leaves the equal ones unmarked', () => {
    renderWithApp(<RevisionComparison comparison={comparison} />);
    const results = screen.getByRole('table', { name: 'Results' });
    const output = within(results).getByText('Output at load (mean)').closest('tr')!;
    const stages = within(results).getByText('Optimum stage count').closest('tr')!;
    expect(output).toHaveAttribute('data-changed', 'true');
    expect(output.textContent).toContain('changed');
    expect(output.textContent).toContain('+24.2 %');
    expect(stages).toHaveAttribute('data-changed', 'false');
    expect(stages.textContent).not.toContain('changed');
  });

  it('shows the Checks whose verdict differs, and the alike ones only on request', () => {
    renderWithApp(<RevisionComparison comparison={comparison} />);
    expect(screen.getByText('Checks: 1 with another verdict, 1 alike')).toBeInTheDocument();
    const checks = screen.getByRole('table', { name: 'Checks compared' });
    const creepage = within(checks).getByText('Creepage at the output').closest('tr')!;
    expect(creepage).toHaveAttribute('data-changed', 'true');
    expect(creepage.textContent).toMatch(/pass ·.*fail ·/);
    expect(within(checks).queryByText('Capacitor working voltage')).toBeNull();
    fireEvent.click(screen.getByLabelText('Show the alike ones too'));
    const working = within(checks).getByText('Capacitor working voltage').closest('tr')!;
    expect(working).toHaveAttribute('data-changed', 'false');
  });
});
