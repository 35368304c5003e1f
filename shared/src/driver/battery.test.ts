import { describe, expect, it } from 'vitest';
import { DomainError } from '../errors';
import { batteryLife, cellCurveOf, cellInternalResistanceOhm, cellOpenCircuitVoltageV } from './battery';
import { defaultCellCurves, defaultCellRateModels } from './cell-curves';
import { driverExamples } from '../designs/driver-examples';
import type { CellsSupply } from '../designs/driver-stage.types';

// The demo supply: two alkaline cells, 2.5 Ah, 0.15 Ω each, 0.9 V end point (NAMING.md scenario).
const demoSupply = driverExamples.surfaceChargeTester.supply;
if (demoSupply.kind !== 'cells') throw new Error('the demo driver runs on cells');
const twoAlkaline: CellsSupply = demoSupply;

/** Independent reference: plain trapezoid rule on a uniform state-of-charge grid, own interpolation. */
function trapezoidLifeS(supply: CellsSupply, currentAt: (v: number) => number, steps = 200_000): number {
  const curve = [...(supply.curve ?? defaultCellCurves.alkaline)].sort((a, b) => a.chargeFraction - b.chargeFraction);
  const voc = (s: number) => {
    for (let i = 1; i < curve.length; i++) {
      const a = curve[i - 1]!;
      const b = curve[i]!;
      if (s <= b.chargeFraction)
        return (
          a.voltageV + ((b.voltageV - a.voltageV) * (s - a.chargeFraction)) / (b.chargeFraction - a.chargeFraction)
        );
    }
    return curve[curve.length - 1]!.voltageV;
  };
  // The alkaline rate model written out again: R(σ) = R·(1 + 6·(1 − σ)^4), Peukert k = 1.15 above C/100 h.
  const model = defaultCellRateModels.alkaline;
  const resistance = (s: number) => supply.internalResistanceOhm * (1 + 6 * (1 - s) ** 4);
  const ratedA = supply.capacityAh / 100;
  const peukertA = (i: number) => (i > ratedA ? i * (i / ratedA) ** 0.15 : i);
  expect([model.peukertExponent, model.ratedDischargeH, model.resistanceRiseAtEmpty]).toEqual([1.15, 100, 6]);
  const cell = (s: number) => {
    // Solve V = n·(Voc − I(V)·R(σ)) by bisection on the cell voltage.
    let lo = 0;
    let hi = voc(s);
    for (let k = 0; k < 80; k++) {
      const mid = 0.5 * (lo + hi);
      if (mid < voc(s) - currentAt(supply.cellsInSeries * mid) * resistance(s)) lo = mid;
      else hi = mid;
    }
    const v = 0.5 * (lo + hi);
    return { v, i: currentAt(supply.cellsInSeries * v) };
  };
  const ds = 1 / steps;
  let life = 0;
  let prev: number | null = null;
  for (let k = steps; k >= 0; k--) {
    const s = k * ds;
    const c = cell(s);
    if (c.v < supply.endVoltagePerCellV) break;
    const g = (supply.capacityAh * 3600) / peukertA(c.i);
    if (prev !== null) life += 0.5 * (prev + g) * ds;
    prev = g;
  }
  return life;
}

