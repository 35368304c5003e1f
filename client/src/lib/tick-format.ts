import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';

/**
 * Significant figures a tick needs so that neighbouring ticks over [min, max] read differently: two
 * figures across the span, plus one per decade the values stand above it (954.2 V on a 1 V swing needs
 * five, 0 … 6 kV needs two).
 */
export function tickSignificantFigures(min: number, max: number): number {
  const magnitude = Math.max(Math.abs(min), Math.abs(max));
  const span = Math.abs(max - min);
  if (!Number.isFinite(magnitude) || !Number.isFinite(span) || magnitude === 0) return 3;
  if (span === 0 || span / magnitude < 1e-9) return 8;
  const figures = Math.ceil(Math.log10(magnitude / span) - 1e-9) + 2;
  return Math.max(2, Math.min(8, figures));
}

/** A tick formatter for an axis over `values`, in engineering notation with as many figures as the span needs. */
export function quantityTickFormatter(values: Iterable<number>, unit: QuantityUnit): (value: number) => string {
  let min = Infinity;
  let max = -Infinity;
  for (const value of values) {
    if (!Number.isFinite(value)) continue;
    if (value < min) min = value;
    if (value > max) max = value;
  }
  const figures = min <= max ? tickSignificantFigures(min, max) : 3;
  return (value: number) => formatQuantity(value, unit, figures);
}
