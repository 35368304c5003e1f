import { describe, expect, it } from 'vitest';
import { isDomainError } from '../errors';
import type { LadderCircuitSpec } from '../circuits/build-ladder-circuit';
import { runLadder } from './ladder-runs';

describe('runLadder', () => {
  it('discharges a bridge doubler through its bleeder in R·(C/2)·ln(V0/Vsafe)', () => {
    // Drive off, winding shorted: both halves in series across the bleeder, the diodes reverse-biased.
    // Check value: t_safe = RC ln(V0/V_safe), REFERENCES.md §4 (read), with C the series pair C/2.
    const capF = 100e-9;
    const bleederOhm = 10e6;
    const result = runLadder(
      {
        topology: 'bridge-doubler',
        cellCount: 2,
        capacitorsF: [capF, capF],
        diode: { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 },
        drive: { kind: 'sine', peakV: 1000, frequencyHz: 10e3, sourceResistanceOhm: 10 },
        bleederOhm,
        load: null,
      },
      { until: 'steady', maxStepPerPeriod: 100, dischargeToV: 50 },
    );
    expect(result.method).toBe('periodic-steady-state');
    const v0 = result.discharge!.output.values[0]!;
    const expectedS = bleederOhm * (capF / 2) * Math.log(v0 / 50);
    // 1 %: the ripple at switch-off (1 mA·… ≈ 0.05 % of V0 here) and the step grid of the crossing.
    expect(Math.abs(result.discharge!.dischargeTimeS! / expectedS - 1)).toBeLessThan(0.01);
    // The output approaches 2·Vmax less the diode drops (REFERENCES.md §2: bridge doubler, output 2 Vmax).
    expect(result.outputMeanV).toBeGreaterThan(0.97 * 2000);
    expect(result.outputMeanV).toBeLessThan(2000);
    expect(result.timeToSteadyStateS).not.toBeNull();
  });

  it('discharges unequal bridge halves in R·C_eq·ln(V0/Vsafe) and traces each capacitor', () => {
    // Check value: t_safe = RC ln(V0/V_safe), REFERENCES.md §4 (read), C the series pair C1·C2/(C1 + C2): the
    // same bleeder current leaves both halves. Safe level 1000 V (from 2000 V) so that the smaller half (C1,
    // 10 nF, losing 2.2 times the voltage C2 loses) ends near 310 V instead of being driven through zero onto D1.
    const capacitorsF = [10e-9, 22e-9];
    const bleederOhm = 10e6;
    const safeV = 1000;
    const result = runLadder(
      {
        topology: 'bridge-doubler',
        cellCount: 2,
        capacitorsF,
        diode: { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 },
        drive: { kind: 'sine', peakV: 1000, frequencyHz: 10e3, sourceResistanceOhm: 10 },
        bleederOhm,
        load: null,
      },
      { until: 'steady', maxStepPerPeriod: 100, dischargeToV: safeV },
    );
    const discharge = result.discharge!;
    const c1 = discharge.capacitorVoltagesV.C1!;
    const c2 = discharge.capacitorVoltagesV.C2!;
    // Each half starts near the drive peak (REFERENCES.md §2: bridge doubler, each half Vmax); 3 % for the
    // diode drop and the source-resistance loss.
    for (const trace of [c1, c2]) expect(Math.abs(trace.values[0]! / 1000 - 1)).toBeLessThan(0.03);
    const v0 = c1.values[0]! + c2.values[0]!;
    const seriesF = (capacitorsF[0]! * capacitorsF[1]!) / (capacitorsF[0]! + capacitorsF[1]!);
    const expectedS = bleederOhm * seriesF * Math.log(v0 / safeV);
    // 2 %: the crossing is interpolated inside one step of RC/2000 and diode leakage is nanoamps against 100 µA and more.
    expect(Math.abs(discharge.dischargeTimeS! / expectedS - 1)).toBeLessThan(0.02);
    // Charge balance of the series pair: both halves lost the same charge, C1·ΔV1 = C2·ΔV2 (0.5 %: leakage).
    const lost1C = capacitorsF[0]! * (c1.values[0]! - c1.values[c1.values.length - 1]!);
    const lost2C = capacitorsF[1]! * (c2.values[0]! - c2.values[c2.values.length - 1]!);
    expect(Math.abs(lost1C / lost2C - 1)).toBeLessThan(0.005);
  });

  const doubler: LadderCircuitSpec = {
    topology: 'bridge-doubler',
    cellCount: 2,
    capacitorsF: [100e-9, 100e-9],
    diode: { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 },
    drive: { kind: 'sine', peakV: 1000, frequencyHz: 10e3, sourceResistanceOhm: 10 },
    bleederOhm: 10e6,
    load: null,
  };

  it.each([
    ['steady with discharge', { until: 'steady', maxStepPerPeriod: 50, dischargeToV: 50 }],
    ['a fixed cycle count', { until: { cycles: 30 }, maxStepPerPeriod: 50 }],
  ] as const)('reports non-decreasing progress ending at exactly 1 (%s)', (_name, options) => {
    const fractions: number[] = [];
    runLadder(doubler, { ...options, onProgress: (f) => fractions.push(f) });
    expect(fractions[0]).toBe(0);
    expect(fractions[fractions.length - 1]).toBe(1);
    // Intermediate values exist: the start-up reports per cycle, not only at the phase ends.
    expect(fractions.filter((f) => f > 0 && f < 1).length).toBeGreaterThan(3);
    fractions.slice(1).forEach((f, i) => expect(f).toBeGreaterThanOrEqual(fractions[i]!));
    // Bounded rate: each report but the forced phase ends rises by at least 1 %, so at most ~100 + 4 calls.
    expect(fractions.length).toBeLessThanOrEqual(105);
  });

  it('stops with a cancelled DomainError once shouldCancel answers true', () => {
    let checks = 0;
    let caught: unknown = null;
    try {
      runLadder(doubler, { until: { cycles: 200 }, maxStepPerPeriod: 50, shouldCancel: () => ++checks > 500 });
    } catch (error) {
      caught = error;
    }
    expect(isDomainError(caught) && caught.code).toBe('cancelled');
    // It stopped at the first check that answered true, well before the 200 cycles' ~10 000 steps.
    expect(checks).toBe(501);
  });
});

