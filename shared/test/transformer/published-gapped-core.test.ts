import { describe, expect, it } from 'vitest';
import {
  MU0,
  alFromGap,
  areaProductM4,
  demoCoreKinds,
  fringingFactor,
  gapFromAl,
  type CoreKind,
} from '../../src/transformer';

// A gapped ferrite core built and measured in a published paper, read in full (open access, CC BY):
// H. Liao, J.-F. Chen, "Design process of high-frequency inductor with multiple air-gaps in the dimensional
// limitation", The Journal of Engineering (IET) 2022, 16–33, doi 10.1049/tje2.12087. Its "Type I" inductor is
// a PQ-shaped ferrite pair with one centre-leg gap:
//   Table 2: Afe = 1.73 cm², MPL lc = 7.0 cm, µr = 3300, Wa = 1.71 cm², Ap = 2.9583 cm⁴;
//   Table 3: gap lgt = 2.18 mm, 55 turns, measured L = 445.21 µH (LCR meter);
//   Table 8: fringing factor by McLyman's Eq. (20) Ff = 1.41; with the round-leg tuning of Eq. (21) Ff' = 1.37.
const areaM2 = 1.73e-4;
const pathM = 0.07;
const permeability = 3300;
const gapM = 2.18e-3;
const turns = 55;
const measuredH = 445.21e-6;

// The paper does not print G, the winding length of Eq. (20). The G at which Eq. (20) gives its Ff = 1.41 is
// G = (lg/2)·exp(0.41·√A/lg) = 12.93 mm (12.55–13.33 mm for the rounding of 1.41): taken here as the breadth
// the engine puts in McLyman's formula. The paper's own figure thus fixes the factor; the inductance and the
// gap below are checked against its measurement, which the formula did not see.
const windowLengthM = (gapM / 2) * Math.exp((0.41 * Math.sqrt(areaM2)) / gapM);
const core: CoreKind = {
  ...demoCoreKinds[0]!,
  effectiveAreaM2: areaM2,
  pathLengthM: pathM,
  ungappedAlHPerTurn2: (MU0 * permeability * areaM2) / pathM,
  bobbinBreadthM: windowLengthM,
  windowAreaM2: 1.71e-4,
};

describe('a published gapped core with its measured inductance (Liao & Chen, J. Eng. 2022, Tables 2, 3 and 8)', () => {
  it('gives the paper’s McLyman fringing factor, and its plain inductance as its Eq. (5)', () => {
    expect(fringingFactor(gapM, areaM2, windowLengthM)).toBeCloseTo(1.41, 2);
    // Eq. (5): L = µ0·Afe·N² / (lg·(µr − 1)/µr + lfe/µr) (the core path shortened by the gap); the engine keeps
    // the whole lfe/µr, which differs by lg/µr = 0.66 µm in 2.2 mm: 3e-4 of the inductance.
    const plainH = (alFromGap(core, gapM) / fringingFactor(gapM, areaM2, windowLengthM)) * turns ** 2;
    const eq5H = (MU0 * areaM2 * turns ** 2) / ((gapM * (permeability - 1)) / permeability + pathM / permeability);
    expect(Math.abs(plainH / eq5H - 1)).toBeLessThan(5e-4);
  });

  it('puts the inductance with fringing within 6 % of the measured 445.21 µH; without it, a third low', () => {
    const inductanceH = alFromGap(core, gapM) * turns ** 2;
    // 421.2 µH: 5.4 % below the measurement (5.0–5.7 % over the range of G above).
    expect(Math.abs(inductanceH / measuredH - 1)).toBeLessThan(0.06);
    const plainH = inductanceH / fringingFactor(gapM, areaM2, windowLengthM);
    // 298.8 µH: the gap alone, 33 % below the measurement.
    expect(plainH / measuredH).toBeLessThan(0.7);
    // The paper's tuned Ff' = 1.37 (Eq. (21), q ≈ 0.90 for round legs) lands further off here: 409.3 µH, 8 % low.
    expect(Math.abs(inductanceH / measuredH - 1)).toBeLessThan(Math.abs((plainH * 1.37) / measuredH - 1));
  });

  it('finds the gap for the measured inductance within 7 % of the 2.18 mm built; the plain gap is a third short', () => {
    const gapForMeasured = gapFromAl(core, measuredH / turns ** 2);
    // 2.037 mm: 6.5 % short of the gap the core was ground to.
    expect(Math.abs(gapForMeasured / gapM - 1)).toBeLessThan(0.07);
    // Without fringing (Liao & Chen Eq. (15) less its µr/(µr − 1) of 1.0003; Power Integrations AN-23, step 18): 1.456 mm.
    const plainGapM = (MU0 * areaM2 * turns ** 2) / measuredH - pathM / permeability;
    expect(plainGapM / gapM).toBeLessThan(0.7);
  });

  it('takes the area product as Wa·Ae: 1.71 cm² × 1.73 cm² = 2.9583 cm⁴ (Table 2)', () => {
    expect(areaProductM4(core.windowAreaM2, core.effectiveAreaM2) * 1e8).toBeCloseTo(2.9583, 4);
  });
});

describe('the gap without fringing in a semiconductor maker’s units (Power Integrations AN-23, 7/99, step 18)', () => {
  it('Lg = 40π·Ae·(Np²/(1000·Lp) − 1/AL) mm is the engine’s gap with the fringing factor taken out', () => {
    // Read: Power Integrations application note AN-23 (7/99), p. 9, step 18 (secondary copy, m.beike2008.cn):
    // Ae in cm², Lp in µH, AL (ungapped) in nH/turn², Lg in mm. The engine's AL = F·µ0·Ae/(lg + le/µr) with F = 1
    // is the same magnetic circuit; the gap is solved here for the AL the fringing-free circuit asks. Inputs invented.
    for (const [aeCm2, alNh, np, lpUh] of [
      [0.525, 1900, 40, 800],
      [1.73, 10249, 55, 445.21],
      [0.3, 1200, 90, 2500],
    ] as const) {
      const published = 40 * Math.PI * aeCm2 * (np ** 2 / (1000 * lpUh) - 1 / alNh);
      const aeM2 = aeCm2 * 1e-4;
      const reluctanceLengthM = (MU0 * aeM2) / (alNh * 1e-9);
      const engineGapM = (MU0 * aeM2 * np ** 2) / (lpUh * 1e-6) - reluctanceLengthM;
      // The engine's own AL at that gap, fringing divided out, gives back Lp.
      const plainCore: CoreKind = {
        ...demoCoreKinds[0]!,
        effectiveAreaM2: aeM2,
        ungappedAlHPerTurn2: alNh * 1e-9,
        bobbinBreadthM: 0.02,
      };
      const al = alFromGap(plainCore, engineGapM) / fringingFactor(engineGapM, aeM2, 0.02);
      expect((al * np ** 2) / (lpUh * 1e-6)).toBeCloseTo(1, 9);
      expect(engineGapM * 1e3).toBeCloseTo(published, 9);
    }
  });
});
