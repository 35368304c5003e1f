import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { designExamples } from '@ladderwright/shared/designs';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { formatQuantity } from '@ladderwright/shared/units';
import { renderWithApp } from '../../../testing/render';
import { DriverPanel } from './driver-panel';

describe('DriverPanel', () => {
  it('shows the surface-charge tester’s driver figures, operating point and battery life from the engine report', () => {
    const driver = analyzeDesign(designExamples.surfaceChargeTester).driver!;
    renderWithApp(<DriverPanel driver={driver} />);
    const table = screen.getByRole('table', { name: 'Driver figures' });
    expect(within(table).getByText(formatQuantity(driver.figures.frequencyHz.value, 'Hz'))).toBeTruthy();
    expect(
      screen.getByText(`output at the rated load ${formatQuantity(driver.operatingPoint.ratedLoad.outputV, 'V')}`),
    ).toBeTruthy();
    expect(screen.getByText(/battery life to/).textContent).toContain(
      `${(driver.batteryLife!.lifeS.value / 3600).toFixed(1)} h`,
    );
    expect(screen.getByRole('button', { name: 'How frequency is computed' })).toBeTruthy();
  });

  it('shows one efficiency: the figures table and the power balance carry the rated-load figure', () => {
    const driver = analyzeDesign(designExamples.surfaceChargeTester).driver!;
    renderWithApp(<DriverPanel driver={driver} />);
    const percent = `${(driver.energy.efficiency * 100).toFixed(1)} %`;
    expect(within(screen.getByRole('table', { name: 'Driver figures' })).getByText(percent)).toBeTruthy();
    expect(screen.getByText(/at the rated load: in/).textContent).toContain(`efficiency ${percent}`);
    const losses = screen.getByRole('table', { name: 'Losses' });
    expect(within(losses).getByText('bleeder')).toBeTruthy();
    expect(within(losses).getByText(formatQuantity(driver.energy.losses.bleeder, 'W'))).toBeTruthy();
  });

  it('draws the operating curve with the power-limit onset and the rated load named beside it', () => {
    const driver = analyzeDesign(designExamples.surfaceChargeTester).driver!;
    const op = driver.operatingPoint;
    renderWithApp(<DriverPanel driver={driver} />);
    expect(screen.getByRole('figure', { name: 'Driver output vs load current' })).toBeTruthy();
    const note = screen.getByText(/Rated load/);
    expect(note.textContent).toContain(formatQuantity(op.ratedLoad.loadCurrentA, 'A'));
    expect(note.textContent).toContain(`${op.ratedLoad.limitedBy}-limited`);
    if (op.powerLimitOnsetA > 0)
      expect(note.textContent).toContain(`up to ${formatQuantity(op.powerLimitOnsetA, 'A')}`);
    else expect(note.textContent).toContain('Power-limited at every load');
    expect(screen.getByRole('button', { name: 'How the driver operating curve is computed' })).toBeTruthy();
  });

  it('opens the operating curve near the rated load and switches to the whole curve', () => {
    const driver = analyzeDesign(designExamples.surfaceChargeTester).driver!;
    const op = driver.operatingPoint;
    // The tester's 2 µA rated load against a curve that runs to the supply's limit: drawn whole, the rated-load mark
    // would sit against the y-axis.
    expect(op.ratedLoad.loadCurrentA / (op.curve.at(-1)?.loadCurrentA ?? 0)).toBeLessThan(0.1);
    renderWithApp(<DriverPanel driver={driver} />);
    const figure = screen.getByRole('figure', { name: 'Driver output vs load current' });
    fireEvent.click(within(figure).getByRole('button', { name: 'Whole curve' }));
    expect(within(figure).getByRole('button', { name: 'Near the load' })).toBeTruthy();
  });
});
