import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import { driverExamples } from '../designs/driver-examples';
import type { DriverStage } from '../designs/driver-stage.types';
import { analyzeDesign } from '../analysis/analyze-design';
import { runDriverChecks } from './driver-checks';
import { DEFAULT_TRANSISTOR_THERMAL } from './driver-energy';

const demo = designExamples.surfaceChargeTester;
const heavy = { ...structuredClone(demo), load: { kind: 'current' as const, currentA: 50e-6 } };
/** The demo flyback-fed with an RCD clamp: its resistor takes flyback power beside the ladder (rcd-clamp.ts). */
const rcdClamped = (() => {
  const design = structuredClone(heavy);
  if (design.drive.kind !== 'driver') throw new Error('the demo has a driver stage');
  design.drive.driver.clamp = { kind: 'rcd', resistorOhm: 10e3, capacitorF: 10e-9 };
  design.drive.driver.transformer.secondaryPhasing = 'flyback';
  return design;
})();

describe('driver energy at the operating point', () => {
  it.each([
    ['demo at its rated 2 µA', demo],
    ['demo at 50 µA (power-limited)', heavy],
    ['demo flyback-fed at 50 µA with an RCD clamp', rcdClamped],
  ])('%s: input = output + every loss (energy conservation), each loss ≥ 0', (_, design) => {
    const e = analyzeDesign(design).driver!.energy;
    const lossSum = Object.values(e.losses).reduce((a, b) => a + b, 0);
    // 1e-9 relative: the balance is closed by construction up to the solver's tolerances (1e-12) and rounding.
    expect(Math.abs(e.inputPowerW - e.outputPowerW - lossSum) / e.inputPowerW).toBeLessThan(1e-9);
    for (const [kind, w] of Object.entries(e.losses)) {
      // The diodes' share is a difference of two model figures: allow −1e-6 of the input for rounding.
      expect(w, kind).toBeGreaterThanOrEqual(-1e-6 * e.inputPowerW);
    }
    expect(e.efficiency).toBeGreaterThan(0);
    expect(e.efficiency).toBeLessThan(1);
  });

  it('gives one efficiency: the Driver figures, the rated load point and the energy section agree', () => {
    const d = analyzeDesign(heavy).driver!;
    // 1e-12 relative: the same number carried to three places.
    expect(Math.abs(d.figures.efficiency.value - d.energy.efficiency)).toBeLessThan(1e-12);
    expect(Math.abs(d.operatingPoint.ratedLoad.efficiency - d.energy.efficiency)).toBeLessThan(1e-12);
    expect(Math.abs(d.figures.inputPowerW.value - d.energy.inputPowerW)).toBeLessThan(1e-12 * d.energy.inputPowerW);
    // Output power V·I (REFERENCES.md §3 power balance): at 50 µA the load takes output × 50 µA.
    const r = analyzeDesign(heavy);
    expect(Math.abs(d.energy.outputPowerW - Math.abs(r.outputMeanV) * 50e-6) / d.energy.outputPowerW).toBeLessThan(
      1e-6,
    );
  });

  it('puts the bleeder’s V²/R among the losses (Ohm’s law)', () => {
    const r = analyzeDesign(demo);
    const e = r.driver!.energy;
    const topV = Math.abs(r.analysis.ladderTopMeanV);
    // 1e-6 relative: the operating point's top and the ladder report's agree to the solver tolerance.
    expect(Math.abs(e.losses.bleeder - (topV * topV) / (5 * 82e6)) / e.losses.bleeder).toBeLessThan(1e-6);
  });

  it('takes the junction temperature as T_ambient + P·Rθ and checks the dissipation (common practice, no source)', () => {
    const checks = runDriverChecks(driverExamples.surfaceChargeTester);
    const t = checks.energy.transistor;
    expect(t.thermalResistanceCPerW).toBe(DEFAULT_TRANSISTOR_THERMAL.thermalResistanceCPerW);
    // 1e-12: the same arithmetic, rounding only.
    expect(Math.abs(t.junctionTemperatureC - (25 + t.dissipationW * 200))).toBeLessThan(1e-9);
    expect(t.maxDissipationW).toBeCloseTo((150 - 25) / 200, 12);
    const v = checks.verdicts.find((c) => c.id === 'driver.transistor-dissipation')!;
    expect(v.value).toBe(t.dissipationW);
    // A stage driven hard (R_B 10 Ω from 3 V: amperes of collector current) overheats a small transistor.
    const hard: DriverStage = {
      ...driverExamples.surfaceChargeTester,
      baseResistorOhm: 10,
      transformer: { ...driverExamples.surfaceChargeTester.transformer, saturationCurrentA: 5 },
      transistor: { ...driverExamples.surfaceChargeTester.transistor, icMaxA: 10 },
    };
    const hot = runDriverChecks(hard).verdicts.find((c) => c.id === 'driver.transistor-dissipation')!;
    expect(hot.value).toBeGreaterThan(v.value);
  });

  it('without a ladder the clamp takes the whole flyback: its dissipation is E·f less the secondary copper', () => {
    const checks = runDriverChecks(driverExamples.surfaceChargeTester);
    const e = checks.estimate;
    const clamp = checks.energy.clamp;
    // Energy per cycle E·f goes to leakage (1 − k²), secondary copper and the deliverable flyback; with no
    // load the deliverable part goes to the clamp too (1e-9 relative, rounding).
    const expected = e.energyPerCycleJ.value * e.frequencyHz.value - e.losses.secondaryCopperW;
    expect(Math.abs(clamp.dissipationW - expected) / expected).toBeLessThan(1e-9);
    const verdict = checks.verdicts.find((c) => c.id === 'driver.clamp-dissipation')!;
    expect(verdict.limit).toBe(0.5);
  });
});

describe('driver energy with the design’s own thermal, clamp and core figures', () => {
  const base = driverExamples.surfaceChargeTester;

  it('takes Rθ, Tj,max, the ambient and the clamp rating from the design when given', () => {
    const stage: DriverStage = {
      ...base,
      ambientTemperatureC: 50,
      transistor: { ...base.transistor, thermalResistanceCPerW: 100, maxJunctionTemperatureC: 125 },
      clamp: { kind: 'zener', clampVoltageV: 30, ratedPowerW: 1.3 },
    };
    const checks = runDriverChecks(stage);
    const t = checks.energy.transistor;
    expect(t.isDefaultThermal).toBe(false);
    // Tj = Ta + P·Rθ (common practice, no source); rounding only.
    expect(Math.abs(t.junctionTemperatureC - (50 + 100 * t.dissipationW))).toBeLessThan(1e-9);
    expect(t.maxDissipationW).toBeCloseTo((125 - 50) / 100, 12);
    expect(checks.energy.clamp.ratedPowerW).toBe(1.3);
    expect(checks.verdicts.find((c) => c.id === 'driver.clamp-dissipation')!.limit).toBe(1.3);
  });

  it('moves a given core loss out of the flyback: the clamp takes that much less, the balance still closes', () => {
    const lossy: DriverStage = { ...base, transformer: { ...base.transformer, coreLossW: 0.01 } };
    const plain = runDriverChecks(base).energy;
    const withCore = runDriverChecks(lossy).energy;
    expect(withCore.losses.core).toBeCloseTo(0.01, 12);
    // Without a ladder the clamp takes the whole flyback; 1e-9 W: rounding only.
    expect(Math.abs(plain.losses.clamp - withCore.losses.clamp - 0.01)).toBeLessThan(1e-9);
  });
});
