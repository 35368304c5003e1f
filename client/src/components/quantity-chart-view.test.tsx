import { fireEvent, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithApp } from '../testing/render';
import { QuantityChartView } from './quantity-chart-view';
import type { QuantityChartProps } from './quantity-chart.types';

/** A charging curve sampled every millisecond for 20 ms that settles by 2 ms (invented: the view is tested, not values). */
const rows = Array.from({ length: 21 }, (_, i) => ({ t: i * 1e-3, v: 1000 * (1 - Math.exp(-i * 2.5)) }));

function chart(overrides: Partial<QuantityChartProps> = {}) {
  return (
    <QuantityChartView
      label="Start-up"
      title="Start-up"
      heightPx={200}
      data={rows}
      x={{ key: 't', title: 'Time', unit: 's', includesZero: true }}
      y={{ title: 'Output', unit: 'V' }}
      series={[{ key: 'v', name: 'ladder top', color: 'black' }]}
      markers={[
        { key: '90', label: 'time to 90 % (1 ms)', tag: '90 %', x: 1e-3, color: 'orange' },
        { key: '1', label: 'time to within 1 % (2 ms)', tag: '1 %', x: 2e-3, color: 'blue', isDotted: true },
      ]}
      isZoomable
      {...overrides}
    />
  );
}

describe('QuantityChartView', () => {
  it('opens on its first view, widens to every sample with Show all and comes back with Reset zoom', () => {
    renderWithApp(chart({ firstViewXEnd: 3e-3 }));
    expect(screen.getByRole('button', { name: 'Show all' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Reset zoom' })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Show all' }));
    expect(screen.queryByRole('button', { name: 'Show all' })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Reset zoom' }));
    expect(screen.getByRole('button', { name: 'Show all' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Reset zoom' })).toBeNull();
  });

  it('shows every sample at first without a first view, or when the first view would hold them all', () => {
    renderWithApp(chart());
    expect(screen.queryByRole('button', { name: 'Show all' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Reset zoom' })).toBeNull();
    renderWithApp(chart({ firstViewXEnd: 0.05 }));
    expect(screen.queryByRole('button', { name: 'Show all' })).toBeNull();
  });

  it('names each mark in the key, the second drawn dotted so that they differ by more than colour', () => {
    renderWithApp(chart());
    const key = screen.getByLabelText('Chart key');
    expect(within(key).getByText('time to 90 % (1 ms)')).toBeTruthy();
    expect(within(key).getByText('time to within 1 % (2 ms)')).toBeTruthy();
    const dashes = [...key.querySelectorAll('line')].map((line) => line.getAttribute('stroke-dasharray'));
    expect(dashes).toEqual([null, '4 3', '1 3']);
  });
});