describe('batteryLife', () => {
  it('matches an independent trapezoid integration at a constant drain', () => {
    const load = () => 0.1;
    const ours = batteryLife(twoAlkaline, load).lifeS.value;
    // Tolerance 1e-4 relative: the trapezoid grid (2e5 steps) stops within one step of the end point.
    expect(Math.abs(ours - trapezoidLifeS(twoAlkaline, load)) / ours).toBeLessThan(1e-4);
  });

  it('matches an independent trapezoid integration for a constant-power load', () => {
    const load = (v: number) => 0.4 / v; // 0.4 W converter input
    const ours = batteryLife(twoAlkaline, load).lifeS.value;
    // Tolerance 1e-4 relative, as above.
    expect(Math.abs(ours - trapezoidLifeS(twoAlkaline, load)) / ours).toBeLessThan(1e-4);
  });

  it('ends where the loaded cell reaches its end voltage: V = Voc(σ) − I·R(σ) at the end state of charge (charge balance, Ohm’s law)', () => {
    const drainA = 0.1;
    const life = batteryLife(twoAlkaline, () => drainA);
    const sigma = life.endChargeFraction;
    expect(sigma).toBeGreaterThan(0);
    // The curve's interpolation (checked below on its own) and the rate model written out again: R(σ) = R·(1 + 6·(1 − σ)^4).
    const loadedV =
      cellOpenCircuitVoltageV(cellCurveOf(twoAlkaline), sigma) -
      drainA * twoAlkaline.internalResistanceOhm * (1 + 6 * (1 - sigma) ** 4);
    // 1e-9 V: the end state of charge is solved to 1e-14, and the loaded voltage moves by about 1 V per unit of it.
    expect(Math.abs(loadedV - twoAlkaline.endVoltagePerCellV)).toBeLessThan(1e-9);
  });

  it('follows Peukert’s law t = H·(C/(I·H))^k when the end voltage is never reached (Peukert 1897; Linden & Reddy, from memory)', () => {
    const deep: CellsSupply = { ...twoAlkaline, endVoltagePerCellV: 0.5 };
    // H = 100 h, C = 2.5 Ah, I = 0.05 A, k = 1.15: 100·(2.5/5)^1.15 = 45.06 h; Gauss-Legendre is exact for a
    // constant integrand, so 5e-7 h (6 digits) is rounding only. At the rated 25 mA the rated 100 h hold.
    expect(batteryLife(deep, () => 0.05).lifeS.value / 3600).toBeCloseTo(100 * (2.5 / 5) ** 1.15, 6);
    expect(batteryLife(deep, () => 0.05).deliveredAh).toBeCloseTo(0.05 * 100 * (2.5 / 5) ** 1.15, 6);
  });

  it('delivers 1–1.5 Ah from an AA alkaline at 1 A to 0.8 V, far below its light-drain capacity (REFERENCES.md §6, from memory)', () => {
    const aa: CellsSupply = { ...twoAlkaline, endVoltagePerCellV: 0.8 };
    const heavy = batteryLife(aa, () => 1);
    // Bounds: the published range, widened by 10 % for the spread of makes.
    expect(heavy.deliveredAh).toBeGreaterThan(0.9);
    expect(heavy.deliveredAh).toBeLessThan(1.65);
    expect(heavy.meanCurrentA).toBeCloseTo(1, 9);
    expect(heavy.rateModel.source).toMatch(/from memory/);
    // 0.15 Ω fresh rising past 1 Ω near the end (same reference); at half charge still near its fresh value.
    expect(cellInternalResistanceOhm(aa, 0)).toBeGreaterThan(1);
    expect(cellInternalResistanceOhm(aa, 0.5)).toBeLessThan(0.3);
  });

  it('gives an AA alkaline about 100 h at 25 mA (common practice, no source; ±15 %)', () => {
    // Common practice: 2.5–3 Ah at tens of mA (REFERENCES.md §6, Linden & Reddy from memory). ±15 % covers
    // the spread of cell makes and of the end voltage.
    const hours = batteryLife(twoAlkaline, () => 0.025).lifeS.value / 3600;
    expect(hours).toBeGreaterThan(85);
    expect(hours).toBeLessThan(115);
  });

  it('shortens the life when the internal resistance rises (end voltage reached earlier)', () => {
    const a = batteryLife(twoAlkaline, () => 0.5);
    const b = batteryLife({ ...twoAlkaline, internalResistanceOhm: 0.6 }, () => 0.5);
    expect(b.lifeS.value).toBeLessThan(a.lifeS.value);
    expect(b.endChargeFraction).toBeGreaterThan(a.endChargeFraction);
  });

  it('interpolates the built-in curve between its points', () => {
    const curve = cellCurveOf(twoAlkaline);
    // Built-in alkaline points (common practice, no source): 1.27 V at 0.5, 1.36 V at 0.7 → 1.315 V at 0.6.
    expect(cellOpenCircuitVoltageV(curve, 0.6)).toBeCloseTo(1.315, 12);
  });

  it('rejects a custom chemistry without a curve', () => {
    expect(() => batteryLife({ ...twoAlkaline, chemistry: 'custom' }, () => 0.1)).toThrow(DomainError);
  });
});
