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
  it('skin depth of copper at 100 kHz and 20 °C is 0.209 mm (standard tables, e.g. Snelling, Soft Ferrites; from memory)', () => {
    expect(skinDepthM(100e3) * 1000).toBeCloseTo(0.209, 3);
  });

  it('0.20 mm copper wire has 0.5488 Ω per metre at 20 °C (IEC 60317 / wire tables, from memory)', () => {
    // One turn of 1 m: the resistance per metre.
    expect(dcResistanceOhm(1, 1, 0.2e-3)).toBeCloseTo(0.5488, 4);
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
