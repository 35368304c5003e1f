import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { estimateBlockingOscillator } from './blocking-oscillator';
import { driverExamples } from './driver-examples';
import type { DriverStage } from './driver.types';
import { driverOperatingPoint, halfWaveCascadeLoadLine, solveLoadPoint, type LadderLoadLine } from './operating-point';

const demo = driverExamples.surfaceChargeTester;
const fourCellLadder = halfWaveCascadeLoadLine(2, 10e-9); // four cells = two stages, 10 nF each

// Textbook output impedance of an n-stage half-wave cascade (read: J. Lux, "Cockcroft Walton Voltage
// Multipliers"; memory: Kuffel, Zaengl & Kuffel §2.2.2): ΔV0/I = (2n³/3 + n²/2 − n/6)/(fC).
const textbookZoutOhm = (n: number, fHz: number, cF: number) => ((2 * n ** 3) / 3 + n ** 2 / 2 - n / 6) / (fHz * cF);

/** A plain flyback into one capacitor: the output is the flyback peak itself, no droop. */
const flybackRectifier: LadderLoadLine = { noLoadOutputV: (d) => d.flybackPeakV, outputImpedanceOhm: () => 0 };

const bench: DriverStage = {
  supply: { kind: 'dc', voltageV: 12, sourceResistanceOhm: 0 },
  transformer: {
    primaryTurns: 10, feedbackTurns: 4, secondaryTurns: 500, primaryInductanceH: 200e-6, couplingCoefficient: 1,
    primaryResistanceOhm: 0, feedbackResistanceOhm: 0, secondaryResistanceOhm: 0, saturationCurrentA: 5,
  },
  transistor: { forwardBeta: 100, reverseBeta: 2, vbeOnV: 0.7, vceSatV: 0.2, vceoMaxV: 200, icMaxA: 5 },
  baseResistorOhm: 1000,
  clamp: { kind: 'zener', clampVoltageV: 150 },
};

describe('solveLoadPoint with the textbook cascade', () => {
  it('gives n·(V₊ + V₋) at no load with the flyback at its clamp limit (REFERENCES.md §1, asymmetric drive)', () => {
    const e = estimateBlockingOscillator(demo);
    const p = solveLoadPoint(demo, fourCellLadder, 0);
    expect(p.limitedBy).toBe('ladder');
    // Tolerance 1e-9 relative: the same closed form, rounding only.
    expect(p.outputV).toBeCloseTo(2 * (e.forwardSecondaryPeakV.value + e.maxFlybackSecondaryPeakV), 6);
  });

  it('follows V0 − Zout·I with the textbook Zout while ladder-limited', () => {
    const r = driverOperatingPoint(demo, fourCellLadder, 10e-6, { points: 5 });
    expect(r.ratedLoad.limitedBy).toBe('ladder');
    const noLoad = solveLoadPoint(demo, fourCellLadder, 0).outputV;
    const expected = noLoad - textbookZoutOhm(2, r.ratedLoad.frequencyHz, 10e-9) * 10e-6;
    // Tolerance 1e-3 relative: the frequency moves slightly with the loaded supply voltage between the
    // no-load and loaded points (battery internal resistance).
    expect(Math.abs(r.ratedLoad.outputV - expected) / expected).toBeLessThan(1e-3);
  });

  it('holds the power balance g·I·V₋ = E·f·η when power-limited (energy conservation per cycle)', () => {
    const r = driverOperatingPoint(demo, fourCellLadder, 10e-6, { points: 5 });
    const iA = r.powerLimitOnsetA * 3;
    const p = solveLoadPoint(demo, fourCellLadder, iA);
    expect(p.limitedBy).toBe('power');
    const independent = estimateBlockingOscillator(demo, { flybackSecondaryPeakV: p.flybackSecondaryPeakV });
    // Tolerance 1e-6 relative: the flyback peak comes from a 60-step bisection.
    expect(Math.abs(2 * iA * p.flybackSecondaryPeakV - independent.deliverablePowerW.value) / independent.deliverablePowerW.value).toBeLessThan(1e-6);
  });

  it('switches from ladder- to power-limited at the reported onset', () => {
    const r = driverOperatingPoint(demo, fourCellLadder, 10e-6, { points: 5 });
    expect(solveLoadPoint(demo, fourCellLadder, r.powerLimitOnsetA * 0.98).limitedBy).toBe('ladder');
    expect(solveLoadPoint(demo, fourCellLadder, r.powerLimitOnsetA * 1.02).limitedBy).toBe('power');
  });
});

describe('power balance of a plain flyback (REFERENCES.md §3: 4 kV at 0.3 mA is 1.2 W)', () => {
  it('holds at least 4 kV at 0.3 mA when the stage delivers at least 1.2 W at a 4 kV flyback', () => {
    const at4kV = estimateBlockingOscillator(bench, { flybackSecondaryPeakV: 4000 });
    expect(at4kV.deliverablePowerW.value).toBeGreaterThan(1.2);
    const p = solveLoadPoint(bench, flybackRectifier, 0.3e-3);
    expect(p.outputV).toBeGreaterThanOrEqual(4000);
  });

  it('turns the deliverable power into output power V·I when power-limited, ideal transformer', () => {
    const iA = 5e-3;
    const p = solveLoadPoint(bench, flybackRectifier, iA);
    expect(p.limitedBy).toBe('power');
    const e = estimateBlockingOscillator(bench, { flybackSecondaryPeakV: p.outputV });
    // Tolerance 1e-6 relative (bisection).
    expect(Math.abs(p.outputPowerW - e.deliverablePowerW.value) / e.deliverablePowerW.value).toBeLessThan(1e-6);
  });
});

describe('driverOperatingPoint properties (fast-check)', () => {
  it('the output never rises with load current', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 6 }), fc.double({ min: 1e-9, max: 100e-9, noNaN: true }), (stages, cF) => {
        const r = driverOperatingPoint(demo, halfWaveCascadeLoadLine(stages, cF), 0, { points: 12 });
        for (let i = 1; i < r.curve.length; i++) {
          // 1e-9 relative slack: the ladder-limited plateau moves only through the loaded supply voltage.
          expect(r.curve[i]!.outputV).toBeLessThanOrEqual(r.curve[i - 1]!.outputV * (1 + 1e-9));
        }
      }),
      { numRuns: 20 },
    );
  });
});
