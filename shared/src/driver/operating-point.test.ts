import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import { ladderInputOf, resolveDrive } from '../analysis/analyze-design';
import type { LadderInput } from '../multiplier/ladder.types';
import { estimateBlockingOscillator } from './blocking-oscillator';
import { driverExamples } from '../designs/driver-examples';
import type { DriverStage } from '../designs/driver-stage.types';
import { driverOperatingPoint, solveLoadPoint } from './operating-point';
import { engineLadderLoadLine, halfWaveCascadeLoadLine, type LadderLoadLine } from './ladder-load-line';

const demo = driverExamples.surfaceChargeTester;
const demoDesign = designExamples.surfaceChargeTester;
/** The demo design's own ladder (four cells of 4.7 nF, stacked diodes, 410 MΩ bleeder, 22 MΩ series) in the engine. */
const demoLadderInput: LadderInput = ladderInputOf(demoDesign, resolveDrive(demoDesign).drive);
const demoLadder = engineLadderLoadLine(demoLadderInput);

/** Reference only: the textbook half-wave cascade of two stages (four cells), 10 nF each. */
const textbookFourCells = halfWaveCascadeLoadLine(2, 10e-9);

// Textbook output impedance of an n-stage half-wave cascade (read: J. Lux, "Cockcroft Walton Voltage
// Multipliers"; memory: Kuffel, Zaengl & Kuffel §2.2.2): ΔV0/I = (2n³/3 + n²/2 − n/6)/(fC).
const textbookZoutOhm = (n: number, fHz: number, cF: number) => ((2 * n ** 3) / 3 + n ** 2 / 2 - n / 6) / (fHz * cF);

/** A plain flyback into one capacitor: the output is the flyback peak itself, no droop. */
const flybackRectifier: LadderLoadLine = {
  at: (d, loadCurrentA) => ({ outputV: d.flybackPeakV, ladderCurrentA: loadCurrentA }),
  chargeRatios: () => ({ flyback: 1, forward: 0 }),
};

const bench: DriverStage = {
  supply: { kind: 'dc', voltageV: 12, sourceResistanceOhm: 0 },
  transformer: {
    primaryTurns: 10,
    feedbackTurns: 4,
    secondaryTurns: 500,
    primaryInductanceH: 200e-6,
    couplingCoefficient: 1,
    primaryResistanceOhm: 0,
    feedbackResistanceOhm: 0,
    secondaryResistanceOhm: 0,
    saturationCurrentA: 5,
  },
  transistor: { forwardBeta: 100, reverseBeta: 2, vbeOnV: 0.7, vceSatV: 0.2, vceoMaxV: 200, icMaxA: 5 },
  baseResistorOhm: 1000,
  clamp: { kind: 'zener', clampVoltageV: 150 },
};

describe('solveLoadPoint against the textbook cascade (reference line)', () => {
  it('gives n·(V₊ + V₋) at no load with the flyback at its clamp limit (REFERENCES.md §1, asymmetric drive)', () => {
    const e = estimateBlockingOscillator(demo);
    const p = solveLoadPoint(demo, textbookFourCells, 0);
    expect(p.limitedBy).toBe('ladder');
    // 1e-6 V: the same closed form, rounding only.
    // With no load the ladder charges to the forward pulse's highest level, the ring-back's Vin + V_BE
    // through the turns: k·(Vin + V_BE)·Ns/Np, k 0.98, V_BE 0.7 V, 1:60.
    expect(p.forwardSecondaryPeakV).toBeCloseTo(0.98 * (e.supplyVoltageV.value + 0.7) * 60, 6);
    expect(p.outputV).toBeCloseTo(2 * (p.forwardSecondaryPeakV + e.maxFlybackSecondaryPeakV), 6);
  });

  it('follows V0 − Zout·I with the textbook Zout while ladder-limited', () => {
    const p = solveLoadPoint(demo, textbookFourCells, 10e-6);
    expect(p.limitedBy).toBe('ladder');
    // At the loaded point's own drive (its forward peak falls from the ring-back's level as the ladder takes
    // more forward charge than the ring-back returns): n·(V₊ + V₋) − Zout·I.
    const expected =
      2 * (p.forwardSecondaryPeakV + p.flybackSecondaryPeakV) - textbookZoutOhm(2, p.frequencyHz, 10e-9) * 10e-6;
    // 1e-9 relative: the same closed form, rounding only.
    expect(Math.abs(p.outputV - expected) / expected).toBeLessThan(1e-9);
  });
});

