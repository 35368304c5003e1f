import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../errors';
import { estimateBlockingOscillator } from './blocking-oscillator';
import { driverExamples } from '../designs/driver-examples';
import type { DriverStage } from '../designs/driver-stage.types';

/** An ideal bench-supplied stage: no series resistances, so the textbook linear relations apply exactly. */
function idealStage(overrides: Partial<DriverStage> = {}): DriverStage {
  return {
    supply: { kind: 'dc', voltageV: 3, sourceResistanceOhm: 0 },
    transformer: {
      primaryTurns: 10,
      feedbackTurns: 5,
      secondaryTurns: 500,
      primaryInductanceH: 200e-6,
      couplingCoefficient: 1,
      primaryResistanceOhm: 0,
      feedbackResistanceOhm: 0,
      secondaryResistanceOhm: 0,
      saturationCurrentA: 2,
    },
    transistor: { forwardBeta: 100, reverseBeta: 2, vbeOnV: 0.7, vceSatV: 0.2, vceoMaxV: 60, icMaxA: 2 },
    baseResistorOhm: 1000,
    clamp: { kind: 'zener', clampVoltageV: 23 },
    ...overrides,
  };
}

// Float tolerance for closed-form identities evaluated in double precision: relative 1e-9 (rounding only).
const closeRel = (actual: number, expected: number, rel = 1e-9) =>
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));

