import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import { validateDesign } from '../designs/validate-design';
import type { Design } from '../designs/design.types';
import { HV_CAUTION } from '../safety/hazard-limits';
import { driverReport } from '../driver/driver-report';
import { estimateBlockingOscillator } from '../driver/blocking-oscillator';
import { solveLoadPoint } from '../driver/operating-point';
import { engineLadderLoadLine, secondaryLoadOf } from '../driver/ladder-load-line';
import { analyzeDesign, analyzeLadderReport, ladderInputOf, resolveDrive } from './analyze-design';
import { DERATING } from '../multiplier/ladder-stress';

describe('analyzeDesign on the demo designs', () => {
  it.each(Object.entries(designExamples))(
    '%s: meets its own targets and carries the caution once for its verdicts',
    (_, design) => {
      const report = analyzeDesign(validateDesign(structuredClone(design)));
      expect(Math.sign(report.outputMeanV)).toBe(Math.sign(design.targets.outputV));
      expect(report.meetsTargets).toEqual({ output: true, ripple: true });
      expect(report.checks.length).toBeGreaterThan(5);
      expect(report.caution).toBe(HV_CAUTION);
      // Said once for all the verdicts, not repeated in each.
      expect(JSON.stringify(report).split(HV_CAUTION)).toHaveLength(2);
      for (const check of report.checks) {
        expect(['pass', 'marginal', 'fail']).toContain(check.verdict);
        expect(Number.isFinite(check.marginPct)).toBe(true);
        expect(check.rule.length).toBeGreaterThan(10);
      }
      expect(report.methods.map((m) => m.methodId)).toContain('charge-transfer-v1');
      // Signed: min ≤ mean ≤ max for either polarity; ripple = max − min (to 1e-9 V, float noise).
      expect(report.outputMinV).toBeLessThanOrEqual(report.outputMeanV);
      expect(report.outputMeanV).toBeLessThanOrEqual(report.outputMaxV);
      expect(Math.abs(report.ripplePeakToPeakV - (report.outputMaxV - report.outputMinV))).toBeLessThan(1e-9);
    },
  );

  it('resolves the driver drive of the surface-charge tester into pulses and checks the driver power', () => {
    const report = analyzeDesign(designExamples.surfaceChargeTester);
    expect(report.resolvedDrive.kind).toBe('pulse');
    const power = report.checks.find((c) => c.id === 'driver-power');
    expect(power?.unit).toBe('W');
    // The 20 % marginal band is a habit of the trade, said as such (the spec sheet's "Set by" column shows it).
    expect(power?.rule).toMatch(/\(common practice, no source\)$/);
  });

  it('names a driver-stage problem under drive. in the design', () => {
    const design = structuredClone(designExamples.surfaceChargeTester);
    if (design.drive.kind === 'driver') design.drive.driver.transformer.primaryInductanceH = 0;
    expect(() => analyzeDesign(design)).toThrow(
      expect.objectContaining({ field: 'drive.driver.transformer.primaryInductanceH' }),
    );
  });

  it('the ionizer bar is a negative ladder: outputs negative, PIV and capacitor figures positive magnitudes', () => {
    const report = analyzeDesign(designExamples.ionizerBar);
    expect(report.outputMeanV).toBeLessThan(-6000);
    expect(report.noLoadOutputV).toBeLessThan(report.outputMeanV); // more negative at no load
    for (const d of report.analysis.diodes) expect(d.peakInverseV).toBeGreaterThan(0);
  });
});

