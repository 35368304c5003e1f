import type { ReactNode } from 'react';
import type { QuantityUnit } from '@ladderwright/shared/units';

/** One axis: its title (a quantity's name) and SI unit; the prefix is chosen from the data drawn. */
export interface ChartAxis {
  title: string;
  /** '' for a plain count (stages). */
  unit: QuantityUnit | '';
  /** Whole numbers only (a count). */
  isInteger?: boolean;
  /** Include 0 in the range (start-up and discharge start at 0 s; a load current axis starts at no load). */
  includesZero?: boolean;
  /** A fixed range in SI units; otherwise from the data drawn. */
  range?: readonly [number, number];
}

/** One trace: a row key of the chart's data, drawn as a line or as points, against the left or right axis. */
export interface ChartSeries {
  key: string;
  name: string;
  color: string;
  kind?: 'line' | 'points';
  axis?: 'left' | 'right';
  isDashed?: boolean;
  /** Draw a dot on every sample of a line. */
  hasDots?: boolean;
}

/** A mark named in the chart's key: a vertical line (x), a horizontal line (y) or a point (x and y). */
export interface ChartMarker {
  key: string;
  label: string;
  x?: number;
  y?: number;
  axis?: 'left' | 'right';
  color: string;
  /** A short name written on the plot beside a vertical line (e.g. "90 %"); the key gives the full label. */
  tag?: string;
  /** Draw the line dotted rather than dashed, so that two marks differ by more than their colour. */
  isDotted?: boolean;
}

/** A band between two row keys (e.g. a predicted ripple range), drawn behind the traces. */
export interface ChartBand {
  lowKey: string;
  highKey: string;
  name: string;
  color: string;
}

/** A row of samples: numbers under the keys the axis and the series read (an interface such as CurvePoint will do). */
export type ChartRow = object;

export interface QuantityChartProps {
  /** Accessible name of the figure. */
  label: string;
  title: string;
  actions?: ReactNode;
  footer?: ReactNode;
  heightPx: number;
  data: readonly ChartRow[];
  /** The x axis and the row key it reads. */
  x: ChartAxis & { key: string };
  y: ChartAxis;
  /** A second axis on the right for series of another scale or unit. */
  y2?: ChartAxis;
  series: readonly ChartSeries[];
  markers?: readonly ChartMarker[];
  bands?: readonly ChartBand[];
  /** Time plots: a range slider under the chart to zoom and pan, with a reset. */
  isZoomable?: boolean;
  /**
   * A zoomable plot first shows its samples up to this x (SI units), e.g. a start-up without its long settled tail;
   * "Show all" widens it to every sample and "Reset zoom" comes back to it.
   */
  firstViewXEnd?: number;
}
