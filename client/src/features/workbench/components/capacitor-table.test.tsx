import { useState } from 'react';
import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { CapacitorPart, Topology } from '@ladderwright/shared/designs';
import { renderWithApp } from '../../../testing/render';
import { CapacitorTable } from './capacitor-table';

function capacitors(values: number[]): CapacitorPart[] {
  return values.map((valueF) => ({ valueF, tolerance: 0.1, ratedVoltageV: 2000 }));
}

function Harness({ topology, initial }: { topology: Topology; initial: CapacitorPart[] }) {
  const [caps, setCaps] = useState(initial);
  return (
    <>
      <CapacitorTable topology={topology} capacitors={caps} onChange={setCaps} issues={{}} />
      <output aria-label="values">{caps.map((c) => c.valueF).join(',')}</output>
    </>
  );
}

function values(): number[] {
  return (screen.getByLabelText('values').textContent ?? '').split(',').map(Number);
}

// Typing and picking through Mantine inputs takes a few seconds per case when the machine is shared.
describe('CapacitorTable', { timeout: 20_000 }, () => {
  it('fills down: C2 typed with a prefix is copied to every capacitor above it, not below', () => {
    renderWithApp(<Harness topology="half-wave" initial={capacitors([1e-9, 1e-9, 1e-9, 1e-9])} />);

    fireEvent.change(screen.getByLabelText('C2 capacitance'), { target: { value: '4n7' } });
    fireEvent.click(screen.getByRole('button', { name: 'Fill down from C2' }));

    expect(values()).toEqual([1e-9, 4.7e-9, 4.7e-9, 4.7e-9]);
    expect(screen.getByLabelText('C4 capacitance')).toHaveValue('4.7 nF');
  });

  it('grades a four-cell half-wave ladder (2 stages): stage 1 gets 2 × C, stage 2 gets 1 × C', async () => {
    renderWithApp(<Harness topology="half-wave" initial={capacitors([1e-9, 1e-9, 1e-9, 1e-9])} />);

    fireEvent.click(screen.getByRole('button', { name: 'Grade capacitors…' }));
    fireEvent.change(await screen.findByLabelText('Top-stage capacitance'), { target: { value: '2n2' } });
    fireEvent.click(screen.getByRole('button', { name: 'Apply grading', hidden: true }));

    expect(values()).toEqual([4.4e-9, 4.4e-9, 2.2e-9, 2.2e-9]);
  });

  it('grades a two-stage full-wave cascade by stage: three capacitors per stage', async () => {
    renderWithApp(<Harness topology="full-wave" initial={capacitors([1e-9, 1e-9, 1e-9, 1e-9, 1e-9, 1e-9])} />);

    fireEvent.click(screen.getByRole('button', { name: 'Grade capacitors…' }));
    fireEvent.change(await screen.findByLabelText('Top-stage capacitance'), { target: { value: '10n' } });
    fireEvent.click(screen.getByRole('button', { name: 'Apply grading', hidden: true }));

    expect(values()).toEqual([20e-9, 20e-9, 20e-9, 10e-9, 10e-9, 10e-9]);
    expect(screen.getAllByText(/^stage 1, /)).toHaveLength(3);
  });
});
