import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { CapacitorPart } from '@ladderwright/shared/designs';
import { renderWithApp } from '../../../../testing/render';
import { placeLabel, resizeCapacitors, roleChanges } from '../../ladder-edits';
import { CapacitorMoveDialog } from './capacitor-move-dialog';

const tripler: CapacitorPart[] = [10e-9, 4.7e-9, 22e-9].map((valueF) => ({
  valueF,
  tolerance: 0.1,
  ratedVoltageV: 1000,
}));

// A half-wave tripler grown to four cells: every capacitor keeps its number but changes column.
const changes = roleChanges(
  { topology: 'half-wave', capacitors: tripler },
  { topology: 'half-wave', capacitors: resizeCapacitors(tripler, 4) },
);

function renderDialog() {
  const onCancel = vi.fn();
  const onApply = vi.fn();
  renderWithApp(
    <CapacitorMoveDialog
      cellCount={4}
      isFullWave={false}
      topologyLabel="half-wave cascade"
      changes={changes}
      onCancel={onCancel}
      onApply={onApply}
    />,
  );
  return { onCancel, onApply };
}

describe('CapacitorMoveDialog', { timeout: 20_000 }, () => {
  it('names every capacitor that moves, with its value, rating and both places', async () => {
    renderDialog();
    const list = await screen.findByRole('list', { name: 'Capacitors that move' });
    const items = within(list).getAllByRole('listitem');
    expect(changes.length).toBeGreaterThan(0);
    expect(items).toHaveLength(changes.length);
    const first = changes[0]!;
    expect(items[0]!.textContent).toContain(`C${first.index + 1} (10 nF, rated 1 kV)`);
    expect(items[0]!.textContent).toContain(`${placeLabel(first.from)} → ${placeLabel(first.to)}`);
    expect(placeLabel(first.from)).not.toBe(placeLabel(first.to));
    expect(screen.getByText(/With 4 cells \(half-wave cascade\)/)).toBeTruthy();
  });

  it('applies moved or kept places, or cancels, as the engineer chooses', async () => {
    const { onCancel, onApply } = renderDialog();
    fireEvent.click(await screen.findByRole('button', { name: 'Move them' }));
    expect(onApply).toHaveBeenLastCalledWith(false);
    fireEvent.click(screen.getByRole('button', { name: 'Keep values at their places' }));
    expect(onApply).toHaveBeenLastCalledWith(true);
    fireEvent.click(screen.getByRole('button', { name: 'Cancel' }));
    expect(onCancel).toHaveBeenCalledTimes(1);
  });
});
