import { describe, expect, it } from 'vitest';
import {
  alFromGap,
  demoCoreKinds,
  demoTransformerSection,
  derivedTransformerNumbers,
  fluxDensityT,
  fringingFactor,
  gapFromAl,
  resolveGap,
  saturatedInductanceH,
  saturationFluxDensityAtT,
  type CoreKind,
} from '../../src/transformer';

const core = demoCoreKinds.find((c) => c.code === 'Core E25 ferrite grade A') as CoreKind;

describe('gap and inductance factor (McLyman, Transformer and Inductor Design Handbook, 3rd ed., ch. 8)', () => {
  it('an ungapped core keeps its own AL and a fringing factor of 1', () => {
    expect(fringingFactor(0, core.effectiveAreaM2, core.bobbinBreadthM)).toBe(1);
    // AL(0) = µ0·Ae/(le/µr) with le/µr taken from the ungapped AL: the definition, to rounding.
    expect(alFromGap(core, 0)).toBeCloseTo(core.ungappedAlHPerTurn2, 15);
  });

  it('matches McLyman’s inductance formula written in his CGS-practical units', () => {
    // McLyman ch. 8: L = 0.4·π·N²·Ac·F·1e-8 / (lg + MPL/µm), Ac in cm², lg and MPL in cm, L in H;
    // F = 1 + (lg/√Ac)·ln(2G/lg) with G the window length in cm. Evaluated here independently in cm.
    const turns = 100;
    const gapCm = 0.05;
    const acCm2 = core.effectiveAreaM2 * 1e4;
    const mplCm = core.pathLengthM * 100;
    const gCm = core.bobbinBreadthM * 100;
    const muM = (core.ungappedAlHPerTurn2 * core.pathLengthM) / (4e-7 * Math.PI * core.effectiveAreaM2);
    const f = 1 + (gapCm / Math.sqrt(acCm2)) * Math.log((2 * gCm) / gapCm);
    const mcLymanH = (0.4 * Math.PI * turns ** 2 * acCm2 * f * 1e-8) / (gapCm + mplCm / muM);
    // Tolerance 1e-9 relative: the same formula in other units, only rounding differs.
    expect(alFromGap(core, gapCm / 100) * turns ** 2).toBeCloseTo(mcLymanH, 12);
    expect(fringingFactor(gapCm / 100, core.effectiveAreaM2, core.bobbinBreadthM)).toBeCloseTo(f, 12);
  });

  it('tends to L = µ0·N²·A/lgap, the gap-dominated limit, when the core’s own reluctance vanishes', () => {
    // Read: Encyclopedia Magnetica, "Inductance of gapped inductor" (https://e-magnetica.pl/calculator/
    // inductance_of_gapped_inductor): L = µ0·N²·A/lgap for a core of µ ≫ 1 with lcore/µ ≪ lgap. A core of AL0
    // 1 H/turn² (le/µr = 0.04 nm, under 1e-6 of these gaps) leaves the gap alone; McLyman's fringing factor is
    // divided out.
    const stiff: CoreKind = { ...core, ungappedAlHPerTurn2: 1 };
    for (const gapM of [0.05e-3, 0.3e-3, 1e-3]) {
      const plain = alFromGap(stiff, gapM) / fringingFactor(gapM, stiff.effectiveAreaM2, stiff.bobbinBreadthM);
      expect(plain / ((4e-7 * Math.PI * stiff.effectiveAreaM2) / gapM)).toBeCloseTo(1, 5);
    }
  });

  it('gives the published effective permeability of a core with a small gap, and finds that gap back', () => {
    // Read: TN Lab, "IEC 60205 magnetic core effective parameters: the mathematical foundation of inductor
    // design" (https://tnlab.org/iec-60205-magnetic-core-effective-parameters-the-mathematical-foundation-of-
    // inductor-design/), a web page: µe = µi/(1 + µi·g/Le); µi = 3000, Le = 100 mm, g = 0.002 mm →
    // µe = 2830 (−5.7 %). The example has no fringing and names no area: the E25 core's Ae is taken, its AL0
    // set for µi = 3000 over Le = 100 mm, and McLyman's fringing factor is divided out.
    const mu0 = 4e-7 * Math.PI;
    const pathLengthM = 0.1;
    const published: CoreKind = {
      ...core,
      pathLengthM,
      ungappedAlHPerTurn2: (mu0 * 3000 * core.effectiveAreaM2) / pathLengthM,
    };
    const gapM = 0.002e-3;
    const f = fringingFactor(gapM, published.effectiveAreaM2, published.bobbinBreadthM);
    const effectivePermeability = (alFromGap(published, gapM) / f) * (pathLengthM / (mu0 * core.effectiveAreaM2));
    expect(Math.round(effectivePermeability)).toBe(2830);
    expect((effectivePermeability / 3000 - 1) * 100).toBeCloseTo(-5.7, 1);
    // The gap for the AL of the printed µe = 2830 (with the same fringing) is the example's 0.002 mm: within
    // 0.5 %, as the printed four figures of µe move the gap by 0.12 % (dg/g = (dµe/µe)·(1 + µi·g/Le)/(µi·g/Le)).
    const targetAl = (f * mu0 * 2830 * core.effectiveAreaM2) / pathLengthM;
    expect(gapFromAl(published, targetAl) / gapM).toBeCloseTo(1, 2);
  });

  it('takes an inductance factor as the catalogue states it: the turns of a published worked example', () => {
    // Read: Magnetics (mag-inc.com), design guide "Inductor Design with Magnetics Ferrite Cores", steps 4–8:
    // N = 10³·√(L/AL), L in mH, AL in mH per 1000 turns (= nH/turn²). Example: Imax = 8 A, L = 100 µH,
    // LI² = (0.100 mH)·(8 A)² = 6.4 mJ; cores with AL = 400, 300 and 250 need N = 16, 19 and 20 turns. A section
    // whose gap is stated by that AL, wound with those turns, has at least the 100 µH, and one turn fewer less.
    const lH = 100e-6;
    for (const [alNhPerTurn2, turns] of [
      [400, 16],
      [300, 19],
      [250, 20],
    ] as const) {
      const inductanceOf = (n: number) =>
        derivedTransformerNumbers({
          ...demoTransformerSection,
          gap: { kind: 'al', alHPerTurn2: alNhPerTurn2 * 1e-9 },
          windings: demoTransformerSection.windings.map((w) => (w.role === 'primary' ? { ...w, turns: n } : w)),
        }).primaryInductanceH;
      // The catalogue's N = 10³·√(L/AL) in its own units, rounded up to a whole turn.
      expect(Math.ceil(1e3 * Math.sqrt((lH * 1e3) / alNhPerTurn2) - 1e-9)).toBe(turns);
      // The gap is solved for the stated AL to 1e-9 of it, so the inductance is AL·N² to that.
      expect(inductanceOf(turns) / (alNhPerTurn2 * 1e-9 * turns ** 2)).toBeCloseTo(1, 8);
      expect(inductanceOf(turns)).toBeGreaterThanOrEqual(lH * (1 - 1e-9));
      expect(inductanceOf(turns - 1)).toBeLessThan(lH);
    }
  });

  it('finds the gap back from the AL it gives (round trip within 1 nm)', () => {
    for (const gapM of [5e-6, 50e-6, 0.2e-3, 1e-3]) {
      expect(Math.abs(gapFromAl(core, alFromGap(core, gapM)) - gapM)).toBeLessThan(1e-9);
    }
  });

  it('AL falls as the gap grows, and fringing makes it larger than the plain magnetic circuit', () => {
    let previous = Infinity;
    for (const gapM of [1e-6, 1e-5, 1e-4, 5e-4, 1e-3, 2e-3]) {
      const al = alFromGap(core, gapM);
      expect(al).toBeLessThan(previous);
      previous = al;
      const plain =
        (4e-7 * Math.PI * core.effectiveAreaM2) /
        (gapM + (4e-7 * Math.PI * core.effectiveAreaM2) / core.ungappedAlHPerTurn2);
      expect(al).toBeGreaterThan(plain);
    }
  });

  it('resolves a target primary inductance into AL = L/N²', () => {
    const gap = resolveGap(core, { kind: 'primary-inductance', primaryInductanceH: 1e-3 }, 40);
    expect(gap.alHPerTurn2 * 40 ** 2).toBeCloseTo(1e-3, 9);
    expect(gap.gapM).toBeGreaterThan(0);
  });

  it('refuses an AL that needs a gap longer than the bobbin', () => {
    expect(() => gapFromAl(core, 1e-12)).toThrow(/longer than the bobbin/);
  });

  it('the saturated inductance is far below the gapped inductance', () => {
    const gap = resolveGap(core, { kind: 'gap', gapM: 0.1e-3 }, 30);
    expect(saturatedInductanceH(core, gap, 30)).toBeLessThan((gap.alHPerTurn2 * 30 ** 2) / 10);
  });
});

