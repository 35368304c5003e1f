import { lazy, Suspense } from 'react';
import { Skeleton } from '@mantine/core';
import { ChartFrame } from './chart-frame';
import type { QuantityChartProps } from './quantity-chart.types';

// The chart library loads with the first chart shown (a tab's), never with the page that holds it.
const QuantityChartView = lazy(() =>
  import('./quantity-chart-view').then((module) => ({ default: module.QuantityChartView })),
);

/** A chart of quantities against a quantity in the shared chart frame (loaded on first show). */
export function QuantityChart(props: QuantityChartProps) {
  return (
    <Suspense
      fallback={
        <ChartFrame label={props.label} title={props.title} actions={props.actions} footer={props.footer}>
          <Skeleton height={props.heightPx} aria-label={`Loading ${props.title}`} />
        </ChartFrame>
      }
    >
      <QuantityChartView {...props} />
    </Suspense>
  );
}

/** Trace and mark colours of every chart (the theme's), in the order traces take them. */
export const chartColors = {
  traces: [
    'var(--mantine-primary-color-filled)',
    'var(--mantine-color-ember-7)',
    'var(--mantine-color-blue-6)',
    'var(--mantine-color-grape-6)',
    'var(--mantine-color-indigo-8)',
    'var(--mantine-color-cyan-7)',
    'var(--mantine-color-pink-6)',
    'var(--mantine-color-lime-7)',
  ],
  mark: 'var(--mantine-color-ember-7)',
  secondMark: 'var(--mantine-color-gray-6)',
  /** A mark beside `mark` on the same plot: dark blue against amber differs in hue and lightness for every colour vision. */
  laterMark: 'var(--mantine-color-indigo-8)',
} as const;
