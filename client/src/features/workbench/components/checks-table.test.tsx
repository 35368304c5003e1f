import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { CheckVerdict } from '@ladderwright/shared/safety';
import { renderWithApp } from '../../../testing/render';
import { ChecksTable } from './checks-table';

const checks: CheckVerdict[] = [
  {
    id: 'c1-voltage',
    subject: 'C1',
    rule: 'rated voltage, derated',
    verdict: 'pass',
    marginPct: 42.5,
    value: 920,
    limit: 1600,
    unit: 'V',
  },
  {
    id: 'd3-piv',
    subject: 'D3',
    rule: 'PIV against rating',
    verdict: 'marginal',
    marginPct: 8.25,
    value: 1835,
    limit: 2000,
    unit: 'V',
  },
  {
    id: 'discharge',
    subject: 'output',
    rule: 'time to the safe level',
    verdict: 'fail',
    marginPct: -150,
    value: null,
    limit: 60,
    unit: 's',
  },
];

describe('ChecksTable', () => {
  it('writes each verdict as a word with its signed margin, worst first', () => {
    renderWithApp(<ChecksTable checks={checks} />);
    const rows = within(screen.getByRole('table', { name: 'Checks' }))
      .getAllByRole('row')
      .slice(1);

    expect(rows.map((row) => within(row).getAllByRole('cell')[0]?.textContent)).toEqual([
      '✕fail −150.0 %',
      '!marginal +8.3 %',
      '✓pass +42.5 %',
    ]);
    expect(screen.getByText('1 fail · 1 marginal · 1 pass')).toBeInTheDocument();
  });

  it('shows values and limits in engineering notation and an unbounded value as such', () => {
    renderWithApp(<ChecksTable checks={checks} />);
    const table = screen.getByRole('table', { name: 'Checks' });

    expect(within(table).getByText('1.84 kV')).toBeInTheDocument();
    expect(within(table).getByText('2 kV')).toBeInTheDocument();
    expect(within(table).getByText('unbounded')).toBeInTheDocument();
  });
});
