import { fireEvent, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithApp } from '../../../testing/render';
import { MethodNote } from './method-note';

const method = {
  methodId: 'charge-transfer-v1',
  summary: 'steady-state charge transfer per cycle',
  assumptions: ['ideal diodes'],
  source: 'a textbook',
};

describe('MethodNote', () => {
  it('opens on the method in words and leaves the engine’s id for last, labelled', async () => {
    renderWithApp(<MethodNote subject="output" method={method} note="estimate 1 kV (−2 %)" />);
    fireEvent.click(screen.getByRole('button', { name: 'How output is computed' }));
    const summary = await screen.findByText(method.summary);
    const id = screen.getByText(method.methodId);
    const lines = [...summary.parentElement!.children].map((line) => line.textContent);
    expect(lines[0]).toBe(method.summary);
    expect(lines.at(-1)).toBe(`Method id ${method.methodId}`);
    expect(id.closest('p')?.textContent).toBe(`Method id ${method.methodId}`);
    expect(screen.getByText('estimate 1 kV (−2 %)')).toBeInTheDocument();
  });
});