describe('flux density', () => {
  it('B = L·I/(N·Ae) agrees with B = µ0·N·F·I/(lg + le/µr) (McLyman ch. 8)', () => {
    const turns = 50;
    const gapM = 0.3e-3;
    const currentA = 0.8;
    const inductanceH = alFromGap(core, gapM) * turns ** 2;
    const f = fringingFactor(gapM, core.effectiveAreaM2, core.bobbinBreadthM);
    const reluctanceLength = (4e-7 * Math.PI * core.effectiveAreaM2) / core.ungappedAlHPerTurn2;
    const mcLymanT = (4e-7 * Math.PI * turns * f * currentA) / (gapM + reluctanceLength);
    expect(fluxDensityT(inductanceH, currentA, turns, core.effectiveAreaM2)).toBeCloseTo(mcLymanT, 12);
  });

  it('interpolates Bsat between its 25 °C and 100 °C figures', () => {
    expect(saturationFluxDensityAtT(core, 25)).toBeCloseTo(core.saturationFluxDensity25T, 12);
    expect(saturationFluxDensityAtT(core, 100)).toBeCloseTo(core.saturationFluxDensity100T, 12);
    expect(saturationFluxDensityAtT(core, 62.5)).toBeCloseTo(
      (core.saturationFluxDensity25T + core.saturationFluxDensity100T) / 2,
      12,
    );
  });
});
