import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import type { Design } from '../designs/design.types';
import type { DriverStage } from '../designs/driver-stage.types';
import { ladderInputOf, resolveDrive } from '../analysis/analyze-design';
import { bracketedRoot } from '../multiplier/bracketed-root';
import { blockingOscillatorNumbers } from './blocking-oscillator';
import { engineLadderLoadLine } from './ladder-load-line';
import { forwardPeakFor, forwardShareOf } from './ring-back';
import { batteryLife, cellCurveOf } from './battery';
import { runDriverChecks } from './driver-checks';
import {
  driverOperatingPoint,
  solveLoadPoint,
  supplyCurrentAt,
  supplyCurrentNear,
  type WarmStart,
} from './operating-point';

/*
 * The warm-started solves (Newton's method from a nearby load's power balance, the supply's Newton step from a
 * nearby slope) against the cold ones they replace on the curve: the power balance bracketed by the log-grid
 * scan from the clamp limit and closed by Brent's method, the supply's first slope by a forward difference.
 * Both settle the inner solves to 1e-10, so the figures agree to 1e-8 relative (1e-9 absolute near zero).
 */
const demoDesign = designExamples.surfaceChargeTester;

function variant(edit: (d: Design) => void): Design {
  const d = structuredClone(demoDesign) as Design;
  edit(d);
  return d;
}

const designs: Record<string, Design> = {
  demo: demoDesign,
  'eight unequal cells': variant((d) => {
    d.multiplier.cellCount = 8;
    d.multiplier.capacitors = Array.from({ length: 8 }, (_, i) => ({
      ...demoDesign.multiplier.capacitors[0]!,
      valueF: 4.7e-9 * (1 + 0.3 * ((i * 0.618) % 1)),
    }));
  }),
  'forward phasing': variant((d) => {
    if (d.drive.kind === 'driver') d.drive.driver.transformer.secondaryPhasing = 'forward';
  }),
  'bench supply': variant((d) => {
    if (d.drive.kind === 'driver') d.drive.driver.supply = { kind: 'dc', voltageV: 5, sourceResistanceOhm: 0.5 };
  }),
};

function expectClose(got: number, want: number): void {
  expect(Math.abs(got - want)).toBeLessThanOrEqual(1e-8 * Math.abs(want) + 1e-9);
}

