import { DomainError } from '../errors';

export type ESeriesName = 'E6' | 'E12' | 'E24' | 'E48' | 'E96';

/**
 * E24 mantissas of IEC 60063. The two-figure series keep their historical values, which differ from
 * the rounded geometric series (27, 30, 33 ... 82), so they are tabulated; E12 and E6 are every second
 * and fourth E24 value.
 */
const e24Mantissas = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];

/** The three-figure series of IEC 60063 are the geometric series rounded to three figures: round(10^(2 + i/N)). */
function geometricMantissas(stepsPerDecade: number): number[] {
  return Array.from({ length: stepsPerDecade }, (_, i) => Math.round(10 ** (2 + i / stepsPerDecade)));
}

const mantissasBySeries: Readonly<Record<ESeriesName, readonly number[]>> = {
  E6: e24Mantissas.filter((_, i) => i % 4 === 0),
  E12: e24Mantissas.filter((_, i) => i % 2 === 0),
  E24: e24Mantissas,
  E48: geometricMantissas(48),
  E96: geometricMantissas(96),
};

/** The mantissas of one decade of a series, e.g. E12 → [10, 12, 15 ... 82]; E48/E96 → [100, 102 ... 976]. */
export function seriesMantissas(series: ESeriesName): readonly number[] {
  return mantissasBySeries[series];
}

/** The per-decade values as multipliers in [1, 10): E12 → [1, 1.2 ... 8.2]. */
function unitDecade(series: ESeriesName): number[] {
  const values = mantissasBySeries[series];
  const divisor = values[0] ?? 1;
  return values.map((v) => v / divisor);
}

function assertPositive(valueSi: number, field: string): void {
  if (!(valueSi > 0) || !Number.isFinite(valueSi)) {
    throw new DomainError('invalid_argument', 'a preferred value needs a positive finite number', field);
  }
}

/**
 * Nearest preferred value of an E-series (IEC 60063) in the logarithmic sense: the value v minimising
 * |log(v / x)|, which is how the series are spaced. Works in any decade.
 */
export function nearestPreferred(valueSi: number, series: ESeriesName = 'E24'): number {
  assertPositive(valueSi, 'value');
  const decadeExponent = Math.floor(Math.log10(valueSi));
  const decade = unitDecade(series);
  let best = valueSi;
  let bestDistance = Infinity;
  for (const exponent of [decadeExponent - 1, decadeExponent, decadeExponent + 1]) {
    for (const m of decade) {
      const candidate = Number(`${Number(m.toPrecision(3))}e${exponent}`);
      const distance = Math.abs(Math.log(candidate / valueSi));
      if (distance < bestDistance) {
        bestDistance = distance;
        best = candidate;
      }
    }
  }
  return best;
}

/** All preferred values of a series between minSi and maxSi inclusive, ascending. */
export function preferredValuesBetween(minSi: number, maxSi: number, series: ESeriesName = 'E12'): number[] {
  assertPositive(minSi, 'min');
  assertPositive(maxSi, 'max');
  const values: number[] = [];
  const decade = unitDecade(series);
  for (let exponent = Math.floor(Math.log10(minSi)); exponent <= Math.ceil(Math.log10(maxSi)); exponent += 1) {
    for (const m of decade) {
      const v = Number(`${Number(m.toPrecision(3))}e${exponent}`);
      if (v >= minSi * (1 - 1e-12) && v <= maxSi * (1 + 1e-12)) values.push(v);
    }
  }
  return values;
}
