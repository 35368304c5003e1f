import { describe, expect, it } from 'vitest';
import type { CapacitorPart } from '@ladderwright/shared/designs';
import { isCellBlock, pasteIntoCapacitors, splitPastedCells } from './paste-cells';

const ladder = (count: number): CapacitorPart[] =>
  Array.from({ length: count }, () => ({ valueF: 10e-9, tolerance: 0.1, ratedVoltageV: 1000 }));

describe('splitPastedCells', () => {
  it('splits rows on any line break and cells on tabs, dropping the final line break', () => {
    expect(splitPastedCells('4n7\t5\r\n10n\t10\r\n')).toEqual([
      ['4n7', '5'],
      ['10n', '10'],
    ]);
    expect(splitPastedCells('1\r2')).toEqual([['1'], ['2']]);
  });

  it('tells a block from one value', () => {
    expect(isCellBlock('4n7')).toBe(false);
    expect(isCellBlock('4n7\n')).toBe(false);
    expect(isCellBlock('4n7\n10n')).toBe(true);
    expect(isCellBlock('4n7\t10')).toBe(true);
  });
});

// Prefixed values as engineers write them (IEC 60062 style "4n7"; SI prefixes): parsed by the shared parseQuantity.
describe('pasteIntoCapacitors', () => {
  it('fills a column of capacitances with prefixes from the row pasted into', () => {
    const result = pasteIntoCapacitors(ladder(4), '4n7\n10 nF\n0.022u\n', 1, 'valueF');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.capacitors.map((c) => c.valueF)).toEqual(
      [10e-9, 4.7e-9, 10e-9, 0.022e-6].map((v) => expect.closeTo(v, 20)),
    );
    expect(result.cellCount).toBe(3);
  });

  it('fills a block across capacitance, tolerance, rating and part code, keeping empty cells', () => {
    const result = pasteIntoCapacitors(ladder(2), '2n2\t±5%\t1.6 kV\tNF-C222-2K\n\t20\t\t', 0, 'valueF');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.capacitors[0]).toEqual({
      valueF: expect.closeTo(2.2e-9, 20),
      tolerance: 0.05,
      ratedVoltageV: 1600,
      partCode: 'NF-C222-2K',
    });
    expect(result.capacitors[1]).toEqual({ valueF: 10e-9, tolerance: 0.2, ratedVoltageV: 1000 });
  });

  it('refuses a cell that does not read, naming the capacitor, the column and the text', () => {
    const result = pasteIntoCapacitors(ladder(3), '4n7\n4.7 xF', 0, 'valueF');
    expect(result).toMatchObject({ ok: false });
    if (result.ok) return;
    expect(result.message).toMatch(/^C2 capacitance: “4.7 xF”/);
  });

  it('refuses a tolerance that is not a percentage', () => {
    const result = pasteIntoCapacitors(ladder(1), 'ten', 0, 'tolerance');
    expect(result).toEqual({ ok: false, message: 'C1 tolerance: “ten” is not a percentage.' });
  });

  it('refuses a block longer than the ladder or wider than the table, changing nothing', () => {
    expect(pasteIntoCapacitors(ladder(2), '1n\n2n\n3n', 0, 'valueF')).toEqual({
      ok: false,
      message: '3 rows pasted from C1, but the ladder ends at C2.',
    });
    const wide = pasteIntoCapacitors(ladder(2), '1n\t5\t1k', 0, 'ratedVoltageV');
    expect(wide.ok).toBe(false);
  });

  it('refuses a value in another unit than the column holds', () => {
    const result = pasteIntoCapacitors(ladder(1), '10 V', 0, 'valueF');
    expect(result.ok).toBe(false);
  });
});
