import { describe, expect, it } from 'vitest';
import { analyzeDesign, driverSizerFigures, startingTransformer, withTransformerSection } from '../../src/analysis';
import { designExamples } from '../../src/designs/design-examples';
import {
  demoCoreKinds,
  demoTapeKinds,
  demoWireKinds,
  derivedTransformerNumbers,
  sizeTransformer,
} from '../../src/transformer';

const tester = designExamples.surfaceChargeTester;
const kinds = { cores: demoCoreKinds, wires: demoWireKinds, tapes: demoTapeKinds };

describe('the first designed transformer of a design', () => {
  const started = startingTransformer(tester, kinds);
  const figures = driverSizerFigures(tester, analyzeDesign(tester))!;

  it('takes the core the transformer Sizer ranks first for the driver, not the first core offered', () => {
    if (!started) throw new Error('a demo core fits the tester');
    const ranked = sizeTransformer(
      demoCoreKinds,
      {
        ...figures,
        primaryWire: started.section.windings[0]!.wire,
        feedbackWire: started.section.windings[1]!.wire,
        secondaryWire: started.section.windings[2]!.wire,
        windingTape: started.section.windingTape,
        windingTapeWraps: 3,
        layerTape: started.section.layerTape!,
      },
      tester.targets.spacing,
    );
    const fitting = ranked.filter((c) => c.refusal === null);
    expect(fitting.map((c) => c.core.code)).toContain(started.candidate.core.code);
    expect(started.candidate.core.code).toBe(fitting[0]!.core.code);
    expect(started.candidate.core.code).not.toBe(demoCoreKinds[0]!.code);
    expect(started.fittingCores).toBe(fitting.length);
    expect(started.offeredCores).toBe(demoCoreKinds.length);
  });

  it('keeps the given primary inductance and turns ratios, with the gap that gives that inductance', () => {
    if (!started || tester.drive.kind !== 'driver') throw new Error('a demo core fits the tester');
    const given = tester.drive.driver.transformer;
    expect(started.section.gap).toEqual({ kind: 'primary-inductance', primaryInductanceH: given.primaryInductanceH });
    // AL with the gap and its fringing (McLyman, ch. 8, from memory) times N² gives the inductance back: the
    // gap is solved for it, to 1e-6 of the target.
    expect(derivedTransformerNumbers(started.section).primaryInductanceH / given.primaryInductanceH).toBeCloseTo(1, 6);
    const [primary, feedback, secondary] = started.section.windings.map((w) => w.turns) as [number, number, number];
    // Whole turns: each ratio within half a turn of the given one.
    expect(Math.abs(secondary - (primary * given.secondaryTurns) / given.primaryTurns)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(feedback - (primary * given.feedbackTurns) / given.primaryTurns)).toBeLessThanOrEqual(0.5);
    expect(started.candidate.gap.gapM).toBeGreaterThan(0);
  });

  it('winds the primary in the thinnest wire that carries its rms current at 4 A/mm², the secondary in the thinnest', () => {
    if (!started) throw new Error('a demo core fits the tester');
    // Triangular ramp 0 → Ipk over the on-time share D: rms = Ipk·√(D/3) (common practice, no source).
    const rmsA = figures.primaryPeakCurrentA * Math.sqrt(figures.dutyOnFraction / 3);
    const densityOf = (d: number) => rmsA / ((Math.PI / 4) * d * d);
    const primaryD = started.section.windings[0]!.wire.copperDiameterM;
    expect(densityOf(primaryD)).toBeLessThanOrEqual(4e6);
    for (const thinner of demoWireKinds.filter((w) => w.copperDiameterM < primaryD)) {
      expect(densityOf(thinner.copperDiameterM)).toBeGreaterThan(4e6);
    }
    const thinnest = Math.min(...demoWireKinds.map((w) => w.copperDiameterM));
    expect(started.section.windings[2]!.wire.copperDiameterM).toBe(thinnest);
  });

  it('passes every transformer Check on the design, and says which core, why and at what flux', () => {
    if (!started) throw new Error('a demo core fits the tester');
    const report = analyzeDesign(withTransformerSection(tester, started.section));
    const transformerChecks = report.checks.filter((c) => c.id.startsWith('transformer.'));
    expect(transformerChecks.length).toBeGreaterThan(0);
    expect(transformerChecks.filter((c) => c.verdict === 'fail')).toEqual([]);
    expect(started.reason).toContain(started.candidate.core.code);
    expect(started.reason).toContain('1 mH');
    expect(started.reason).toMatch(/1 : 0\.4 : 60/);
    expect(started.reason).toContain(`${started.candidate.primaryTurns} : `);
    // Every fitting core's windings measure more than the given 60 Ω secondary, so the driver's power Check fails
    // on each: the reason says so rather than hiding it.
    expect(started.worsened.map((w) => w.id)).toContain('driver-power');
    expect(started.reason).toContain('driver power');
  });

  it('is null when no core offered fits, and for a design without a driver', () => {
    const small = demoCoreKinds.filter((c) => c.code === 'Core E13 ferrite grade A');
    expect(startingTransformer(tester, { ...kinds, cores: small })).toBeNull();
    expect(startingTransformer(designExamples.ionizerBar, kinds)).toBeNull();
  });
});
