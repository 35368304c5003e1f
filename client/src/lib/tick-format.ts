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

/** Smallest and largest finite value (min > max when there is none). */
function finiteRange(values: Iterable<number>): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (const value of values) {
    if (!Number.isFinite(value)) continue;
    if (value < min) min = value;
    if (value > max) max = value;
  }
  return { min, max };
}

/** A tick formatter for an axis over `values`, in engineering notation with as many figures as the span needs. */
export function quantityTickFormatter(values: Iterable<number>, unit: QuantityUnit): (value: number) => string {
  const { min, max } = finiteRange(values);
  const figures = min <= max ? tickSignificantFigures(min, max) : 3;
  return (value: number) => formatQuantity(value, unit, figures);
}

const prefixOfExponent: Readonly<Record<number, string>> = {
  [-15]: 'f',
  [-12]: 'p',
  [-9]: 'n',
  [-6]: 'µ',
  [-3]: 'm',
  0: '',
  3: 'k',
  6: 'M',
  9: 'G',
};

/** One axis in engineering notation: the prefixed unit for its title ("kV") and plain-number ticks in that unit. */
export interface AxisScale {
  /** Prefixed unit symbol for the axis title, e.g. "ms", "kV", "µA". */
  unitLabel: string;
  /** Tick text in `unitLabel`: rounded to the figures the span needs, never a float artefact. */
  format: (valueSi: number) => string;
}

/**
 * The engineering prefix (a power of 1000) that puts the largest magnitude over `values` between 1 and 1000,
 * and a tick formatter with the figures the span needs: 0.9975 … 2 ms reads "1", "1.25" … in ms.
 */
export function axisScale(values: Iterable<number>, unit: QuantityUnit | ''): AxisScale {
  const { min, max } = finiteRange(values);
  const magnitude = min <= max ? Math.max(Math.abs(min), Math.abs(max)) : 0;
  // A plain count keeps its digits (no "k" on 1000 stages).
  const exponent =
    unit !== '' && magnitude > 0
      ? Math.max(-15, Math.min(9, Math.floor(Math.log10(magnitude * (1 + 1e-12)) / 3) * 3))
      : 0;
  const figures = min <= max ? tickSignificantFigures(min, max) : 3;
  const symbol = unit === '' ? '' : formatQuantity(1, unit).replace(/^1 /, '');
  const scale = 10 ** exponent;
  return {
    unitLabel: `${prefixOfExponent[exponent] ?? ''}${symbol}`,
    format: (valueSi: number) => {
      const scaled = valueSi / scale;
      if (scaled === 0 || !Number.isFinite(scaled)) return String(scaled === 0 ? 0 : scaled);
      // Decimals from the axis' largest magnitude and the figures its span needs, plus one for quarter steps.
      const decimals = Math.max(0, figures - Math.floor(Math.log10(magnitude / scale)));
      return String(Number(scaled.toFixed(Math.min(12, decimals))));
    },
  };
}
