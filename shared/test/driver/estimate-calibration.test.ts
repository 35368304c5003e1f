import { beforeAll, describe, expect, it } from 'vitest';
import { analyzeDesign } from '../../src/analysis/analyze-design';
import { designExamples } from '../../src/designs/design-examples';
import type { Design } from '../../src/designs/design.types';
import { compareWithSimulation, ESTIMATE_VALIDITY_BOUNDS } from '../../src/driver/estimate-validity';
import { runDriverDesign } from '../../src/runs/driver-runs';
import type { DriverRunResult } from '../../src/runs/driver-run.types';

// The validity contract of the instant estimate against our simulator (a warm-started run to its settling
// criterion): on each design the estimate either lands within ESTIMATE_VALIDITY_BOUNDS of the simulation
// (frequency 10 %, output 5 %) or says it is outside its validity. The demo handheld tester with 220 pF
// cells (so that the run settles in a few seconds) stands for the ladder-fed designs.
const demo = designExamples.surfaceChargeTester;
const grid: { name: string; design: Design }[] = [
  {
    name: 'handheld tester, 220 pF cells',
    design: {
      ...demo,
      multiplier: {
        ...demo.multiplier,
        capacitors: demo.multiplier.capacitors.map((c) => ({ ...c, valueF: 220e-12 })),
      },
    },
  },
];

const runs = new Map<string, DriverRunResult>();
beforeAll(() => {
  for (const { name, design } of grid) runs.set(name, runDriverDesign(design));
}, 180_000);

describe('the instant estimate against the simulation: within its validity, or it says so', () => {
  it.each(grid)('$name', ({ name, design }) => {
    const report = analyzeDesign(design);
    const sim = runs.get(name)!;
    expect(sim.figures).not.toBeNull();
    const rows = compareWithSimulation(
      { ...report.driver!.benchFigures, outputMeanV: report.outputMeanV },
      { ...sim.figures!, outputMeanV: sim.outputMeanV },
    );
    const diff = (field: string) => Math.abs(rows.find((r) => r.field === field)!.difference!);
    const within =
      diff('oscillationFrequencyHz') <= ESTIMATE_VALIDITY_BOUNDS.frequency &&
      diff('outputMeanV') <= ESTIMATE_VALIDITY_BOUNDS.output;
    if (!within) {
      expect(report.driver!.validity.isWithinValidity).toBe(false);
      expect(report.driver!.validity.reasons.length).toBeGreaterThan(0);
    }
    // The comparison is the plain relative difference (e − s)/|s| of the same-named figures.
    const f = rows.find((r) => r.field === 'oscillationFrequencyHz')!;
    expect(f.difference).toBeCloseTo((f.estimate - f.simulation) / Math.abs(f.simulation), 12);
    // Whatever the validity, the primary current peak is the turn-off point both share: within 10 %.
    expect(diff('primaryCurrentPeakA')).toBeLessThan(0.1);
  });
});
