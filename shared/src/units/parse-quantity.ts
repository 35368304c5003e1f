import { DomainError } from '../errors';
import type { ParsedQuantity, ParseQuantityOptions, QuantityUnit } from './quantity.types';

/** SI prefixes as engineers type them; `u`, `µ` (U+00B5) and `μ` (U+03BC) are all micro, `meg` is mega. */
const prefixExponents: Readonly<Record<string, number>> = {
  f: -15,
  p: -12,
  n: -9,
  u: -6,
  µ: -6,
  μ: -6,
  m: -3,
  k: 3,
  K: 3,
  M: 6,
  meg: 6,
  MEG: 6,
  G: 9,
  T: 12,
};

const unitSpellings: Readonly<Record<string, QuantityUnit>> = {
  V: 'V',
  A: 'A',
  F: 'F',
  Hz: 'Hz',
  hz: 'Hz',
  W: 'W',
  J: 'J',
  C: 'C',
  s: 's',
  H: 'H',
  m: 'm',
  '\u03a9': 'Ohm',
  '\u2126': 'Ohm',
  ohm: 'Ohm',
  Ohm: 'Ohm',
  ohms: 'Ohm',
  R: 'Ohm',
};

const numberPattern = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/;
/** Letter-as-decimal-point codes (IEC 60062 style): 4n7, 2k2, 4R7, 3M3. */
const letterCodePattern = /^([+-]?)(\d+)(meg|MEG|[fpnuµμmkKMGTR])(\d+)\s*(.*)$/;

const expectedText =
  'expected a number with an optional SI prefix and unit, e.g. "4.7n", "4n7", "10 nF", "2k2", "1.5 kV", "20 µA"';

function fail(text: string, options: ParseQuantityOptions, why: string): never {
  const field = options.field ?? null;
  throw new DomainError('invalid_quantity', `"${text}": ${why}; ${expectedText}`, field);
}

/** Splits a suffix such as "kV", "n", "nF", "Ω" into its prefix exponent and unit. */
function parseSuffix(suffix: string): { exponent: number; unit: QuantityUnit | null } | null {
  if (suffix === '') return { exponent: 0, unit: null };
  const bareUnit = unitSpellings[suffix];
  // A lone "m" is milli (a prefix) unless the field expects metres; resolved by the caller.
  if (bareUnit && suffix !== 'm') return { exponent: 0, unit: bareUnit };
  for (const prefix of ['meg', 'MEG', suffix.slice(0, 1)]) {
    if (!suffix.startsWith(prefix)) continue;
    const exponent = prefixExponents[prefix];
    if (exponent === undefined) continue;
    const rest = suffix.slice(prefix.length).trim();
    if (rest === '') return { exponent, unit: null };
    const unit = unitSpellings[rest];
    if (unit) return { exponent, unit };
  }
  return null;
}

function scale(mantissa: number, exponent: number): number {
  // Round to 15 figures so 4.7n is 4.7e-9 and not 4.700000000000001e-9.
  return exponent === 0 ? mantissa : Number((mantissa * 10 ** exponent).toPrecision(15));
}

/**
 * Parses a value as engineers type it into SI base units with the unit it carried.
 * Accepts "4.7n", "4n7", "10 nF", "3.3M", "2k2", "4R7", "1.5 kV", "20 µA", "20 uA", "25 kHz", "-6 kV", "1e-9".
 * Throws DomainError('invalid_quantity') naming what was expected.
 */
export function parseQuantityWithUnit(text: string, options: ParseQuantityOptions = {}): ParsedQuantity {
  if (typeof text !== 'string') fail(String(text), options, 'not text');
  const trimmed = text.trim().replace(/\s+/g, ' ');
  if (trimmed === '') fail(text, options, 'empty');

  let mantissa: number;
  let suffix: string;
  let exponent = 0;
  let unit: QuantityUnit | null = null;

  const code = letterCodePattern.exec(trimmed);
  if (code) {
    const [, sign, whole, letter, fraction, rest] = code as unknown as [string, string, string, string, string, string];
    mantissa = Number(`${sign}${whole}.${fraction}`);
    if (letter === 'R') {
      unit = 'Ohm';
    } else {
      exponent = prefixExponents[letter] ?? 0;
    }
    suffix = rest.trim();
    if (suffix !== '') {
      const suffixUnit = unitSpellings[suffix];
      if (!suffixUnit || (letter === 'R' && suffixUnit !== 'Ohm')) fail(text, options, `unknown unit "${suffix}"`);
      unit = suffixUnit;
    }
  } else {
    const match = numberPattern.exec(trimmed);
    if (!match) fail(text, options, 'no number found');
    mantissa = Number(match[1]);
    suffix = (match[2] ?? '').trim();
    if (suffix === 'm' && options.unit === 'm') {
      unit = 'm';
    } else {
      const parsed = parseSuffix(suffix);
      if (!parsed) fail(text, options, `unknown prefix or unit "${suffix}"`);
      exponent = parsed.exponent;
      unit = parsed.unit;
    }
  }
  if (!Number.isFinite(mantissa)) fail(text, options, 'not a finite number');
  if (options.unit && unit && unit !== options.unit) {
    fail(text, options, `unit ${unit} given where ${options.unit} is expected`);
  }
  const valueSi = scale(mantissa, exponent);
  if (!Number.isFinite(valueSi)) fail(text, options, 'out of range');
  return { valueSi, unit };
}

/** Parses a typed value to a number in SI base units (see parseQuantityWithUnit); a plain number passes through. */
export function parseQuantity(text: string | number, options: ParseQuantityOptions = {}): number {
  if (typeof text === 'number') {
    if (!Number.isFinite(text)) fail(String(text), options, 'not a finite number');
    return text;
  }
  return parseQuantityWithUnit(text, options).valueSi;
}