describe.each(Object.entries(designs))('warm-started driver solves: %s', (_, design) => {
  const stage = (design.drive as { driver: DriverStage }).driver;
  const { drive, currentLimitA } = resolveDrive(design);
  const ladder = engineLadderLoadLine(ladderInputOf(design, drive, currentLimitA));

  it('give every curve point and the rated load as the cold solve at the same load does', () => {
    const op = driverOperatingPoint(stage, ladder, 20e-6, { points: 13 });
    expect(op.curve.some((p) => p.limitedBy === 'power')).toBe(true);
    for (const point of [...op.curve, op.ratedLoad]) {
      const cold = solveLoadPoint(stage, ladder, point.loadCurrentA);
      expect(point.limitedBy).toBe(cold.limitedBy);
      for (const key of ['outputV', 'flybackSecondaryPeakV', 'supplyCurrentA', 'inputPowerW', 'frequencyHz'] as const) {
        expectClose(point[key], cold[key]);
      }
    }
  });

  it('solve the loaded supply from a nearby slope to the forward difference’s answer', () => {
    const limit = blockingOscillatorNumbers(stage);
    for (const fraction of [1, 0.6, 0.2]) {
      const options = { flybackSecondaryPeakV: fraction * limit.maxFlybackSecV };
      const cold = blockingOscillatorNumbers(stage, options);
      const warm = blockingOscillatorNumbers(stage, {
        ...options,
        supplyVoltageGuessV: limit.vin,
        supplySlopeGuess: limit.supplySlope ?? 1,
      });
      expectClose(warm.vin, cold.vin);
      expectClose(warm.inputA, cold.inputA);
      expectClose(warm.deliverableW, cold.deliverableW);
    }
  });

  it('draw the supply current the cold solve gives along a table of supply voltages, each from the last', () => {
    let warm: WarmStart | null = null;
    for (const voltageV of [1.6, 2, 2.4, 2.8, 3.2, 4, 5]) {
      const bench: DriverStage = { ...stage, supply: { kind: 'dc', voltageV, sourceResistanceOhm: 0 } };
      const near = supplyCurrentNear(bench, ladder, 20e-6, warm);
      warm = near.balance ?? warm;
      expectClose(near.supplyCurrentA, supplyCurrentAt(bench, ladder, 20e-6));
    }
  });

  it.skipIf(stage.supply.kind !== 'cells')(
    'give the battery life the cold solves give at the table’s supply voltages',
    () => {
      const supply = stage.supply;
      if (supply.kind !== 'cells') throw new Error('a cells supply');
      const got = runDriverChecks(stage, { ladder, ratedLoadCurrentA: 20e-6 }).batteryLife!.lifeS.value;
      // The same table (8 voltages from 0.8 of the end voltage to 1.05 of the full cell, linear between them),
      // each supply current from a cold solve.
      const highV = 1.05 * supply.cellsInSeries * Math.max(...cellCurveOf(supply).map((p) => p.voltageV));
      const lowV = 0.8 * supply.cellsInSeries * supply.endVoltagePerCellV;
      const table = Array.from({ length: 8 }, (_, k) => {
        const v = lowV + ((highV - lowV) * k) / 7;
        const bench: DriverStage = { ...stage, supply: { kind: 'dc', voltageV: v, sourceResistanceOhm: 0 } };
        return { v, i: supplyCurrentAt(bench, ladder, 20e-6) };
      });
      const currentAt = (v: number) => {
        const k = table.findIndex((p) => p.v >= v);
        if (k <= 0) return k === 0 ? table[0]!.i : table[7]!.i;
        const [a, b] = [table[k - 1]!, table[k]!];
        return a.i + ((b.i - a.i) * (v - a.v)) / (b.v - a.v);
      };
      expectClose(got, batteryLife(supply, currentAt).lifeS.value);
    },
  );

  it('give a ladder load line’s output from its last current as a fresh line does', () => {
    const fresh = () => engineLadderLoadLine(ladderInputOf(design, drive, currentLimitA));
    const used = fresh();
    const pulse = { forwardPeakV: 170, flybackPeakV: 1400, frequencyHz: 3e4, dutyCycle: 0.85, isFlybackFed: true };
    for (const [flybackPeakV, loadA] of [
      [1400, 0],
      [1300, 5e-6],
      [900, 40e-6],
      [1450, 1e-6],
    ] as const) {
      const got = used.at({ ...pulse, flybackPeakV }, loadA);
      const want = fresh().at({ ...pulse, flybackPeakV }, loadA);
      expectClose(got.outputV, want.outputV);
      expectClose(got.ladderCurrentA, want.ladderCurrentA);
    }
  });

  it('put the onset of the power limit where the doubling bracket from 1 nA and Brent’s method put it', () => {
    // The stage at its limit with the ladder's load on the secondary, the forward peak at the recovery level.
    const limit = blockingOscillatorNumbers(stage, ladder.secondaryLoad ? { secondaryLoad: ladder.secondaryLoad } : {});
    const limitDrive = {
      forwardPeakV: forwardPeakFor(limit, 0),
      flybackPeakV: limit.flybackSecV,
      frequencyHz: limit.frequencyHz,
      dutyCycle: forwardShareOf(limit),
      isFlybackFed: (stage.transformer.secondaryPhasing ?? 'flyback') === 'flyback',
    };
    const surplusAt = (loadA: number) => {
      const state = ladder.at(limitDrive, loadA);
      const ratio = ladder.chargeRatios(limitDrive, state.ladderCurrentA).flyback;
      return limit.deliverableW / limit.maxFlybackSecV - ratio * state.ladderCurrentA;
    };
    let want = 0;
    if (surplusAt(0) >= 0) {
      let lo = 0;
      let hi = 1e-9;
      while (surplusAt(hi) >= 0) [lo, hi] = [hi, 2 * hi];
      want = bracketedRoot(surplusAt, lo, hi, surplusAt(lo), surplusAt(hi), hi * 2 ** -40);
    }
    expectClose(driverOperatingPoint(stage, ladder, 0, { points: 3 }).powerLimitOnsetA, want);
  });
});