describe('runLadder settling without a periodic steady state', () => {
  // A 10-stage half-wave cascade whose slowest charging mode takes a few hundred cycles.
  const cascade: LadderCircuitSpec = {
    topology: 'half-wave',
    cellCount: 20,
    capacitorsF: Array<number>(20).fill(10e-9),
    diode: { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 },
    drive: { kind: 'sine', peakV: 500, frequencyHz: 20e3, sourceResistanceOhm: 10 },
    load: { kind: 'current', currentA: 100e-6 },
  };
  // Reference: our own transient of the same circuit and step run for 4,000 cycles, several times the
  // slowest mode's settling (the same stepper, so the step error is common to both and cancels).
  const long = runLadder(cascade, { until: { cycles: 4000 }, maxStepPerPeriod: 100 });

  it('stops on the extrapolated rest of the approach and lands within it of a long run', () => {
    const run = runLadder(cascade, { until: 'steady', maxStepPerPeriod: 100, isShootingUsed: false });
    expect(run.method).toBe('transient');
    expect(run.isSettled).toBe(true);
    expect(run.periodicSteadyState).toBeNull();
    expect(long.isSettled).toBe(true);
    // Within the settling fraction (2e-4) plus margin for the estimate: 5e-4 of the long run's mean.
    expect(Math.abs(run.outputMeanV / long.outputMeanV - 1)).toBeLessThan(5e-4);
    // The estimated rest accounts for the gap to the long run within 5e-4 of the output.
    expect(Math.abs(run.outputMeanV + run.remainingDriftV! - long.outputMeanV)).toBeLessThan(5e-4 * long.outputMeanV);
  });

  it('flags a run cut short as not settled, with its remaining drift estimated', () => {
    const run = runLadder(cascade, { until: { cycles: 150 }, maxStepPerPeriod: 100 });
    expect(run.isSettled).toBe(false);
    const trueRestV = long.outputMeanV - run.outputMeanV;
    // Far from settled (more than 10 % to go), and the geometric extrapolation of the slowest mode gets
    // the rest within 30 % (the faster modes have not died out after 150 cycles).
    expect(trueRestV).toBeGreaterThan(0.1 * long.outputMeanV);
    expect(Math.abs(run.remainingDriftV! / trueRestV - 1)).toBeLessThan(0.3);
  });
});
