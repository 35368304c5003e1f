import { describe, expect, it } from 'vitest';
import { igseCoefficient, igseLossDensity, steinmetzLossDensity } from '../../src/transformer';

const material = { k: 1.26, alpha: 1.5, beta: 2.6 };

function sine(frequencyHz: number, peakT: number, points: number) {
  return Array.from({ length: points + 1 }, (_, i) => ({
    timeS: i / (points * frequencyHz),
    value: peakT * Math.sin((2 * Math.PI * i) / points),
  }));
}

describe('core loss by the iGSE (Venkatachalam, Sullivan, Abdallah, Tacca, IEEE COMPEL 2002)', () => {
  it('reduces to the Steinmetz equation for a sine (the iGSE is built so; checked to 0.1 %)', () => {
    for (const [f, b] of [
      [20e3, 0.1],
      [100e3, 0.05],
      [5e3, 0.25],
    ] as const) {
      const igse = igseLossDensity(sine(f, b, 4000), material);
      // 0.1 %: a sine sampled at 4000 straight pieces.
      expect(Math.abs(igse / steinmetzLossDensity(f, b, material) - 1)).toBeLessThan(1e-3);
    }
  });

  it('ki agrees with the paper’s closed-form approximation (stated there within 0.15 % for 0.5 < α < 3, from memory)', () => {
    // ki ≈ k / (2^(β+1)·π^(α−1)·(0.2761 + 1.7061/(α + 1.354))), Venkatachalam et al. 2002 (from memory).
    for (const [alpha, beta] of [
      [1.2, 2.2],
      [1.5, 2.6],
      [2.0, 2.8],
    ] as const) {
      const approx = 1 / (2 ** (beta + 1) * Math.PI ** (alpha - 1) * (0.2761 + 1.7061 / (alpha + 1.354)));
      expect(Math.abs(igseCoefficient(1, alpha, beta) / approx - 1)).toBeLessThan(0.0015);
    }
  });

  it('gives ki·(2f)^α·ΔB^β for a symmetric triangle (two pieces of slope ΔB/(T/2); derived from the paper’s sum)', () => {
    const f = 50e3;
    const swing = 0.2;
    const triangle = [
      { timeS: 0, value: -swing / 2 },
      { timeS: 0.5 / f, value: swing / 2 },
      { timeS: 1 / f, value: -swing / 2 },
    ];
    const ki = igseCoefficient(material.k, material.alpha, material.beta);
    expect(igseLossDensity(triangle, material)).toBeCloseTo(ki * (2 * f) ** material.alpha * swing ** material.beta, 6);
  });

  it('a triangle of unequal slopes loses more than the symmetric one (the iGSE’s point about duty)', () => {
    const f = 50e3;
    const at = (duty: number) =>
      igseLossDensity(
        [
          { timeS: 0, value: 0 },
          { timeS: duty / f, value: 0.1 },
          { timeS: 1 / f, value: 0 },
        ],
        material,
      );
    expect(at(0.1)).toBeGreaterThan(at(0.3));
    expect(at(0.3)).toBeGreaterThan(at(0.5));
  });

  it('a flat stretch of the flux adds no loss, but stretches the period', () => {
    const f = 50e3;
    const pulse = [
      { timeS: 0, value: 0 },
      { timeS: 0.25 / f, value: 0.1 },
      { timeS: 0.5 / f, value: 0 },
      { timeS: 1 / f, value: 0 },
    ];
    const halfPeriod = [
      { timeS: 0, value: 0 },
      { timeS: 0.25 / f, value: 0.1 },
      { timeS: 0.5 / f, value: 0 },
    ];
    expect(igseLossDensity(pulse, material)).toBeCloseTo(igseLossDensity(halfPeriod, material) / 2, 9);
  });
});