describe('analyzeDesign: the driver section of the surface-charge tester', () => {
  const design = designExamples.surfaceChargeTester;
  const stage = design.drive.kind === 'driver' ? design.drive.driver : null;
  if (!stage) throw new Error('driver drive expected');
  const withTarget = structuredClone(design);
  if (withTarget.drive.kind === 'driver') withTarget.drive.driver.batteryLifeTargetH = 20;
  const report = analyzeDesign(withTarget);
  const ladder = engineLadderLoadLine(
    ladderInputOf(design, resolveDrive(design).drive, resolveDrive(design).currentLimitA),
  );
  const loadA = design.targets.loadCurrentA;
  const direct = solveLoadPoint(stage, ladder, loadA);

  it('carries the estimate figures with their methods, at the operating point the driver functions give', () => {
    const d = report.driver!;
    expect(d.figures.onTimeLimit).toMatch(/^(base|saturation)$/);
    for (const figure of [
      d.figures.onTimeS,
      d.figures.peakPrimaryCurrentA,
      d.figures.flybackTimeS,
      d.figures.frequencyHz,
      d.figures.energyPerCycleJ,
      d.figures.deliverablePowerW,
      d.figures.forwardSecondaryPeakV,
      d.figures.flybackSecondaryPeakV,
      d.figures.collectorPeakV,
      d.figures.baseCurrentA,
      d.figures.inputCurrentA,
      d.figures.efficiency,
    ]) {
      expect(figure.method.summary.length).toBeGreaterThan(5);
      expect(Number.isFinite(figure.value)).toBe(true);
    }
    // 1e-9 relative: the same functions on the same inputs, so rounding only.
    const close = (a: number, b: number) => expect(Math.abs(a - b) / Math.abs(b)).toBeLessThan(1e-9);
    close(d.figures.frequencyHz.value, direct.driver.frequencyHz.value);
    close(d.figures.peakPrimaryCurrentA.value, direct.driver.peakPrimaryCurrentA.value);
    close(d.operatingPoint.ratedLoad.outputV, direct.outputV);
    expect(d.operatingPoint.limitedBy).toBe(direct.limitedBy);
    // At the limit the stage carries the ladder's diodes on its secondary (the ring-back's capacitance).
    const secondaryLoad = secondaryLoadOf({
      capacitorsF: design.multiplier.capacitors.map((c) => c.valueF),
      diode: design.multiplier.diode,
    });
    close(
      d.atLimit.deliverablePowerW.value,
      estimateBlockingOscillator(stage, { secondaryLoad }).deliverablePowerW.value,
    );
    expect(d.operatingPoint.curve.length).toBeGreaterThan(10);
  });

  it('makes the operating point the headline output (load terminal, cycle mean)', () => {
    // 1e-6 relative: the ladder report re-solves the same drive with the load inside the model, the
    // operating point with the load as an external current: the two solves agree to their tolerance.
    expect(
      Math.abs(report.outputMeanV - report.driver!.operatingPoint.ratedLoad.outputV) / report.outputMeanV,
    ).toBeLessThan(1e-6);
    expect(
      Math.abs(report.noLoadOutputV - report.driver!.operatingPoint.curve[0]!.outputV) / report.noLoadOutputV,
    ).toBeLessThan(1e-12);
    expect(report.resolvedDrive.kind === 'pulse' && report.resolvedDrive.flybackPeakV).toBeCloseTo(
      direct.flybackSecondaryPeakV,
      6,
    );
  });

  it('reports the headline as power-limited when the rated load is beyond the driver, well below the clamp-limited ladder', () => {
    const heavy = structuredClone(design);
    heavy.load = { kind: 'current', currentA: 0.3e-3 };
    heavy.targets.loadCurrentA = 0.3e-3;
    const r = analyzeDesign(heavy);
    expect(r.driver!.operatingPoint.limitedBy).toBe('power');
    // REFERENCES.md §3: 0.3 mA at 4 kV takes 1.2 W; the stage delivers about 0.1 W, so the output stays far below.
    expect(r.outputMeanV * 0.3e-3).toBeLessThan(r.driver!.atLimit.deliverablePowerW.value * 1.2);
    expect(r.driver!.figures.flybackSecondaryPeakV.value).toBeLessThan(r.driver!.atLimit.flybackSecondaryPeakV.value);
  });

  it('carries battery life with the cell curve, the hipot voltage and the driver checks in the report checks', () => {
    const d = report.driver!;
    const expected = driverReport(withTarget.drive.kind === 'driver' ? withTarget.drive.driver : stage, ladder, loadA);
    // 1e-9 relative: the same functions on the same inputs.
    expect(
      Math.abs(d.batteryLife!.lifeS.value - expected.batteryLife!.lifeS.value) / expected.batteryLife!.lifeS.value,
    ).toBeLessThan(1e-9);
    expect(d.batteryLife!.cellCurve.length).toBeGreaterThan(2);
    expect(d.batteryLife!.targetS).toBe(20 * 3600);
    expect(d.hipotTestVoltageV.method.summary).toContain('2·U + 1000');
    const ids = report.checks.map((c) => c.id);
    for (const id of [
      'driver.collector-voltage',
      'driver.collector-current',
      'driver.base-drive',
      'driver.winding-insulation',
      'driver.cell-current',
      'driver.battery-life',
    ]) {
      expect(ids).toContain(id);
    }
    const life = report.checks.find((c) => c.id === 'driver.battery-life')!;
    expect(life.limit).toBe(20 * 3600);
    expect(report.caution).toBe(HV_CAUTION);
  });

  it('leaves the driver section out of a design without a driver stage', () => {
    expect(analyzeDesign(designExamples.detectorBias).driver).toBeNull();
  });
});

