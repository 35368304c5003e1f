import { complex, coth, multiply, sqrt, tanh, type Complex } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  MU0,
  copperResistivity,
  dcResistanceOhm,
  dowellFactor,
  harmonics,
  rmsOf,
  roundWireDelta,
  skinDepthM,
  windingCopperLoss,
} from '../../src/transformer';

/**
 * Dowell's factor in his complex form, K = Re{αh·coth(αh)} + (m² − 1)/3·Re{2αh·tanh(αh/2)} (P. L. Dowell,
 * Proc. IEE 113(8), 1966; read as reproduced on Encyclopedia Magnetica, "Calculator of proximity effect from
 * Dowell curves", https://e-magnetica.pl/doku.php/calculator/proximity_effect_from_dowell_curves), evaluated
 * with mathjs's complex hyperbolic functions: an implementation apart from the engine's real sinh/sin form.
 */
function dowellComplex(alphaH: Complex, layers: number): number {
  const skin = multiply(alphaH, coth(alphaH)) as Complex;
  const proximity = multiply(multiply(alphaH, 2), tanh(multiply(alphaH, 0.5) as Complex)) as Complex;
  return skin.re + ((layers ** 2 - 1) / 3) * proximity.re;
}

/** αh for a foil of thickness Δ skin depths: α = (1 + j)/δ. */
const foil = (delta: number) => complex(delta, delta);

describe('Dowell’s AC resistance factor (P. L. Dowell, Proc. IEE 113(8), 1966)', () => {
  it('equals Dowell’s complex form evaluated with a general-purpose library, over the curves’ range', () => {
    // Dowell's curves run from Δ = 0.1 to 10 and 0.5 to 10 layers; the engine's series branch below Δ = 1e-3 too.
    for (const m of [1, 2, 3, 5, 10, 20]) {
      for (const delta of [5e-4, 0.1, 0.3, 1, 1.7, 3, 10]) {
        // 1e-9 relative: two forms of one expression, rounding apart.
        expect(Math.abs(dowellFactor(delta, m) / dowellComplex(foil(delta), m) - 1)).toBeLessThan(1e-9);
      }
    }
  });

  it('follows the low-frequency series Fr ≈ 1 + (5m² − 1)/45·Δ⁴, whose coefficient the complex form confirms', () => {
    // The series as published by W. G. Hurley, E. Gath, J. G. Breslin, IEEE Trans. Power Electron. 15(2), 2000,
    // for Δ < 1 (from memory). Its coefficient from the read complex form at Δ = 0.02 (next term O(Δ⁸)).
    for (const m of [1, 2, 5, 10]) {
      const small = 0.02;
      expect(((dowellComplex(foil(small), m) - 1) / small ** 4) * (45 / (5 * m ** 2 - 1))).toBeCloseTo(1, 3);
      const delta = 0.3;
      const series = 1 + ((5 * m ** 2 - 1) / 45) * delta ** 4;
      expect(Math.abs(dowellFactor(delta, m) / series - 1)).toBeLessThan(2e-3);
    }
  });

  it('takes round wire as the equal-area square foil with the porosity η, α = √(j·ω·µ0·σ·η) as published', () => {
    // The same reproduced page: α = √(j·ω·µ0·σ·η), η = N·a/b (turns × wire width over the layer width), h the
    // wire's thickness. Round wire of diameter d at pitch p as the square of equal copper area, a = h = √(π/4)·d
    // and η = a/p (J. A. Ferreira, Electromagnetic Modelling of Power Electronic Converters, 1989, from memory).
    for (const [d, p, f, m, t] of [
      [0.2e-3, 0.23e-3, 100e3, 4, 20],
      [0.05e-3, 0.064e-3, 30e3 * 7, 20, 60],
      [0.4e-3, 0.445e-3, 1e6, 2, 100],
    ] as const) {
      const sigma = 1 / copperResistivity(t);
      const a = Math.sqrt(Math.PI / 4) * d;
      const alpha = sqrt(complex(0, 2 * Math.PI * f * MU0 * sigma * (a / p))) as Complex;
      const published = dowellComplex(multiply(alpha, a) as Complex, m);
      const engine = dowellFactor(roundWireDelta(d, p, skinDepthM(f, t)), m);
      expect(Math.abs(engine / published - 1)).toBeLessThan(1e-9);
    }
  });

  it('tends to Δ·(2m² + 1)/3 for thick layers (Dowell 1966, high-frequency limit)', () => {
    for (const m of [1, 3, 6]) {
      const delta = 12;
      // Within 5e-5: the corrections fall as e^(−Δ) (about 3e-6 at Δ = 12).
      expect(dowellFactor(delta, m) / ((delta * (2 * m ** 2 + 1)) / 3)).toBeCloseTo(1, 4);
    }
  });

  it('is 1 at DC and grows with Δ and with the number of layers', () => {
    expect(dowellFactor(0, 4)).toBe(1);
    expect(dowellFactor(1, 4)).toBeGreaterThan(dowellFactor(1, 2));
    expect(dowellFactor(1.5, 2)).toBeGreaterThan(dowellFactor(1, 2));
  });
});

