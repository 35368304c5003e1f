import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';

/** The unit a document field or report figure holds, read from its name, and the factor to SI. */
export interface FieldQuantity {
  unit: QuantityUnit;
  /** Multiply the stored value by this for SI base units (millimetres are stored as `…Mm`). */
  toSi: number;
}

// Quantities carry their unit at the end of the name: ratedPivV, valueF, frequencyHz, creepageMm, dischargeTimeS.
const suffixes: ReadonlyArray<readonly [string, FieldQuantity]> = [
  ['Ohm', { unit: 'Ohm', toSi: 1 }],
  ['Hz', { unit: 'Hz', toSi: 1 }],
  ['Mm', { unit: 'm', toSi: 1e-3 }],
  ['V', { unit: 'V', toSi: 1 }],
  ['A', { unit: 'A', toSi: 1 }],
  ['F', { unit: 'F', toSi: 1 }],
  ['W', { unit: 'W', toSi: 1 }],
  ['J', { unit: 'J', toSi: 1 }],
  ['C', { unit: 'C', toSi: 1 }],
  ['S', { unit: 's', toSi: 1 }],
  ['H', { unit: 'H', toSi: 1 }],
];

/** The quantity of `multiplier.capacitors[2].valueF` (F) or `analysis.outputPowerW` (W); null for counts and ratios. */
export function quantityOfField(path: string): FieldQuantity | null {
  const name =
    path
      .replace(/\[\d+\]/g, '')
      .split('.')
      .pop() ?? '';
  for (const [suffix, quantity] of suffixes) {
    // The suffix must follow a lower-case letter or digit, so `count` or an all-capital name is no quantity.
    if (
      name.length > suffix.length &&
      name.endsWith(suffix) &&
      /[a-z0-9]/.test(name[name.length - suffix.length - 1] ?? '')
    ) {
      return quantity;
    }
  }
  return null;
}

function plainNumber(value: number): string {
  return Number(value.toPrecision(5)).toString();
}

/** A field's value as an engineer reads it: `1.5 nF` for valueF 1.5e-9; strings and booleans as they are. */
export function formatFieldValue(path: string, value: unknown): string {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'number') {
    const quantity = quantityOfField(path);
    return quantity ? formatQuantity(value * quantity.toSi, quantity.unit, 4) : plainNumber(value);
  }
  if (typeof value === 'string') return value;
  return JSON.stringify(value);
}

/** A difference b − a with its sign and the field's unit: `+220 pF`, `−1.2 kV`, `0`. */
export function formatFieldDelta(path: string, delta: number | null | undefined): string {
  if (delta === null || delta === undefined) return '—';
  if (delta === 0) return '0';
  const quantity = quantityOfField(path);
  const magnitude = Math.abs(delta);
  const text = quantity ? formatQuantity(magnitude * quantity.toSi, quantity.unit, 4) : plainNumber(magnitude);
  return delta > 0 ? `+${text}` : `−${text}`;
}

/** A relative difference in per cent with its sign, three significant figures: `+4.38 %`, `−0.0242 %`. */
export function formatPercentDelta(deltaPct: number | null | undefined): string {
  if (deltaPct === null || deltaPct === undefined) return '—';
  if (deltaPct === 0) return '0 %';
  const text = Number(Math.abs(deltaPct).toPrecision(3)).toString();
  return `${deltaPct > 0 ? '+' : '−'}${text} %`;
}