describe('component checks', () => {
  function withCapRating(ratedVoltageV: number): Design {
    const design = structuredClone(designExamples.detectorBias);
    const cap = design.multiplier.capacitors[1];
    if (cap) cap.ratedVoltageV = ratedVoltageV;
    return design;
  }

  it('capacitor voltage: pass below rating × 0.8, marginal up to the rating, fail above (derating common practice)', () => {
    // C2 of the tripler (oscillating) sees about 2·Vmax ≈ 630 V.
    const maxV = analyzeDesign(withCapRating(1000)).analysis.capacitors[1]?.maxVoltageV ?? NaN;
    const verdictAt = (rated: number) =>
      analyzeDesign(withCapRating(rated)).checks.find((c) => c.id === 'cap-voltage-c2');
    expect(verdictAt(maxV / DERATING.capacitorVoltage + 1)?.verdict).toBe('pass');
    expect(verdictAt(maxV / 0.9)?.verdict).toBe('marginal');
    expect(verdictAt(maxV * 0.95)?.verdict).toBe('fail');
    expect(verdictAt(maxV * 0.95)?.marginPct).toBeLessThan(0);
  });

  it('bleeder: a string of resistors shares the voltage; too few resistors fail on element voltage', () => {
    const design = structuredClone(designExamples.ionizerBar);
    if (design.outputNetwork.bleeder)
      design.outputNetwork.bleeder = { ...design.outputNetwork.bleeder, count: 1, valueOhm: 1e9 };
    const checks = analyzeDesign(design).checks.filter((c) => c.id.startsWith('bleeder-voltage'));
    expect(checks).toHaveLength(1);
    expect(checks[0]?.verdict).toBe('fail'); // ~6.6 kV over one 2.5 kV element
  });

  it('reports the per-stage creepage requirement and fails a layout below it', () => {
    const design = structuredClone(designExamples.detectorBias);
    design.targets.spacing.providedCreepageMm = 1;
    const report = analyzeDesign(design);
    expect(report.spacing.length).toBe(2);
    expect(report.checks.filter((c) => c.id.startsWith('creepage-stage')).every((c) => c.verdict === 'fail')).toBe(
      true,
    );
  });
});

describe('analyzeDesign: the bleeder and component stress at the operating point', () => {
  const demo = designExamples.surfaceChargeTester;
  // The demo with a heavy bleeder (5 × 1 MΩ: about 0.5 mA at a few kV) and no external load.
  const heavyBleeder: Design = {
    ...structuredClone(demo),
    load: { kind: 'current', currentA: 0 },
    outputNetwork: {
      ...demo.outputNetwork,
      bleeder: { ...demo.outputNetwork.bleeder!, valueOhm: 1e6 },
    },
  };
  const report = analyzeDesign(heavyBleeder);

  it('reports the bleeder power V²/R and the droop the bleeder causes, not zero (Ohm’s law)', () => {
    const topV = Math.abs(report.analysis.ladderTopMeanV);
    // 1e-9 relative: Ohm's law on the reported top voltage; only rounding between the two.
    expect(Math.abs(report.bleederPowerW - (topV * topV) / 5e6) / report.bleederPowerW).toBeLessThan(1e-9);
    expect(report.ladderOutputPowerW).toBeGreaterThanOrEqual(report.bleederPowerW);
    // 0.5 mA from a driver of ~0.1 W deliverable: the output falls far below the open-circuit output.
    expect(report.droopWithBleederV).toBeGreaterThan(0.2 * Math.abs(report.openCircuitOutputV));
    expect(Math.abs(report.openCircuitOutputV)).toBeGreaterThan(Math.abs(report.outputMeanV));
  });

  it('checks capacitors, diodes and bleeder at the lightest operating point, below the open-circuit flyback', () => {
    const unbled = analyzeDesign({
      ...structuredClone(heavyBleeder),
      outputNetwork: { ...heavyBleeder.outputNetwork, bleeder: null },
    });
    const worst = (r: typeof report, prefix: string): number =>
      Math.max(...r.checks.filter((c) => c.id.startsWith(prefix)).map((c) => c.value ?? 0));
    // Without a bleeder or load nothing holds the flyback: the ladder sits at its open-circuit voltages, and a
    // capacitor carries up to twice the secondary's peak-to-peak share (REFERENCES.md §1, capacitor stress).
    // With the 5 MΩ bleeder the operating point holds the flyback far lower: the stress follows it.
    expect(worst(report, 'cap-voltage')).toBeLessThan(0.9 * worst(unbled, 'cap-voltage'));
    expect(worst(report, 'diode-piv')).toBeLessThan(0.9 * worst(unbled, 'diode-piv'));
    // The stress sits at the operating point with no external load: at most the open-circuit share per capacitor.
    const capsAtLightest = report.driver!.operatingPoint.curve[0]!.outputV / 2;
    expect(worst(report, 'cap-voltage')).toBeLessThan(1.2 * capsAtLightest);
  });
});

