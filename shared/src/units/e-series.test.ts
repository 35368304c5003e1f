import { describe, expect, it } from 'vitest';
import { nearestPreferred, preferredValuesBetween, seriesMantissas } from './e-series';

// IEC 60063 lists (from memory), written out here as the outside reference.
const iecE24 = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];
const iecE12 = [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82];
const iecE6 = [10, 15, 22, 33, 47, 68];
const iecE96 = [
  100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154, 158, 162, 165, 169,
  174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255, 261, 267, 274, 280, 287, 294,
  301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453, 464, 475, 487, 499, 511,
  523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665, 681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887,
  909, 931, 953, 976,
];

describe('E-series (IEC 60063)', () => {
  it.each([
    ['E6', iecE6],
    ['E12', iecE12],
    ['E24', iecE24],
    ['E96', iecE96],
  ] as const)('%s matches the IEC 60063 list', (series, list) => {
    expect(seriesMantissas(series)).toEqual(list);
  });

  it('E48 is every second E96 value (IEC 60063, from memory)', () => {
    expect(seriesMantissas('E48')).toEqual(iecE96.filter((_, i) => i % 2 === 0));
  });

  it('rounds to the logarithmically nearest value, across decades', () => {
    // Geometric midpoint of 4.7 and 5.6 is √(4.7·5.6) = 5.130…: 5.12 rounds down, 5.14 up (E12).
    expect(nearestPreferred(5.12e-9, 'E12')).toBe(4.7e-9);
    expect(nearestPreferred(5.14e-9, 'E12')).toBe(5.6e-9);
    // 9.2 is nearer 10 than 8.2 in log terms (√82 = 9.055…), so it crosses into the next decade.
    expect(nearestPreferred(9.2, 'E12')).toBe(10);
    expect(nearestPreferred(1.04e5, 'E96')).toBe(1.05e5);
    expect(nearestPreferred(0.0101, 'E24')).toBe(0.01);
  });

  it('picks the same value as a brute-force log-distance search over the written-out IEC lists', () => {
    for (const [series, list] of [
      ['E6', iecE6],
      ['E12', iecE12],
      ['E24', iecE24],
      ['E96', iecE96],
    ] as const) {
      const scaleToOne = list[0] ?? 1;
      const candidates = [0.1, 1, 10].flatMap((decade) => list.map((m) => (m / scaleToOne) * decade));
      for (let x = 1.001; x < 9.99; x *= 1.0137) {
        const brute = candidates.reduce((a, b) => (Math.abs(Math.log(b / x)) < Math.abs(Math.log(a / x)) ? b : a));
        // Relative 1e-12: the two sides differ only in how the decade factor was applied.
        expect(Math.abs(nearestPreferred(x, series) / brute - 1)).toBeLessThan(1e-12);
      }
    }
  });

  it('lists preferred values in a range', () => {
    expect(preferredValuesBetween(1e-9, 1e-8, 'E6')).toEqual([1e-9, 1.5e-9, 2.2e-9, 3.3e-9, 4.7e-9, 6.8e-9, 1e-8]);
  });
});
