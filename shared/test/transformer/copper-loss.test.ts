import { describe, expect, it } from 'vitest';
import { dcResistanceOhm, dowellFactor, harmonics, rmsOf, skinDepthM, windingCopperLoss } from '../../src/transformer';

describe('Dowell’s AC resistance factor (P. L. Dowell, Proc. IEE 113(8), 1966)', () => {
  it('follows the low-frequency series Fr ≈ 1 + (5m² − 1)/45·Δ⁴', () => {
    // Series of Dowell's expression for small Δ, as published by W. G. Hurley, E. Gath, J. G. Breslin,
    // IEEE Trans. Power Electron. 15(2), 2000, eq. for Δ < 1 (from memory). Δ = 0.3: the next term is O(Δ⁸).
    for (const m of [1, 2, 5, 10]) {
      const delta = 0.3;
      const series = 1 + ((5 * m ** 2 - 1) / 45) * delta ** 4;
      expect(Math.abs(dowellFactor(delta, m) / series - 1)).toBeLessThan(2e-3);
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
    const { mean, amplitudes } = harmonics(ramp, 5);
    expect(mean).toBeCloseTo(0.5, 2);
    amplitudes.forEach((a, i) => expect(a).toBeCloseTo(1 / (Math.PI * (i + 1)), 2));
    expect(rmsOf(ramp)).toBeCloseTo(1 / Math.sqrt(3), 12);
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