describe('optimum stage count, closed form beside the best whole number', () => {
  it('gives n_opt = √(Vmax f C / I) = 13.7 as a continuous value for the n = 8 check example (FOSSEE companion, ch. 6, read)', () => {
    const r = analyzeLadderReport({
      topology: 'half-wave',
      capacitorsF: Array(16).fill(0.05e-6),
      drive: { kind: 'sine', peakV: 125e3, frequencyHz: 150, sourceResistanceOhm: 0 },
      diode: { saturationCurrentA: 1e-300, emissionCoefficient: 1e-9, seriesResistanceOhm: 0 },
      polarity: 1,
      load: { kind: 'current', currentA: 5e-3 },
      bleederOhm: null,
      seriesOutputResistanceOhm: 0,
    });
    // Printed to 0.1: tolerance half the last digit.
    expect(Math.abs(r.optimumStagesClosedForm! - 13.7)).toBeLessThan(0.05);
    expect(Number.isInteger(r.optimumStages)).toBe(true);
    // The whole-number optimum of the model lies within one stage of the published rounding, 14.
    expect(Math.abs(r.optimumStages - 14)).toBeLessThanOrEqual(1);
  });
});

describe('facts of the trade as check values', () => {
  it('a half-wave tripler’s no-load output approaches three times the secondary’s peak (common practice, no source)', () => {
    // Three cells on a 1 kV-peak sine at 50 kHz, 10 nF, no load and no bleeder: only the diodes' drops stand
    // between the output and 3 kV.
    const r = analyzeLadderReport({
      topology: 'half-wave',
      capacitorsF: [10e-9, 10e-9, 10e-9],
      drive: { kind: 'sine', peakV: 1000, frequencyHz: 50e3, sourceResistanceOhm: 0 },
      diode: designExamples.surfaceChargeTester.multiplier.diode,
      polarity: 1,
      load: null,
      bleederOhm: null,
      seriesOutputResistanceOhm: 0,
    });
    expect(r.outputMeanV).toBeGreaterThan(0.95 * 3000);
    expect(r.outputMeanV).toBeLessThanOrEqual(3000);
  });

  it('a two-cell converter into a tripler reaches the 1.5 kV class drawing around 1.5 W (common practice, no source)', () => {
    // Two alkaline cells, a blocking oscillator with a feedback winding, a 1:100 step-up fed from the flyback, a
    // half-wave tripler of 10 nF, 4.7 nF and 22 nF, loaded with 1 mA: the class of a handheld HV supply.
    const design = structuredClone(designExamples.surfaceChargeTester);
    if (design.drive.kind !== 'driver') throw new Error('driver design expected');
    const driver = design.drive.driver;
    driver.transformer = {
      ...driver.transformer,
      primaryTurns: 10,
      feedbackTurns: 4,
      secondaryTurns: 1000,
      primaryInductanceH: 100e-6,
      secondaryResistanceOhm: 30,
      saturationCurrentA: 2,
      secondaryPhasing: 'flyback',
    };
    driver.baseResistorOhm = 220;
    driver.transistor = { ...driver.transistor, icMaxA: 3 };
    design.multiplier = {
      ...design.multiplier,
      cellCount: 3,
      capacitors: [10e-9, 4.7e-9, 22e-9].map((valueF) => ({ valueF, tolerance: 0.1, ratedVoltageV: 3000 })),
    };
    design.outputNetwork = { bleeder: null, seriesOutputResistanceOhm: 0 };
    design.load = { kind: 'current', currentA: 1e-3 };
    design.targets = { ...design.targets, outputV: 1500, loadCurrentA: 1e-3, rippleMaxV: 100 };
    expect(() => validateDesign(design)).not.toThrow();
    const report = analyzeDesign(design);
    const figures = report.driver!.benchFigures;
    // "The 1.5 kV class": within a quarter of 1.5 kV; "around 1.5 W" from the cells: within half of 1.5 W.
    expect(Math.abs(report.outputMeanV)).toBeGreaterThan(1.5e3 * 0.75);
    expect(Math.abs(report.outputMeanV)).toBeLessThan(1.5e3 * 1.25);
    expect(figures.inputPowerW).toBeGreaterThan(1.5 * 0.5);
    expect(figures.inputPowerW).toBeLessThan(1.5 * 1.5);
    // Energy balance: what reaches the 1 mA load is no more than what the cells give.
    expect(Math.abs(report.outputMeanV) * 1e-3).toBeLessThanOrEqual(figures.inputPowerW);
  });
});

