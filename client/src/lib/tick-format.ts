import { formatQuantity, roundStep, type QuantityUnit } from '@ladderwright/shared/units';

/** The round step of a chart axis, kept with the engine's units so the spec sheet's plot uses the same scale. */
export { roundStep };

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

/** The SI prefix of each engineering exponent from 10⁻¹⁵ to 10⁹. */
export const prefixOfExponent: Readonly<Record<number, string>> = {
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

/** One axis in engineering notation: its range, its ticks at round steps, and the prefixed unit its title carries. */
export interface QuantityAxis {
  /** Prefixed unit symbol for the axis title, e.g. "ms", "kV", "µA" ('' for a count). */
  unitLabel: string;
  domain: [number, number];
  /** Tick positions in SI units: whole multiples of 1, 2, 2.5 or 5 × 10ⁿ. */
  ticks: number[];
  /** Tick text in `unitLabel`, with the decimals the step needs: never a float artefact, never an exponent. */
  format: (valueSi: number) => string;
}

export interface QuantityAxisOptions {
  /** Take in 0 (a start-up from 0 s, a load axis from no load). */
  includesZero?: boolean;
  /** End the range at the data (a time axis) instead of rounding it out to the next tick. */
  isExact?: boolean;
  /** Whole-number ticks only (a count). */
  isInteger?: boolean;
  /** About how many ticks; 5 unless told. */
  tickCount?: number;
}

/** Decimals that write every multiple of `step` exactly (0.25 needs two). */
function decimalsOf(step: number): number {
  for (let decimals = 0; decimals < 12; decimals += 1) {
    const scaled = step * 10 ** decimals;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-6 * Math.max(1, scaled)) return decimals;
  }
  return 12;
}

/**
 * An axis over `values` (SI units) in engineering notation: the prefix puts its largest magnitude between 1 and
 * 1000, ticks sit on round steps, and tick text is a plain number in the prefixed unit (0 … 2 ms reads "0", "0.5"
 * … "2" under "Time (ms)").
 */
export function quantityAxis(
  values: Iterable<number>,
  unit: QuantityUnit | '',
  options: QuantityAxisOptions = {},
): QuantityAxis {
  let { min, max } = finiteRange(values);
  if (min > max) [min, max] = [0, 1];
  if (options.includesZero) {
    // A dip of a few hundredths of the span across 0 (a settling capacitor) does not earn a whole tick step.
    const reach = Math.max(Math.abs(min), Math.abs(max));
    if (min < 0 && -min < 0.03 * reach) min = 0;
    if (max > 0 && max < 0.03 * reach) max = 0;
    [min, max] = [Math.min(0, min), Math.max(0, max)];
  }
  if (max - min <= Math.abs(max) * 1e-12) {
    const pad = Math.abs(max) * 0.05 || 1;
    [min, max] = [min - pad, max + pad];
  }
  let step = roundStep(max - min, options.tickCount ?? 5);
  if (options.isInteger) step = Math.max(1, Math.round(step));
  const lo = options.isExact ? min : Math.floor(min / step + 1e-9) * step;
  const hi = options.isExact ? max : Math.ceil(max / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let k = Math.ceil(lo / step - 1e-9); k * step <= hi + step * 1e-9; k += 1) {
    ticks.push(Number((k * step).toPrecision(12)));
  }
  const magnitude = Math.max(Math.abs(lo), Math.abs(hi));
  // A plain count keeps its digits (no "k" on 1000 stages).
  const exponent =
    unit !== '' && magnitude > 0
      ? Math.max(-15, Math.min(9, Math.floor(Math.log10(magnitude * (1 + 1e-9)) / 3) * 3))
      : 0;
  const scale = 10 ** exponent;
  const decimals = decimalsOf(step / scale);
  const symbol = unit === '' ? '' : formatQuantity(1, unit).replace(/^1 /, '');
  return {
    unitLabel: `${prefixOfExponent[exponent] ?? ''}${symbol}`,
    domain: [lo, hi],
    ticks,
    format: (valueSi: number) => {
      const text = (valueSi / scale).toFixed(decimals);
      return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
    },
  };
}
