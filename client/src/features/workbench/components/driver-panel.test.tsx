import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { designExamples } from '@ladderwright/shared/designs';
import { analyzeDesign } from '@ladderwright/shared/multiplier';
import { formatQuantity } from '@ladderwright/shared/units';
import { renderWithApp } from '../../../testing/render';
import { DriverPanel } from './driver-panel';

describe('DriverPanel', () => {
  it('shows the surface-charge tester’s driver figures, operating point and battery life from the engine report', () => {
    const driver = analyzeDesign(designExamples.surfaceChargeTester).driver!;
    renderWithApp(<DriverPanel driver={driver} />);
    const table = screen.getByRole('table', { name: 'Driver figures' });
    expect(within(table).getByText(formatQuantity(driver.figures.frequencyHz.value, 'Hz'))).toBeTruthy();
    expect(screen.getByText(`output at the rated load ${formatQuantity(driver.operatingPoint.ratedLoad.outputV, 'V')}`)).toBeTruthy();
    expect(screen.getByText(/battery life to/).textContent).toContain(`${(driver.batteryLife!.lifeS.value / 3600).toFixed(1)} h`);
    expect(screen.getByRole('button', { name: 'How frequency is computed' })).toBeTruthy();
  });
});
