import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeDesign } from '../../src/analysis/analyze-design';
import { designExamples } from '../../src/designs/design-examples';
import type { Design } from '../../src/designs/design.types';
import type { DriverStage } from '../../src/designs/driver-stage.types';
import { compareWithSimulation, ESTIMATE_VALIDITY_BOUNDS } from '../../src/driver/estimate-validity';
import { runDriverDesign } from '../../src/runs/driver-runs';
import type { DriverRunResult } from '../../src/runs/driver-run.types';
import { threeCells } from '../ngspice/driver-comparison';

// The validity contract of the instant estimate against our simulator (a warm-started run to its settling
// criterion). Our simulator stands as the reference: it agrees with ngspice on the exported netlists of
// blocking-oscillator supplies within 3 % in frequency and 1 % in output
// (test/ngspice/driver-supplies-vs-ngspice.test.ts). On each design the estimate either lands within
// ESTIMATE_VALIDITY_BOUNDS of the simulation (frequency 10 %, output 5 %) or says on its figures that the
// design is outside its validity; and the designs inside the region it claims do land within the bounds.
// The spread: 3–12 V supplies, step-up 1:50–1:80, 3- and 4-cell ladders, forward- and flyback-fed,
// base-limited and saturating, zener clamp with and without an RC snubber. Ladder cells of 220 pF and a 5 µA
// load, so that each run settles within seconds; 2.4 V with 1:100 and steps up to 1:200 take minutes to
// settle in the simulator and stay out of this file (the estimate flags them: step-up beyond 1:80).
const base = designExamples.surfaceChargeTester;

function supply(
  name: string,
  change: (driver: DriverStage, design: Design) => void,
): { name: string; design: Design; isExpectedWithin: boolean } {
  const design = structuredClone(base);
  if (design.drive.kind !== 'driver') throw new Error('the tester has a driver stage');
  design.multiplier.capacitors = design.multiplier.capacitors.map((c) => ({ ...c, valueF: 220e-12 }));
  design.load = { kind: 'current', currentA: 5e-6 };
  design.targets.loadCurrentA = 5e-6;
  change(design.drive.driver, design);
  return { name, design, isExpectedWithin: false };
}

// The first two lie inside the region the estimate claims (zener 30 V over 3 V: reflected ≈ 8.4× the supply).
const grid = [
  { ...supply('3 V cells, 1:60, forward-fed, 4 cells', () => {}), isExpectedWithin: true },
  {
    ...supply('3 V cells, 1:60, flyback-fed, 4 cells', (d) => {
      d.transformer.secondaryPhasing = 'flyback';
    }),
    isExpectedWithin: true,
  },
  supply('12 V DC, 1:50, zener 60 V, tripler', (d, design) => {
    d.supply = { kind: 'dc', voltageV: 12, sourceResistanceOhm: 0.2 };
    d.transformer.secondaryTurns = 1000;
    d.baseResistorOhm = 22e3;
    d.transistor.vceoMaxV = 80;
    d.clamp = { kind: 'zener', clampVoltageV: 60 };
    threeCells(design);
  }),
  supply('3 V cells, saturation-limited core (20 mA)', (d) => {
    d.transformer.saturationCurrentA = 0.02;
  }),
  supply('9 V DC, 1:80, RC snubber and zener, tripler', (d, design) => {
    d.supply = { kind: 'dc', voltageV: 9, sourceResistanceOhm: 0.2 };
    d.transformer.secondaryTurns = 1600;
    d.baseResistorOhm = 15e3;
    d.transistor.vceoMaxV = 60;
    d.clamp = { kind: 'zener', clampVoltageV: 45 };
    d.snubber = { resistorOhm: 100, capacitorF: 1e-9 };
    threeCells(design);
  }),
];

const runs = new Map<string, DriverRunResult>();
beforeAll(() => {
  for (const { name, design } of grid) runs.set(name, runDriverDesign(design));
}, 300_000);

describe('the instant estimate against the simulation: within its validity, or it says so', () => {
  it.each(grid)('$name', ({ name, design, isExpectedWithin }) => {
    const report = analyzeDesign(design);
    const sim = runs.get(name)!;
    expect(sim.figures).not.toBeNull();
    expect(sim.isSettled).toBe(true);
    const rows = compareWithSimulation(
      { ...report.driver!.benchFigures, outputMeanV: report.outputMeanV },
      { ...sim.figures!, outputMeanV: sim.outputMeanV },
    );
    const diff = (field: string) => Math.abs(rows.find((r) => r.field === field)!.difference!);
    const within =
      diff('oscillationFrequencyHz') <= ESTIMATE_VALIDITY_BOUNDS.frequency &&
      diff('outputMeanV') <= ESTIMATE_VALIDITY_BOUNDS.output;
    const validity = report.driver!.validity;
    // Inside the region it claims, the estimate holds its bounds; outside, it says why.
    if (validity.isWithinValidity) expect(within).toBe(true);
    else expect(validity.reasons.length).toBeGreaterThan(0);
    expect(validity.isWithinValidity).toBe(isExpectedWithin);
    // The comparison is the plain relative difference (e − s)/|s| of the same-named figures.
    const f = rows.find((r) => r.field === 'oscillationFrequencyHz')!;
    expect(f.difference).toBeCloseTo((f.estimate - f.simulation) / Math.abs(f.simulation), 12);
    // Whatever the validity, a base-limited stage's primary peak is the turn-off point both share: within 10 %.
    if (report.driver!.figures.onTimeLimit === 'base') expect(diff('primaryCurrentPeakA')).toBeLessThan(0.1);
  });

  it('puts the demo tester’s frequency within 10 % and output within 5 % of the simulation, and claims so', () => {
    // The demo handheld tester at its rated 2 µA, with 220 pF cells so that the run settles in seconds.
    const demo = structuredClone(base);
    demo.multiplier.capacitors = demo.multiplier.capacitors.map((c) => ({ ...c, valueF: 220e-12 }));
    const report = analyzeDesign(demo);
    const sim = runDriverDesign(demo);
    const frequencyHz = report.driver!.benchFigures.oscillationFrequencyHz;
    expect(Math.abs(frequencyHz / sim.oscillationFrequencyHz! - 1)).toBeLessThan(ESTIMATE_VALIDITY_BOUNDS.frequency);
    expect(Math.abs(report.outputMeanV / sim.outputMeanV - 1)).toBeLessThan(ESTIMATE_VALIDITY_BOUNDS.output);
    expect(report.driver!.validity.isWithinValidity).toBe(true);
  }, 120_000);
});
