import { describe, expect, it } from 'vitest';
import { type Design, designExamples } from '../designs';
import { analyzeDesign, type DesignReport } from '../analysis';
import { buildLadderNetwork } from '../multiplier';
import { formatQuantity } from '../units';
import { layoutSchematic } from './schematic-layout';
import type { Box, SchematicLabel } from './schematic.types';

const intersects = (a: Box, b: Box) =>
  a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

/** Every pair of labels whose boxes intersect, named for the failure message. */
function overlaps(labels: readonly SchematicLabel[]): string[] {
  const found: string[] = [];
  for (let i = 0; i < labels.length; i += 1) {
    for (let j = i + 1; j < labels.length; j += 1) {
      const a = labels[i] as SchematicLabel;
      const b = labels[j] as SchematicLabel;
      if (intersects(a.box, b.box)) found.push(`"${a.text}" × "${b.text}"`);
    }
  }
  return found;
}

/** A demo design turned into `topology` with `cellCount` cells, every capacitor the example's first. */
function variant(base: Design, topology: Design['multiplier']['topology'], cellCount: number): Design {
  const count = topology === 'full-wave' ? 3 * cellCount : cellCount;
  const part = base.multiplier.capacitors[0];
  if (!part) throw new Error('the example has no capacitor');
  return {
    ...base,
    multiplier: {
      ...base.multiplier,
      topology,
      cellCount,
      capacitors: Array.from({ length: count }, () => ({ ...part })),
    },
  };
}

/**
 * The longest labels a report can give every part: a five-figure negative voltage on every node, a peak on every
 * capacitor and a failing verdict with a two-digit ratio on every part a check covers.
 */
function longestLabelsReport(design: Design): DesignReport {
  const net = buildLadderNetwork(
    design.multiplier.topology,
    design.multiplier.capacitors.map((c) => c.valueF),
  );
  const fail = (id: string) => ({
    id,
    subject: id,
    rule: '',
    verdict: 'fail' as const,
    marginPct: -2152,
    value: 1,
    limit: 1,
    unit: 'V',
  });
  const partChecks = [
    ...design.multiplier.capacitors.map((_, i) => fail(`cap-voltage-c${i + 1}`)),
    ...net.diodeAnode.map((_, i) => fail(`diode-piv-d${i + 1}`)),
    ...Array.from({ length: design.outputNetwork.bleeder?.count ?? 0 }, (_, i) => fail(`bleeder-power-r${i + 1}`)),
  ];
  const driverChecks = ['driver.collector-voltage', 'driver.winding-insulation', 'driver.battery-life'].map(fail);
  return {
    outputMeanV: -12_345.6,
    checks: partChecks,
    driver: design.drive.kind === 'driver' ? { checks: driverChecks } : null,
    analysis: {
      nodes: net.nodeInfo.map((info) => ({ ...info, meanV: -12_345.6, minV: 0, maxV: 0 })),
      capacitors: design.multiplier.capacitors.map((c, i) => ({
        index: i + 1,
        column: net.capColumn[i],
        stage: net.capStage[i],
        valueF: c.valueF,
        maxVoltageV: -12_345.6,
        swingV: 0,
      })),
    },
  } as unknown as DesignReport;
}

const cases: { topology: Design['multiplier']['topology']; cellCount: number }[] = [
  ...Array.from({ length: 20 }, (_, i) => ({ topology: 'half-wave' as const, cellCount: i + 1 })),
  ...Array.from({ length: 20 }, (_, i) => ({ topology: 'full-wave' as const, cellCount: i + 1 })),
  { topology: 'bridge-doubler', cellCount: 2 },
];

describe('layoutSchematic', () => {
  // A sine-driven design (detector bias, pulse-free) and a blocking-oscillator design (surface-charge tester).
  describe.each([
    { drive: 'sine', base: designExamples.ionizerBar },
    { drive: 'driver', base: designExamples.surfaceChargeTester },
  ])('with a $drive drive', ({ base }) => {
    it.each(cases)(
      'draws a $topology ladder of $cellCount cells with no two labels overlapping',
      ({ topology, cellCount }) => {
        const design = variant(base, topology, cellCount);
        const report = longestLabelsReport(design);
        const layout = layoutSchematic(design, report);
        expect(overlaps(layout.labels)).toEqual([]);
        for (const label of layout.labels) {
          expect(label.box.x).toBeGreaterThanOrEqual(0);
          expect(label.box.y).toBeGreaterThanOrEqual(0);
          expect(label.box.x + label.box.width).toBeLessThanOrEqual(layout.width);
          expect(label.box.y + label.box.height).toBeLessThanOrEqual(layout.height);
        }
        // Every capacitor and diode of the ladder is drawn and named.
        const capacitors = design.multiplier.capacitors.length;
        for (let i = 1; i <= capacitors; i += 1)
          expect(layout.labels.some((l) => l.text.startsWith(`C${i} `))).toBe(true);
        expect(layout.labels.filter((l) => l.role === 'node-voltage').length).toBeGreaterThanOrEqual(capacitors);
        expect(layout.labels.filter((l) => l.role === 'verdict').length).toBeGreaterThan(capacitors);
      },
    );
  });

  it.each(Object.entries(designExamples))(
    'draws the demo design %s from its own report with no two labels overlapping',
    (_, design) => {
      const report = analyzeDesign(design);
      const layout = layoutSchematic(design, report);
      expect(overlaps(layout.labels)).toEqual([]);
      // The load terminal's mean voltage is the report's, and every node the engine reports is labelled.
      expect(layout.labels.map((l) => l.text)).toContain(`out ${formatQuantity(report.outputMeanV, 'V', 3)}`);
      const nodeTexts = layout.labels.filter((l) => l.role === 'node-voltage').map((l) => l.text);
      for (const node of report.analysis.nodes.filter((n) => n.capacitorIndex !== null))
        expect(nodeTexts).toContain(formatQuantity(node.meanV, 'V', 3));
    },
  );
});
