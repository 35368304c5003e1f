import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import type { Design } from '../designs/design.types';
import type { DriverStage } from '../designs/driver-stage.types';
import { engineLadderLoadLine, type LadderLoadLine } from '../driver/ladder-load-line';
import { runDriverChecks } from '../driver/driver-checks';
import { driverOperatingPoint, type LoadPoint } from '../driver/operating-point';
import { analyzeDesign, ladderInputOf, resolveDrive } from './analyze-design';

/*
 * The Workbench's repeated recompute takes what the engine remembers from earlier calls (the driver's
 * output-vs-load curve per stage and ladder, the supply-current table's stage limits). Each remembered answer
 * is checked here against the same figures solved afresh, with nothing remembered, on every demo design and
 * on edits of each kind: the load, every capacitor, one capacitor, the driver. The fresh solve settles every
 * inner solve to 1e-10, so the figures agree to 1e-8 relative (1e-9 absolute near zero), the tolerance of the
 * warm-started solves (operating-point-warm.test.ts).
 */
function expectClose(got: number, want: number): void {
  expect(Math.abs(got - want)).toBeLessThanOrEqual(1e-8 * Math.abs(want) + 1e-9);
}

const POINT_KEYS = [
  'loadCurrentA',
  'outputV',
  'flybackSecondaryPeakV',
  'forwardSecondaryPeakV',
  'supplyCurrentA',
  'inputPowerW',
  'frequencyHz',
  'efficiency',
] as const;

function expectSamePoint(got: LoadPoint, want: LoadPoint): void {
  expect(got.limitedBy).toBe(want.limitedBy);
  for (const key of POINT_KEYS) expectClose(got[key], want[key]);
}

/** The engine's load line of a design without its key, so that nothing is remembered for it. */
function freshLadder(design: Design): LadderLoadLine {
  const { drive, currentLimitA } = resolveDrive(design);
  const keyed = engineLadderLoadLine(ladderInputOf(design, drive, currentLimitA));
  return {
    at: (d, loadA) => keyed.at(d, loadA),
    chargeRatios: (d, ladderA) => keyed.chargeRatios(d, ladderA),
    ...(keyed.network ? { network: keyed.network } : {}),
    ...(keyed.secondaryLoad ? { secondaryLoad: keyed.secondaryLoad } : {}),
  };
}

function edited(design: Design, edit: 'load' | 'all capacitors' | 'one capacitor' | 'driver'): Design {
  const d = structuredClone(design) as Design;
  if (edit === 'load' && d.load?.kind === 'current') d.load.currentA *= 1.37;
  if (edit === 'all capacitors') for (const c of d.multiplier.capacitors) c.valueF *= 1.1;
  if (edit === 'one capacitor') d.multiplier.capacitors[0]!.valueF *= 0.8;
  if (edit === 'driver' && d.drive.kind === 'driver') d.drive.driver.baseResistorOhm *= 1.2;
  return d;
}

describe.each(Object.entries(designExamples))('remembered answers of %s', (_, demo) => {
  it.each(['load', 'all capacitors', 'one capacitor', 'driver'] as const)(
    'after an edit of the %s, give the figures a fresh solve gives',
    (edit) => {
      analyzeDesign(demo);
      const design = edited(demo, edit);
      const report = analyzeDesign(design);
      const again = analyzeDesign(design);
      expect(again.outputMeanV).toBe(report.outputMeanV);
      if (design.drive.kind !== 'driver') {
        expect(report.driver).toBeNull();
        return;
      }
      const stage: DriverStage = design.drive.driver;
      const ratedA = design.load?.kind === 'current' ? design.load.currentA : 0;
      const fresh = driverOperatingPoint(stage, freshLadder(design), ratedA);
      const op = report.driver!.operatingPoint;
      expectClose(op.powerLimitOnsetA, fresh.powerLimitOnsetA);
      expectClose(report.driver!.loadCapacity!.maxLoadCurrentA, fresh.maxLoadCurrentA);
      expect(op.curve).toHaveLength(fresh.curve.length);
      op.curve.forEach((point, i) => expectSamePoint(point, fresh.curve[i]!));
      expectSamePoint(op.ratedLoad, fresh.ratedLoad);
      // Battery life from the supply-current table, whose stage limits and first balance are remembered.
      const freshChecks = runDriverChecks(stage, { ladder: freshLadder(design), ratedLoadCurrentA: ratedA });
      expect(report.driver!.batteryLife === null).toBe(freshChecks.batteryLife === null);
      if (freshChecks.batteryLife) {
        expectClose(report.driver!.batteryLife!.lifeS.value, freshChecks.batteryLife.lifeS.value);
        expectClose(report.driver!.batteryLife!.meanCurrentA, freshChecks.batteryLife.meanCurrentA);
      }
    },
  );

  it('hands out copies: a caller writing into a report changes no later report', () => {
    const first = analyzeDesign(demo);
    const curve = first.driver?.operatingPoint.curve;
    if (curve) for (const point of curve) point.outputV = -1;
    const second = analyzeDesign(demo);
    for (const point of second.driver?.operatingPoint.curve ?? []) expect(point.outputV).toBeGreaterThanOrEqual(0);
  });
});