describe('estimateBlockingOscillator against published relations', () => {
  const stage = idealStage();
  const e = estimateBlockingOscillator(stage);
  // Independent arithmetic from the relations of REFERENCES.md §3.
  const vin = 3;
  const ib = (vin + (vin - 0.2) * (5 / 10) - 0.7) / 1000; // base drive, common practice: 3.7 mA
  // Base-limited end of the on-time, i = hFE·I_B (pulse-circuits text, ch. 13), with the junction at the
  // turn-off current: V_BE = V_T·ln(1 + i/I_S), Ebers–Moll forward law (I_S 1e-14 A, V_T = kT/q at 300.15 K),
  // solved here by 50 fixed-point passes (independent of the estimate's three).
  const vt = (1.380649e-23 * 300.15) / 1.602176634e-19;
  let ipk = 100 * ib;
  for (let pass = 0; pass < 50; pass++) ipk = (100 * (vin + (vin - 0.2) * 0.5 - vt * Math.log1p(ipk / 1e-14))) / 1000;

  it('takes the base current from V_B = Vin + Vp·Nb/Np over R_B (common practice)', () => {
    closeRel(e.baseCurrentA.value, 3.7e-3);
    closeRel(e.baseCurrentA.value, ib);
  });

  it('ends a base-limited on-time at hFE·I_B and says so', () => {
    expect(e.onTimeLimit).toBe('base');
    closeRel(e.peakPrimaryCurrentA.value, ipk, 1e-7);
    // The junction at ~0.37 A sits near 0.80 V, above the 0.7 V turn-on figure: the peak is ~3 % below hFE·I_B0.
    expect(e.peakPrimaryCurrentA.value).toBeLessThan(100 * ib);
    expect(e.peakPrimaryCurrentA.method.summary).toMatch(/base-limited/);
  });

  it('follows the primary ramp i = (Vin − Vce,sat)·t/Lp (Wikipedia "Blocking oscillator")', () => {
    // t_on = Lp·Ipk/(Vin − Vce,sat) = 200 µH · 0.37 A / 2.8 V = 26.43 µs
    closeRel(e.onTimeS.value, (200e-6 * ipk) / 2.8, 1e-7);
  });

  it('stores E = ½·Lp·Ipk² (common practice; Pressman, from memory)', () => {
    closeRel(e.energyPerCycleJ.value, 0.5 * 200e-6 * ipk * ipk, 1e-7);
  });

  it('takes the flyback from the clamp: Vr = V_clamp − Vin and t_fly = Lp·Ipk/Vr (volt-second balance, Pressman from memory)', () => {
    closeRel(e.reflectedVoltageV.value, 20);
    closeRel(e.flybackSecondaryPeakV.value, 20 * 50);
    closeRel(e.flybackTimeS.value, (200e-6 * ipk) / 20, 1e-7);
    // The ring-back of the 100 pF collector node (resonant LC ring, common practice, no source): a quarter
    // period (π/2)·√(Lp·C) to Vin, then the magnetizing current from −Vr·√(C/Lp) back to zero at (Vin + V_BE)/Lp.
    const swingS = (Math.PI / 2) * Math.sqrt(200e-6 * 100e-12);
    const recoveryS = (200e-6 * 20 * Math.sqrt(100e-12 / 200e-6)) / (3 + 0.7);
    closeRel(e.frequencyHz.value, 1 / ((200e-6 * ipk) / 2.8 + (200e-6 * ipk) / 20 + swingS + recoveryS), 1e-7);
    closeRel(e.forwardSecondaryPeakV.value, 2.8 * 50);
  });

  it('delivers P = E·f with an ideal transformer and balances input power against it', () => {
    closeRel(e.deliverablePowerW.value, e.energyPerCycleJ.value * e.frequencyHz.value);
    // Supply energy per cycle = Vin·Ipk·t_on/2 (ramp) + V_B·I_B·t_on (base drive); E is the part stored.
    const vb = 3 + 2.8 * 0.5;
    // Plus the turn-on discharge of the 100 pF collector node from Vin, ½·C·Vin² (capacitor energy).
    const perCycleJ = vin * 0.5 * ipk * e.onTimeS.value + vb * ib * e.onTimeS.value + 0.5 * 100e-12 * vin * vin;
    closeRel(e.inputPowerW.value, perCycleJ * e.frequencyHz.value, 1e-7);
    closeRel(e.inputCurrentA.value, e.inputPowerW.value / vin);
  });

  it('reports a saturation-limited on-time when the core saturates first', () => {
    const sat = estimateBlockingOscillator(
      idealStage({ transformer: { ...stage.transformer, saturationCurrentA: 0.2 } }),
    );
    expect(sat.onTimeLimit).toBe('saturation');
    closeRel(sat.peakPrimaryCurrentA.value, 0.2);
    closeRel(sat.collectorPeakCurrentA.value, ipk, 1e-7);
    closeRel(sat.energyPerCycleJ.value, 0.5 * 200e-6 * 0.04);
  });

  it('caps the collector peak at the clamp, and without a clamp adds the leakage spike Ipk·√(L_lk/C)', () => {
    expect(e.collectorPeakV.value).toBeLessThanOrEqual(23);
    const leaky = idealStage({ clamp: undefined, transformer: { ...stage.transformer, couplingCoefficient: 0.95 } });
    const u = estimateBlockingOscillator(leaky, { flybackSecondaryPeakV: 1000, collectorNodeCapacitanceF: 100e-12 });
    const spike = ipk * Math.sqrt(((1 - 0.95 ** 2) * 200e-6) / 100e-12);
    // Reflected flyback Vr = V₋·Np/(k·Ns): the open-circuit ratio of coupled windings is M/Lp = k·Ns/Np.
    closeRel(u.collectorPeakV.value, 3 + 1000 / (0.95 * 50) + spike, 1e-7);
  });

  it('carries method metadata on every figure', () => {
    for (const value of Object.values(e)) {
      if (typeof value === 'object' && value !== null && 'method' in value) {
        expect(value.method.methodId).toMatch(/\S/);
        expect(value.method.source).toMatch(/\S/);
        expect(value.method.assumptions.length).toBeGreaterThan(0);
      }
    }
  });

  it('rejects a supply too low to turn the transistor on', () => {
    expect(() =>
      estimateBlockingOscillator(idealStage({ supply: { kind: 'dc', voltageV: 0.15, sourceResistanceOhm: 0 } })),
    ).toThrow(DomainError);
  });

  it('solves the loaded supply voltage of the demo driver consistently (V = Voc − I·R)', () => {
    const demo = estimateBlockingOscillator(driverExamples.surfaceChargeTester);
    // Two fresh alkaline cells: 3.2 V open circuit (built-in curve, common practice), 0.3 Ω in series.
    // Tolerance 1e-6 relative: the fixed-point iteration stops at 1e-9 of Voc per step.
    closeRel(demo.supplyVoltageV.value, 3.2 - demo.inputCurrentA.value * 0.3, 1e-6);
  });
});