describe('winding phasing', () => {
  it('feeds an odd ladder from the flyback for more output than from the forward pulse when the flyback is larger (REFERENCES.md §1, asymmetric drive)', () => {
    const demo = designExamples.surfaceChargeTester;
    const tripler = (phasing: 'flyback' | 'forward'): Design => {
      const d = structuredClone(demo);
      if (d.drive.kind !== 'driver') throw new Error('driver design expected');
      d.drive.driver.transformer.secondaryPhasing = phasing;
      d.multiplier = { ...d.multiplier, cellCount: 3, capacitors: d.multiplier.capacitors.slice(0, 3) };
      return d;
    };
    const flyback = analyzeDesign(tripler('flyback'));
    const forward = analyzeDesign(tripler('forward'));
    // The demo's flyback (~1.6 kV at the secondary) is several times its forward pulse (~0.18 kV): a
    // half-wave tripler takes two of the pulses on its positive side and one on the other, so feeding it
    // the flyback on the positive side gives the larger output.
    expect(Math.abs(flyback.noLoadOutputV)).toBeGreaterThan(1.3 * Math.abs(forward.noLoadOutputV));
    expect(flyback.driver!.benchFigures.secondaryVoltagePeakPositiveV).toBeGreaterThan(
      -flyback.driver!.benchFigures.secondaryVoltagePeakNegativeV,
    );
  });
});

describe('analyzeDesign: a load beyond what the driver can deliver', () => {
  const tester = designExamples.surfaceChargeTester;
  const asking = (currentA: number): Design => ({
    ...tester,
    load: { kind: 'current', currentA },
    targets: { ...tester.targets, loadCurrentA: currentA },
  });
  const report = analyzeDesign(asking(1e-3));
  const driver = report.driver!;

  it('says the load is beyond the supply, with the largest load it holds, and fails a Check', () => {
    expect(driver.loadCapacity?.isLoadBeyond).toBe(true);
    expect(driver.loadCapacity?.loadCurrentA).toBe(1e-3);
    const maxA = driver.loadCapacity!.maxLoadCurrentA;
    expect(maxA).toBeGreaterThan(0);
    expect(maxA).toBeLessThan(1e-3);
    const check = report.checks.find((c) => c.id === 'driver.load-capacity')!;
    expect(check.verdict).toBe('fail');
    expect(check.value).toBe(1e-3);
    expect(check.limit).toBe(maxA);
  });

  it('never reports a negative output or a vanishing frequency there', () => {
    // A positive half-wave ladder's output cannot go below zero, and the oscillator keeps running at the
    // largest load it holds (common practice, no source).
    expect(report.outputMeanV).toBeGreaterThanOrEqual(0);
    expect(report.outputMeanV).toBeLessThan(0.01 * Math.abs(tester.targets.outputV));
    const atMax = analyzeDesign(asking(driver.loadCapacity!.maxLoadCurrentA)).driver!;
    // The same stage as at the largest load it holds: 1e-9 relative, the same solve.
    expect(
      Math.abs(driver.benchFigures.oscillationFrequencyHz / atMax.benchFigures.oscillationFrequencyHz - 1),
    ).toBeLessThan(1e-9);
    expect(driver.benchFigures.oscillationFrequencyHz).toBeGreaterThan(1e3);
    expect(report.meetsTargets.output).toBe(false);
  });

  it('holds the output above zero below that load and passes the Check at a light load', () => {
    const half = analyzeDesign(asking(0.5 * driver.loadCapacity!.maxLoadCurrentA));
    expect(half.driver!.loadCapacity?.isLoadBeyond).toBe(false);
    expect(half.outputMeanV).toBeGreaterThan(0);
    const light = analyzeDesign(tester);
    expect(light.checks.find((c) => c.id === 'driver.load-capacity')?.verdict).toBe('pass');
  });
});
