import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { CheckVerdict } from '@ladderwright/shared/safety';
import { renderWithApp } from '../../../testing/render';
import { ChecksTable, checkRowCounts } from './checks-table';

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
  it('writes each verdict as a word with its margin in words, worst first', () => {
    renderWithApp(<ChecksTable checks={checks} />);
    const rows = within(screen.getByRole('table', { name: 'Checks' }))
      .getAllByRole('row')
      .slice(1);

    expect(rows.map((row) => within(row).getAllByRole('cell')[0]?.textContent)).toEqual([
      '✕fail · unbounded',
      '!marginal · 8.3 % below the limit',
      '✓pass · 43 % below the limit',
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

  it('gives one row to a limit that two standards set, naming both', () => {
    const stored = (id: string, rule: string): CheckVerdict => ({
      id,
      subject: 'output (all stored energy)',
      rule,
      verdict: 'fail',
      marginPct: -2086,
      value: 984e-6,
      limit: 45e-6,
      unit: 'C',
    });
    renderWithApp(
      <ChecksTable
        checks={[
          stored('stored-output-iec61010', 'IEC 61010-1 (from memory): 45 µC up to 15 kV'),
          stored('stored-output-iec60335', 'IEC 60335-1 8.1.4 (read): 45 µC for 450 V–15 kV'),
        ]}
      />,
    );
    const rows = within(screen.getByRole('table', { name: 'Checks' }))
      .getAllByRole('row')
      .slice(1);
    expect(rows).toHaveLength(1);
    expect(rows[0]?.textContent).toContain('IEC 61010-1 (from memory)');
    expect(rows[0]?.textContent).toContain('IEC 60335-1 8.1.4 (read)');
    expect(rows[0]?.textContent).toContain('fail · 22× the limit');
  });

  it('counts a limit that two standards set once, as its table shows it', () => {
    const stored = (id: string): CheckVerdict => ({
      id,
      subject: 'output (all stored energy)',
      rule: `${id}: 45 µC`,
      verdict: 'fail',
      marginPct: -2086,
      value: 984e-6,
      limit: 45e-6,
      unit: 'C',
    });
    expect(checkRowCounts([...checks, stored('iec61010'), stored('iec60335')])).toBe('2 fail · 1 marginal · 1 pass');
  });
});
