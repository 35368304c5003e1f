import { describe, expect, it } from 'vitest';
import { estimateBlockingOscillator } from './blocking-oscillator';
import { driverExamples } from '../designs/driver-examples';
import { runDriverChecks } from './driver-checks';
import type { DriverStage } from '../designs/driver-stage.types';
import { engineLadderLoadLine, halfWaveCascadeLoadLine, type LadderLoadLine } from './ladder-load-line';
import { designExamples } from '../designs/design-examples';
import { ladderInputOf, resolveDrive } from '../analysis/analyze-design';

const demo = driverExamples.surfaceChargeTester;
const ladder = halfWaveCascadeLoadLine(2, 10e-9);
const verdictOf = (driver: DriverStage, id: string, extra = {}) => {
  const v = runDriverChecks(driver, { ladder, ratedLoadCurrentA: 20e-6, ...extra }).verdicts.find((x) => x.id === id);
  if (!v) throw new Error(`no verdict ${id}`);
  return v;
};

describe('runDriverChecks', () => {
  it('grades the collector voltage against Vce0 with 80 % derating (common practice, no source)', () => {
    // Clamp at 30 V of 40 V = 75 % → pass with 25 % margin; 36 V = 90 % → marginal.
    const pass = verdictOf(demo, 'driver.collector-voltage');
    expect(pass.verdict).toBe('pass');
    expect(pass.marginPct).toBeCloseTo(25, 9); // exact ratio, rounding only
    expect(
      verdictOf({ ...demo, clamp: { kind: 'zener', clampVoltageV: 36 } }, 'driver.collector-voltage').verdict,
    ).toBe('marginal');
  });

  it('fails an unclamped stage whose flyback rises to breakdown plus the leakage spike', () => {
    const v = verdictOf({ ...demo, clamp: undefined }, 'driver.collector-voltage');
    expect(v.verdict).toBe('fail');
    expect(v.marginPct).toBeLessThan(0);
  });

  it('compares hFE·I_B with the peak current the rated load needs; short of it, the verdict fails', () => {
    const ok = verdictOf(demo, 'driver.base-drive');
    expect(ok.value).toBeGreaterThan(ok.limit);
    // A load far beyond the power-limit onset needs more than the base can hold.
    const heavy = runDriverChecks(demo, { ladder, ratedLoadCurrentA: 1e-3 }).verdicts.find(
      (x) => x.id === 'driver.base-drive',
    );
    expect(heavy?.verdict).toBe('fail');
  });

  it('asks the supplier for a hipot of 2·U + 1000 V on the secondary peak (common practice, no source)', () => {
    const r = runDriverChecks(demo, { ladder, ratedLoadCurrentA: 20e-6 });
    const u = Math.max(r.ratedLoad!.driver.forwardSecondaryPeakV.value, r.ratedLoad!.flybackSecondaryPeakV);
    expect(r.hipotTestVoltageV.value).toBeCloseTo(2 * u + 1000, 9);
    expect(r.hipotTestVoltageV.method.source).toBe('common practice, no source');
    const insulation = r.verdicts.find((x) => x.id === 'driver.winding-insulation');
    expect(insulation?.value).toBeCloseTo(u, 9);
  });

  it('checks the cell drain against the alkaline continuous capability, 1 A (common practice, no source)', () => {
    const v = verdictOf(demo, 'driver.cell-current');
    expect(v.limit).toBe(1);
    expect(v.verdict).toBe('pass');
    // A weak cell rated 50 mA: the ~38 mA drain is above half of it → marginal.
    const weak = { ...demo, supply: { ...demo.supply, maxContinuousCurrentA: 0.05 } } as DriverStage;
    const w = verdictOf(weak, 'driver.cell-current');
    expect(w.value).toBeGreaterThan(0.025);
    expect(w.verdict).toBe('marginal');
  });

  it('bounds the battery life by charge balance between the fresh and the end-of-life drain', () => {
    const r = runDriverChecks(demo, { ladder, ratedLoadCurrentA: 20e-6 });
    const life = r.batteryLife!;
    const supply = demo.supply;
    if (supply.kind !== 'cells') throw new Error('cells expected');
    const drawnC = supply.capacityAh * 3600 * (1 - life.endChargeFraction);
    // The base-limited stage draws less as the cells fall, so the life lies between the charge over the
    // fresh drain and the charge over the drain at the end voltage.
    const freshA = r.ratedLoad!.supplyCurrentA;
    const endA = estimateBlockingOscillator({
      ...demo,
      supply: { kind: 'dc', voltageV: 2 * supply.endVoltagePerCellV, sourceResistanceOhm: 0 },
    }).inputCurrentA.value;
    expect(life.lifeS.value).toBeGreaterThan(drawnC / freshA);
    expect(life.lifeS.value).toBeLessThan(drawnC / (endA * 0.9));
  });

  it('grades the battery life against a target with a 1.2× reserve (common practice, no source)', () => {
    const lifeS = runDriverChecks(demo, { ladder, ratedLoadCurrentA: 20e-6 }).batteryLife!.lifeS.value;
    expect(verdictOf(demo, 'driver.battery-life', { batteryLifeTargetS: lifeS / 1.3 }).verdict).toBe('pass');
    expect(verdictOf(demo, 'driver.battery-life', { batteryLifeTargetS: lifeS / 1.1 }).verdict).toBe('marginal');
    expect(verdictOf(demo, 'driver.battery-life', { batteryLifeTargetS: lifeS * 1.1 }).verdict).toBe('fail');
  });

  it('gives the battery life after a capacitor edit as a table that keeps nothing between calls does', () => {
    // The stage limits of the table are kept from the first ladder (the same load on the secondary, other values).
    const design = designExamples.surfaceChargeTester;
    const { drive, currentLimitA } = resolveDrive(design);
    const lineOf = (valueF: number): LadderLoadLine => {
      const capacitors = design.multiplier.capacitors.map((c) => ({ ...c, valueF }));
      return engineLadderLoadLine(
        ladderInputOf({ ...design, multiplier: { ...design.multiplier, capacitors } }, drive, currentLimitA),
      );
    };
    const lifeWith = (line: LadderLoadLine) =>
      runDriverChecks(demo, { ladder: line, ratedLoadCurrentA: 20e-6 }).batteryLife!.lifeS.value;
    lifeWith(lineOf(4.7e-9));
    const { at, chargeRatios, network, secondaryLoad } = lineOf(5.6e-9);
    const keyless: LadderLoadLine = {
      at,
      chargeRatios,
      ...(network ? { network } : {}),
      ...(secondaryLoad ? { secondaryLoad } : {}),
    };
    expect(lifeWith(lineOf(5.6e-9))).toBe(lifeWith(keyless));
  });
});