describe('the engine ladder as the driver load (demo design: four cells, bleeder, series resistor)', () => {
  it('pushes n charges per output charge from each pulse of an n-stage half-wave cascade (REFERENCES.md §1: V0 ≈ n·(V₊ + V₋))', () => {
    const e = estimateBlockingOscillator(demo);
    const drive = {
      forwardPeakV: e.forwardSecondaryPeakV.value,
      flybackPeakV: e.flybackSecondaryPeakV.value,
      frequencyHz: e.frequencyHz.value,
      dutyCycle: 0.9,
    };
    const ratios = demoLadder.chargeRatios(drive, 10e-6);
    // 2 %: the stacked diode's drop grows with the log of its current, which the peaks move slightly.
    expect(Math.abs(ratios.flyback - 2) / 2).toBeLessThan(0.02);
    expect(Math.abs(ratios.forward - 2) / 2).toBeLessThan(0.02);
  });

  it('holds the power balance g·I_ladder·V₋ = E·f·η when power-limited (energy conservation per cycle)', () => {
    // A stiff 3.2 V supply (two fresh alkaline cells, common practice, no source), so the forward pulse's
    // draw does not move the supply voltage and the flyback power stands on its own.
    const stiff: DriverStage = { ...demo, supply: { kind: 'dc', voltageV: 3.2, sourceResistanceOhm: 0 } };
    const op = driverOperatingPoint(stiff, demoLadder, 0, { points: 5 });
    const p = solveLoadPoint(stiff, demoLadder, op.powerLimitOnsetA * 3);
    expect(p.limitedBy).toBe('power');
    const independent = estimateBlockingOscillator(stiff, {
      flybackSecondaryPeakV: p.flybackSecondaryPeakV,
      secondaryLoad: demoLadder.secondaryLoad,
    });
    const drawnW = p.flybackChargeRatio * p.ladderCurrentA * p.flybackSecondaryPeakV;
    // 1e-6 relative: the flyback peak comes from a bisection to 1e-12 of its bracket; the ladder current moves with it.
    expect(Math.abs(drawnW - independent.deliverablePowerW.value) / independent.deliverablePowerW.value).toBeLessThan(
      1e-6,
    );
  });

  it('never puts out more than the stage delivers: V·I ≤ E·f·η + forward power over the whole curve (REFERENCES.md §3 power balance)', () => {
    const op = driverOperatingPoint(demo, demoLadder, 0, { points: 9 });
    const bleederOhm = demoLadderInput.bleederOhm ?? Infinity;
    for (const point of op.curve) {
      const e = estimateBlockingOscillator(demo, { flybackSecondaryPeakV: point.flybackSecondaryPeakV });
      const forwardW = 2 * e.forwardSecondaryPeakV.value * point.ladderCurrentA; // forward charge ratio n = 2 (§1)
      const topV = point.outputV + point.loadCurrentA * demoLadderInput.seriesOutputResistanceOhm;
      const ladderW =
        point.outputPowerW +
        point.loadCurrentA ** 2 * demoLadderInput.seriesOutputResistanceOhm +
        (topV * topV) / bleederOhm;
      // 2 % slack: the forward charge ratio is the textbook n, within 2 % of the engine's (test above).
      expect(ladderW).toBeLessThanOrEqual((e.deliverablePowerW.value + forwardW) * 1.02);
    }
  });

  it('cannot hold 4 kV at 0.3 mA, which takes 1.2 W (REFERENCES.md §3), from a stage delivering about 0.1 W', () => {
    const limitW = estimateBlockingOscillator(demo).deliverablePowerW.value;
    expect(limitW).toBeLessThan(1.2);
    const p = solveLoadPoint(demo, demoLadder, 0.3e-3);
    expect(p.limitedBy).toBe('power');
    expect(p.outputV).toBeLessThan(4000);
    // The forward pulse adds at most 2·V₊·I on top (forward charge ratio n = 2, §1); 2 % as above.
    const forwardW = 2 * p.driver.forwardSecondaryPeakV.value * p.ladderCurrentA;
    expect(p.outputPowerW).toBeLessThanOrEqual((limitW + forwardW) * 1.02);
  });

  it('switches from ladder- to power-limited at the reported onset', () => {
    const op = driverOperatingPoint(demo, demoLadder, 0, { points: 5 });
    expect(op.powerLimitOnsetA).toBeGreaterThan(0);
    expect(solveLoadPoint(demo, demoLadder, op.powerLimitOnsetA * 0.98).limitedBy).toBe('ladder');
    expect(solveLoadPoint(demo, demoLadder, op.powerLimitOnsetA * 1.02).limitedBy).toBe('power');
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
    const p = solveLoadPoint(bench, flybackRectifier, 5e-3);
    expect(p.limitedBy).toBe('power');
    const e = estimateBlockingOscillator(bench, { flybackSecondaryPeakV: p.outputV });
    // 1e-6 relative (bisection).
    expect(Math.abs(p.outputPowerW - e.deliverablePowerW.value) / e.deliverablePowerW.value).toBeLessThan(1e-6);
  });
});

describe('driverOperatingPoint with the engine ladder (fast-check)', () => {
  it('the output never rises with load current, any cell count and capacitor values', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 4 }),
        fc.array(fc.double({ min: 1e-9, max: 47e-9, noNaN: true }), { minLength: 8, maxLength: 8 }),
        (stages, capacitorsF) => {
          const ladder = engineLadderLoadLine({ ...demoLadderInput, capacitorsF: capacitorsF.slice(0, 2 * stages) });
          const r = driverOperatingPoint(demo, ladder, 0, { points: 8 });
          for (let i = 1; i < r.curve.length; i++) {
            // 1e-6 relative slack: on the ladder-limited plateau the clamp limit V_clamp − Vin rises a little as
            // the loaded cells sag; the model's own solve tolerance is far below that.
            expect(r.curve[i]!.outputV).toBeLessThanOrEqual(r.curve[i - 1]!.outputV * (1 + 1e-6));
          }
        },
      ),
      { numRuns: 8 },
    );
  });
});
