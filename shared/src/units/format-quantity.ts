import type { QuantityUnit } from './quantity.types';

const prefixes: ReadonlyArray<readonly [number, string]> = [
  [-15, 'f'],
  [-12, 'p'],
  [-9, 'n'],
  [-6, 'µ'],
  [-3, 'm'],
  [0, ''],
  [3, 'k'],
  [6, 'M'],
  [9, 'G'],
  [12, 'T'],
];

const unitSymbols: Readonly<Record<QuantityUnit, string>> = {
  V: 'V',
  A: 'A',
  F: 'F',
  Ohm: 'Ω',
  Hz: 'Hz',
  W: 'W',
  J: 'J',
  C: 'C',
  s: 's',
  H: 'H',
  m: 'm',
};

/**
 * Formats an SI value in engineering notation (exponent a multiple of 3) with `significantFigures`
 * significant figures and trailing zeros dropped: formatQuantity(4.7e-9, 'F') → "4.7 nF".
 */
export function formatQuantity(valueSi: number, unit: QuantityUnit | '', significantFigures = 3): string {
  const symbol = unit === '' ? '' : unitSymbols[unit];
  if (!Number.isFinite(valueSi)) return `${valueSi} ${symbol}`.trim();
  if (valueSi === 0) return `0 ${symbol}`.trim();
  const digits = Math.max(1, Math.min(15, Math.round(significantFigures)));
  const sign = valueSi < 0 ? '-' : '';
  // Round first, so 999.96 with 3 figures becomes 1.00 k and not 1000.
  const rounded = Number(Math.abs(valueSi).toPrecision(digits));
  const exponent3 = Math.floor(Math.log10(rounded) / 3) * 3;
  const clamped = Math.max(-15, Math.min(12, exponent3));
  const prefix = prefixes.find(([e]) => e === clamped)?.[1] ?? '';
  const mantissa = rounded / 10 ** clamped;
  const text = Number(mantissa.toPrecision(digits)).toString();
  return `${sign}${text} ${prefix}${symbol}`.trim();
}