describe('copper figures', () => {
  // Copper: the International Annealed Copper Standard, 58 MS/m (1/58 Ω·mm²/m) at 20 °C with a resistance
  // temperature coefficient of 3.93e-3 per °C (read: K. C. Agrawal, Industrial Power Engineering and
  // Applications Handbook, Newnes 2001, p. 970, table of standard copper (IACS); IEC 60028 (1925), read in a
  // secondary summary). Skin depth δ = √(2ρ/(ω·µ)) (read: W. C. Johnson, Transmission Lines and Networks,
  // McGraw-Hill 1963, p. 58, as quoted on a public page).
  it('skin depth of copper: δ = √(2ρ/(ω·µ0)) with the IACS resistivity, and the published table values', () => {
    const rho = 1 / 58e6;
    for (const f of [1e3, 20e3, 100e3, 1e6]) {
      expect(skinDepthM(f) / Math.sqrt((2 * rho) / (2 * Math.PI * f * 4e-7 * Math.PI))).toBeCloseTo(1, 3);
    }
    // A published skin-depth table for copper at ρ = 1.7e-8 Ω·m, 300 K, two figures: 0.46 mm at 20 kHz and
    // 0.15 mm at 200 kHz (read: launchloop.com "Skin Depth" table, resistivity after Matula, J. Phys. Chem. Ref.
    // Data 8, 1979). The rule of thumb 66/√f mm gives 0.209 mm at 100 kHz (common practice, no source).
    expect(skinDepthM(20e3) * 1000).toBeCloseTo(0.46, 1);
    expect(Math.abs((skinDepthM(20e3) * 1000) / 0.46 - 1)).toBeLessThan(0.02);
    expect(Math.abs((skinDepthM(200e3) * 1000) / 0.15 - 1)).toBeLessThan(0.02);
    expect(Math.abs((skinDepthM(100e3) * 1000) / (66 / Math.sqrt(100e3)) - 1)).toBeLessThan(0.01);
  });

  it('0.20 mm copper wire has (1/58 Ω·mm²/m)/(π·0.1² mm²) = 0.5488 Ω per metre at 20 °C (IACS, as above)', () => {
    // One turn of 1 m: the resistance per metre.
    expect(dcResistanceOhm(1, 1, 0.2e-3)).toBeCloseTo(1 / 58 / (Math.PI * 0.1 ** 2), 4);
    expect(dcResistanceOhm(1, 1, 0.2e-3)).toBeCloseTo(0.5488, 4);
  });

  it('copper resistance rises by 3.93e-3 per °C: about 28 % more at 90 °C than at 20 °C (IACS, as above)', () => {
    // The 28 % at a 90 °C conductor is read in the same secondary summary of IEC 60028.
    const ratio = dcResistanceOhm(1, 1, 0.2e-3, 90) / dcResistanceOhm(1, 1, 0.2e-3, 20);
    expect(ratio).toBeCloseTo(1 + 3.93e-3 * 70, 9);
    expect(Math.round((ratio - 1) * 100)).toBe(28);
  });

  it('a sawtooth has harmonics Ipk/(π·h) and rms Ipk/√3 (Fourier series of a ramp, standard)', () => {
    const ramp = [
      { timeS: 0, value: 0 },
      { timeS: 1e-5, value: 1 },
      { timeS: 1e-5, value: 0 },
    ];
    // The Fourier integral of each linear piece is taken in closed form, so the series holds to rounding.
    const { mean, amplitudes } = harmonics(ramp, 40);
    expect(mean).toBeCloseTo(0.5, 12);
    amplitudes.forEach((a, i) => expect(a).toBeCloseTo(1 / (Math.PI * (i + 1)), 12));
    expect(rmsOf(ramp)).toBeCloseTo(1 / Math.sqrt(3), 12);
  });

  it('a symmetric triangle has odd harmonics 8·Ipk/(π²·h²) and no even ones (Fourier series, standard)', () => {
    // Peak-to-peak 2 about zero: amplitude 8/(π²h²) for odd h, 0 for even h; the pieces start mid-period.
    const triangle = [
      { timeS: 0, value: 0 },
      { timeS: 0.25, value: 1 },
      { timeS: 0.75, value: -1 },
      { timeS: 1, value: 0 },
    ];
    const { mean, amplitudes } = harmonics(triangle, 9);
    expect(mean).toBeCloseTo(0, 12);
    amplitudes.forEach((a, i) => {
      const h = i + 1;
      expect(a).toBeCloseTo(h % 2 === 1 ? 8 / (Math.PI ** 2 * h ** 2) : 0, 12);
    });
  });

  it('a steady current loses Rdc·I², and an AC ripple loses more than its rms on Rdc', () => {
    const winding = { frequencyHz: 1e5, dcResistanceOhm: 0.5, copperDiameterM: 0.4e-3, pitchM: 0.45e-3, layers: 3 };
    const flat = [
      { timeS: 0, value: 2 },
      { timeS: 1e-5, value: 2 },
    ];
    const dc = windingCopperLoss({
      currentA: flat,
      ...winding,
    });
    expect(dc.lossW).toBeCloseTo(0.5 * 4, 9);
    const triangle = [
      { timeS: 0, value: 0 },
      { timeS: 5e-6, value: 2 },
      { timeS: 1e-5, value: 0 },
    ];
    const ac = windingCopperLoss({
      currentA: triangle,
      ...winding,
    });
    expect(ac.rmsCurrentA).toBeCloseTo(2 / Math.sqrt(3), 9);
    expect(ac.acResistanceFactor).toBeGreaterThan(1);
    expect(ac.lossW).toBeCloseTo(0.5 * ac.acResistanceFactor * ac.rmsCurrentA ** 2, 9);
  });
});
