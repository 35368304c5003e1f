import { describe, expect, it } from 'vitest';
import { evaluate } from 'mathjs';
import { storedChargeLimit } from './hazard-limits';
import { storedEnergy, storedEnergyChecks } from './stored-energy';

describe('stored energy and charge', () => {
  it('computes ½CV² and CV per capacitor (outside check: mathjs unit arithmetic)', () => {
    const summary = storedEnergy(
      [
        { index: 1, valueF: 10e-9, maxVoltageV: 3000 },
        { index: 2, valueF: 4.7e-9, maxVoltageV: 2000 },
      ],
      5000,
    );
    const e1 = evaluate('0.5 * 10 nF * (3 kV)^2').toNumber('J');
    const e2 = evaluate('0.5 * 4.7 nF * (2 kV)^2').toNumber('J');
    // Relative 1e-12: the same arithmetic done by mathjs with units.
    expect(Math.abs(summary.totalEnergyJ / (e1 + e2) - 1)).toBeLessThan(1e-12);
    expect(Math.abs(summary.totalChargeC / evaluate('10 nF * 3 kV + 4.7 nF * 2 kV').toNumber('C') - 1)).toBeLessThan(
      1e-12,
    );
  });

  it('applies the IEC limits of REFERENCES.md §4 by voltage band', () => {
    expect(storedChargeLimit(60, 'IEC 61010-1').kind).toBe('none'); // ≤ 70 V DC (from memory)
    expect(storedChargeLimit(5000, 'IEC 61010-1')).toMatchObject({ kind: 'charge', limit: 45e-6 }); // 45 µC (from memory)
    expect(storedChargeLimit(20e3, 'IEC 61010-1')).toMatchObject({ kind: 'energy', limit: 0.35 }); // 350 mJ (from memory)
    expect(storedChargeLimit(300, 'IEC 60335-1')).toMatchObject({ kind: 'capacitance', limit: 0.1e-6 }); // 0.1 µF (read)
    expect(storedChargeLimit(-6000, 'IEC 60335-1')).toMatchObject({ kind: 'charge', limit: 45e-6 }); // 45 µC (read)
  });

  it('fails a capacitor above 45 µC at 5 kV', () => {
    // 10 nF at 5 kV stores 50 µC > 45 µC.
    const checks = storedEnergyChecks(storedEnergy([{ index: 1, valueF: 10e-9, maxVoltageV: 5000 }], 5000), 5000);
    const perCap = checks.find((c) => c.id === 'stored-c1-iec61010');
    expect(perCap?.verdict).toBe('fail');
  });
});
