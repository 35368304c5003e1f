import { describe, expect, it } from 'vitest';
import { creepageColumn, ipc2221B2SpacingMm, requiredCreepageMm, stageSpacing, creepageChecks } from './creepage';
import type { CreepageColumn } from './creepage';

// IEC 60664-1:2007 Table F.4 as reproduced in REFERENCES.md §5 (read from a manufacturer's reproduction),
// written out here as the outside reference: [V rms, PWB PD1, PWB PD2, PD1, PD2 I, PD2 II, PD2 III, PD3 I, PD3 II, PD3 III].
const tableF4: Array<[number, ...(number | null)[]]> = [
  [250, 0.56, 1.0, 0.56, 1.25, 1.8, 2.5, 3.2, 3.6, 4.0],
  [500, 1.3, 2.5, 1.3, 2.5, 3.6, 5.0, 6.3, 7.1, 8.0],
  [1000, 3.2, 5.0, 3.2, 5.0, 7.1, 10.0, 12.5, 14.0, 16.0],
  [2000, null, null, 7.5, 10.0, 14.0, 20.0, 25.0, 28.0, 32.0],
];
const columns: CreepageColumn[] = [
  'pwbPd1',
  'pwbPd2',
  'pd1',
  'pd2MgI',
  'pd2MgII',
  'pd2MgIII',
  'pd3MgI',
  'pd3MgII',
  'pd3MgIII',
];

describe('creepage (IEC 60664-1 Table F.4)', () => {
  it('returns the reproduced table values at the table rows', () => {
    for (const [voltage, ...values] of tableF4) {
      values.forEach((mm, i) => {
        if (mm === null || mm === undefined) return;
        // At a row the log-log interpolation is exact up to float rounding: 1e-9 mm.
        expect(Math.abs(requiredCreepageMm(voltage, columns[i] as CreepageColumn) - mm)).toBeLessThan(1e-9);
      });
    }
  });

  it('interpolates log-log between rows', () => {
    // 707 V is the geometric mean of 500 and 1000 V: log-log gives the geometric mean of the row values.
    expect(requiredCreepageMm(Math.sqrt(500 * 1000), 'pd2MgII')).toBeCloseTo(Math.sqrt(3.6 * 7.1), 9);
  });

  it('extrapolates above 2000 V close to the 10 kV figures the standard gives (memory: PD2 50 / 71 / 100 mm)', () => {
    // REFERENCES.md §5 (from memory): 10 kV PD2 MG I 50 mm, MG II 71 mm, MG III 100 mm. The extrapolated
    // 1000–2000 V slope reaches MG I and MG III within 1 %; MG II's 7.1→14 mm segment is slightly flatter than
    // the R10 steps, so it lands 4.6 % low (67.7 mm): tolerance 5 %, and the stated method says to check the standard.
    expect(Math.abs(requiredCreepageMm(10e3, 'pd2MgI') / 50 - 1)).toBeLessThan(0.01);
    expect(Math.abs(requiredCreepageMm(10e3, 'pd2MgII') / 71 - 1)).toBeLessThan(0.05);
    expect(Math.abs(requiredCreepageMm(10e3, 'pd2MgIII') / 100 - 1)).toBeLessThan(0.01);
  });

  it('uses printed-wiring columns only for PD1/PD2 up to 1000 V, and groups IIIa/IIIb together', () => {
    expect(creepageColumn({ pollutionDegree: 2, materialGroup: 'IIIa', pcb: true }, 800)).toBe('pwbPd2');
    expect(creepageColumn({ pollutionDegree: 2, materialGroup: 'IIIa', pcb: true }, 1500)).toBe('pd2MgIII');
    expect(creepageColumn({ pollutionDegree: 3, materialGroup: 'IIIb', pcb: false }, 800)).toBe('pd3MgIII');
  });
});

describe('IPC-2221 B2 spacing', () => {
  it('is 2.5 mm at 500 V (read) and adds 0.005 mm/V above (memory)', () => {
    expect(ipc2221B2SpacingMm(500)).toBe(2.5);
    expect(ipc2221B2SpacingMm(1000)).toBeCloseTo(5.0, 12); // 2.5 + 0.005·500
    expect(ipc2221B2SpacingMm(-2000)).toBeCloseTo(10.0, 12);
  });
});

describe('creepage checks', () => {
  it('fails a stage whose provided creepage is below the requirement and passes one with 20 % spare', () => {
    const env = { pollutionDegree: 2 as const, materialGroup: 'IIIa' as const, pcb: false, providedCreepageMm: 6 };
    const [low, high] = creepageChecks(stageSpacing([500, 1000], env), env);
    // 500 V PD2 MG III needs 5.0 mm: 6 mm is 20 % over → pass; 1000 V needs 10.0 mm → fail.
    expect(low?.verdict).toBe('pass');
    expect(high?.verdict).toBe('fail');
    expect(high?.marginPct).toBeCloseTo(-40, 9);
  });
});
