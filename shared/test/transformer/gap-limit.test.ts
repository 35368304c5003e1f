import { describe, expect, it } from 'vitest';
import { designExamples } from '../../src/designs/design-examples';
import {
  MIN_MANUFACTURABLE_GAP_M,
  alFromGap,
  analyzeTransformer,
  demoCoreKinds,
  gapManufacturable,
  resolveGap,
  sizeTransformer,
  type CoreKind,
  type TransformerSection,
} from '../../src/transformer';
import { e20Point, e20Section, testerSizerRequest } from './tester-fixtures';

// The shortest gap made to a tolerance, 0.051 mm for a ground centre-leg gap or a spacer. Read: Power
// Integrations, application note AN-18 (7/96), p. 12, "Transformer Gapping, Primary Inductance Tolerance":
// "Transformer gaps smaller than 0.051 mm (0.002 in) should be avoided, as it is difficult to maintain tolerance
// on this small a gap." Inductance of a gapped core, McLyman's formula in his units (C. W. T. McLyman, Transformer and
// Inductor Design Handbook, 3rd ed., ch. 8, from memory): L = 0.4·π·N²·Ac·F·1e-8 / (lg + MPL/µm) H, Ac in cm²,
// lg and MPL in cm, F = 1 + (lg/√Ac)·ln(2G/lg), G the window length in cm; evaluated here in cm by hand.
function mcLymanAlCgs(core: CoreKind, gapCm: number): number {
  const acCm2 = core.effectiveAreaM2 * 1e4;
  const mplCm = core.pathLengthM * 100;
  const muM = (core.ungappedAlHPerTurn2 * core.pathLengthM) / (4e-7 * Math.PI * core.effectiveAreaM2);
  const f = 1 + (gapCm / Math.sqrt(acCm2)) * Math.log((2 * core.bobbinBreadthM * 100) / gapCm);
  return (0.4 * Math.PI * acCm2 * f * 1e-8) / (gapCm + mplCm / muM);
}

const spacing = { pollutionDegree: 2, materialGroup: 'IIIa', pcb: false } as const;
const tester = designExamples.surfaceChargeTester;
const request = testerSizerRequest();

describe('the shortest gap that can be made (0.051 mm, Power Integrations AN-18)', () => {
  it('is a limit of the domain: none at all, or 0.051 mm (0.002 in, AN-18) and longer', () => {
    expect(MIN_MANUFACTURABLE_GAP_M).toBe(0.051e-3);
    // 0.002 in = 0.0508 mm, which the note prints as 0.051 mm.
    expect(0.002 * 25.4).toBeCloseTo(0.051, 3);
    expect(gapManufacturable(0)).toBe(true);
    expect(gapManufacturable(0.051e-3)).toBe(true);
    expect(gapManufacturable(0.05e-3)).toBe(false);
    expect(gapManufacturable(0.049e-3)).toBe(false);
    expect(gapManufacturable(0.7e-6)).toBe(false);
  });

  it('the Sizer never proposes a shorter gap: it adds primary turns until the gap for the inductance is made', () => {
    const ranked = sizeTransformer(demoCoreKinds, request, tester.targets.spacing);
    for (const candidate of ranked) {
      if (candidate.section === null) continue;
      expect(candidate.gap.gapM).toBeGreaterThanOrEqual(MIN_MANUFACTURABLE_GAP_M - 1e-9);
      // The fewest such turns: one turn fewer asks more AL than the core gives with a 0.051 mm gap.
      const n = candidate.primaryTurns;
      const alAtLimit = mcLymanAlCgs(candidate.core, 0.0051);
      expect(request.primaryInductanceH / n ** 2).toBeLessThanOrEqual(alAtLimit * (1 + 1e-9));
      const fluxTurns =
        (request.primaryInductanceH * request.primaryPeakCurrentA) /
        (0.8 * candidate.core.saturationFluxDensity100T * candidate.core.effectiveAreaM2);
      if (n - 1 >= fluxTurns) expect(request.primaryInductanceH / (n - 1) ** 2).toBeGreaterThan(alAtLimit);
    }
  });

  it('the E25 core takes 36 primary turns for the tester’s 1 mH: √(1 mH / AL at 0.051 mm) = 35.26, by hand', () => {
    // E25 grade A: Ac 0.525 cm², MPL 5.75 cm, G 1.5 cm, ungapped AL 1.9 µH, so µm = 1.9e-6·0.0575/(µ0·52.5e-6)
    // = 1656; F = 1 + (0.0051/0.72457)·ln(3/0.0051) = 1.04489; AL = 0.4π·0.525·1.04489e-8/(0.0051 + 5.75/1656)
    // = 0.8042 µH; √(1e-3/0.8042e-6) = 35.26 → 36 turns, and with 36 the gap for 0.7716 µH is about 0.055 mm.
    const core = demoCoreKinds.find((c) => c.code === 'Core E25 ferrite grade A')!;
    expect(alFromGap(core, 0.051e-3) / 0.8042e-6).toBeCloseTo(1, 3);
    const e25 = sizeTransformer([core], request, tester.targets.spacing)[0]!;
    expect(e25.refusal).toBeNull();
    expect(e25.primaryTurns).toBe(36);
    expect(e25.gap.gapM * 1000).toBeCloseTo(0.055, 3);
  });

  it('fails a section whose gap is too short to make, and passes one at the limit', () => {
    const point = e20Point(0.1);
    const gapCheck = (section: TransformerSection) =>
      analyzeTransformer(section, point, spacing).checks.find((c) => c.id === 'transformer.gap-length');
    // 1 mH on 20 turns of the E20 grade B core (AL 4.5 µH): AL 2.5 µH, so lg = F·µ0·Ae/AL − le/µr with
    // le/µr = µ0·Ae/4.5 µH = 8.936 µm and µ0·Ae/2.5 µH = 16.085 µm; F = 1.0103 after two rounds by hand:
    // lg ≈ 7.3 µm.
    expect(resolveGap(e20Section.core, e20Section.gap, 20).gapM * 1e6).toBeCloseTo(7.3, 1);
    const short = gapCheck(e20Section);
    expect(short?.verdict).toBe('fail');
    expect(short?.value).toBeCloseTo(0.0073, 4);
    expect(short?.limit).toBe(0.051);
    expect(short?.rule).toContain('AN-18');
    expect(gapCheck({ ...e20Section, gap: { kind: 'gap', gapM: 0.051e-3 } })?.verdict).toBe('pass');
    expect(gapCheck({ ...e20Section, gap: { kind: 'gap', gapM: 0.05e-3 } })?.verdict).toBe('fail');
    expect(gapCheck({ ...e20Section, gap: { kind: 'gap', gapM: 0.045e-3 } })?.verdict).toBe('fail');
    // An ungapped pair has no gap to make.
    expect(gapCheck({ ...e20Section, gap: { kind: 'gap', gapM: 0 } })).toBeUndefined();
  });
});
