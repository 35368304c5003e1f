import { describe, expect, it } from 'vitest';
import {
  analyzeTransformer,
  demoCoreKinds,
  demoTapeKinds,
  demoWireKinds,
  derivedTransformerNumbers,
  pulseOperatingPoint,
  type TransformerSection,
} from '../../src/transformer';

/** A small linear congruential generator (Numerical Recipes constants), so the cases repeat. */
function seeded(seed: number) {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

describe('transformer figures hold their invariants over random sections (seeded)', () => {
  const random = seeded(20261204);
  const pick = <T>(items: readonly T[]) => items[Math.floor(random() * items.length)]!;
  const cases = Array.from({ length: 120 }, () => {
    const primaryTurns = 5 + Math.floor(random() * 60);
    const section: TransformerSection = {
      core: pick(demoCoreKinds),
      gap:
        random() < 0.5
          ? { kind: 'gap', gapM: random() * 0.5e-3 }
          : { kind: 'primary-inductance', primaryInductanceH: 1e-4 + random() * 2e-3 },
      windings: [
        { role: 'primary', turns: primaryTurns, wire: pick(demoWireKinds), startPin: 1, endPin: 2 },
        { role: 'feedback', turns: 1 + Math.floor(random() * 20), wire: pick(demoWireKinds), startPin: 3, endPin: 4 },
        {
          role: 'secondary',
          turns: 50 + Math.floor(random() * 3000),
          wire: pick(demoWireKinds),
          layerTapeWraps: Math.floor(random() * 3),
          startPin: 5,
          endPin: 6,
        },
      ],
      layerTape: pick(demoTapeKinds),
      windingTape: pick(demoTapeKinds),
      windingTapeWraps: 1 + Math.floor(random() * 4),
      endMarginM: random() * 2e-3,
    };
    const peakA = 0.01 + random() * 0.5;
    return { section, peakA, frequencyHz: 5e3 + random() * 100e3, duty: 0.1 + random() * 0.6 };
  });

  it('finite figures, couplings within (0, 1], fringing ≥ 1, Dowell factors ≥ 1, verdicts agree with margins', () => {
    let analyzed = 0;
    for (const { section, peakA, frequencyHz, duty } of cases) {
      let derived;
      try {
        derived = derivedTransformerNumbers(section);
      } catch (error) {
        // Only a target AL that needs a gap past the bobbin is refused, and by name.
        expect(String(error)).toMatch(/longer than the bobbin/);
        continue;
      }
      const point = pulseOperatingPoint({
        frequencyHz,
        onTimeS: duty / frequencyHz,
        flybackTimeS: (1 - duty) / (2 * frequencyHz),
        primaryPeakCurrentA: peakA,
        baseCurrentA: peakA / 50,
        primaryOnVoltageV: 3,
        forwardSecondaryPeakV: 3 * (section.windings[2]!.turns / section.windings[0]!.turns),
        flybackSecondaryPeakV: 500,
        primaryTurns: section.windings[0]!.turns,
        feedbackTurns: section.windings[1]!.turns,
        secondaryTurns: section.windings[2]!.turns,
        ambientTemperatureC: 25,
      });
      const report = analyzeTransformer(section, point, { pollutionDegree: 2, materialGroup: 'II', pcb: false });
      analyzed += 1;
      for (const value of [
        report.primaryInductanceH,
        report.peakFluxDensityT,
        report.coreLossW,
        report.copperLossW,
        report.temperatureRiseC,
        report.secondaryCapacitanceF,
        report.leakagePrimarySecondaryH,
        derived.saturatedInductanceH,
      ]) {
        expect(Number.isFinite(value)).toBe(true);
        expect(value).toBeGreaterThanOrEqual(0);
      }
      expect(report.gap.fringingFactor).toBeGreaterThanOrEqual(1);
      for (const k of Object.values(report.couplings)) {
        expect(k).toBeGreaterThan(0);
        expect(k).toBeLessThanOrEqual(1);
      }
      expect(derived.saturatedInductanceH).toBeLessThan(derived.primaryInductanceH);
      for (const w of report.windings) {
        expect(w.acResistanceFactor).toBeGreaterThanOrEqual(1 - 1e-9);
        expect(w.copperLossW).toBeGreaterThanOrEqual(w.dcResistanceOhm * w.rmsCurrentA ** 2 * 0.9);
        expect(w.turnsPerLayer * w.layers).toBeGreaterThanOrEqual(w.turns);
      }
      for (const check of report.checks) {
        if (check.verdict === 'fail') expect(check.marginPct).toBeLessThan(0);
        else expect(check.marginPct).toBeGreaterThanOrEqual(-1e-9);
      }
    }
    expect(analyzed).toBeGreaterThan(60);
  });
});