describe('estimateBlockingOscillator properties (fast-check)', () => {
  const arbStage = fc.record({
    lp: fc.double({ min: 20e-6, max: 2e-3, noNaN: true }),
    rb: fc.double({ min: 200, max: 20_000, noNaN: true }),
    vin: fc.double({ min: 2, max: 12, noNaN: true }),
    ratio: fc.double({ min: 1.5, max: 4, noNaN: true }),
  });

  it('a higher Lp gives a lower base-limited frequency (f ∝ 1/Lp with the current fixed by the base)', () => {
    fc.assert(
      fc.property(arbStage, fc.double({ min: 1.01, max: 10, noNaN: true }), ({ lp, rb, vin }, factor) => {
        const base = idealStage({
          supply: { kind: 'dc', voltageV: vin, sourceResistanceOhm: 0 },
          baseResistorOhm: rb,
          clamp: { kind: 'zener', clampVoltageV: vin * 4 },
        });
        const tx = { ...base.transformer, saturationCurrentA: 1e3 };
        const a = estimateBlockingOscillator({ ...base, transformer: { ...tx, primaryInductanceH: lp } });
        const b = estimateBlockingOscillator({ ...base, transformer: { ...tx, primaryInductanceH: lp * factor } });
        expect(a.onTimeLimit).toBe('base');
        expect(b.frequencyHz.value).toBeLessThan(a.frequencyHz.value);
      }),
    );
  });

  it('a smaller base resistor gives a higher peak current and energy per cycle while base-limited', () => {
    fc.assert(
      fc.property(arbStage, ({ lp, rb, vin, ratio }) => {
        const base = idealStage({
          supply: { kind: 'dc', voltageV: vin, sourceResistanceOhm: 0 },
          clamp: { kind: 'zener', clampVoltageV: vin * ratio },
        });
        const tx = { ...base.transformer, primaryInductanceH: lp, saturationCurrentA: 1e3 };
        const a = estimateBlockingOscillator({ ...base, transformer: tx, baseResistorOhm: rb });
        const b = estimateBlockingOscillator({ ...base, transformer: tx, baseResistorOhm: rb / 2 });
        expect(b.peakPrimaryCurrentA.value).toBeGreaterThan(a.peakPrimaryCurrentA.value);
        expect(b.energyPerCycleJ.value).toBeGreaterThan(a.energyPerCycleJ.value);
      }),
    );
  });

  it('never reports an efficiency above 1 or deliverable power above input power', () => {
    fc.assert(
      fc.property(arbStage, fc.double({ min: 0.8, max: 1, noNaN: true }), ({ lp, rb, vin, ratio }, k) => {
        const base = idealStage({
          supply: { kind: 'dc', voltageV: vin, sourceResistanceOhm: 0.2 },
          baseResistorOhm: rb,
          clamp: { kind: 'zener', clampVoltageV: vin * ratio },
        });
        const tx = {
          ...base.transformer,
          primaryInductanceH: lp,
          couplingCoefficient: k,
          primaryResistanceOhm: 0.05,
          secondaryResistanceOhm: 20,
        };
        const e = estimateBlockingOscillator({ ...base, transformer: tx });
        expect(e.efficiency.value).toBeLessThanOrEqual(1);
        expect(e.deliverablePowerW.value).toBeLessThanOrEqual(e.inputPowerW.value);
      }),
    );
  });
});
