import { describe, expect, it } from 'vitest';
import { analyzeLadder } from '../multiplier/analyze-ladder';
import type { LadderInput } from '../multiplier/ladder.types';
import { mulberry32 } from './seeded-random';
import { toleranceSpread } from './tolerance-spread';

const input: LadderInput = {
  topology: 'half-wave',
  capacitorsF: Array(8).fill(10e-9),
  drive: { kind: 'sine', peakV: 500, frequencyHz: 20e3, sourceResistanceOhm: 100 },
  diode: { saturationCurrentA: 1e-9, emissionCoefficient: 4, seriesResistanceOhm: 10 },
  polarity: 1,
  load: { kind: 'current', currentA: 100e-6 },
  bleederOhm: 500e6,
  seriesOutputResistanceOhm: 0,
};

describe('mulberry32', () => {
  it('gives the same sequence for the same seed, in [0, 1)', () => {
    // Reproducibility is what matters; the sequence for a seed must never change between runs.
    const a = mulberry32(12345);
    const b = mulberry32(12345);
    const first = Array.from({ length: 5 }, () => a());
    expect(Array.from({ length: 5 }, () => b())).toEqual(first);
    for (const x of first) expect(x >= 0 && x < 1).toBe(true);
  });

  it('is close to uniform: mean 0.5 and variance 1/12 over 100 000 draws', () => {
    const r = mulberry32(7);
    let sum = 0;
    let squares = 0;
    const n = 100_000;
    for (let i = 0; i < n; i += 1) {
      const x = r();
      sum += x;
      squares += x * x;
    }
    const mean = sum / n;
    // Standard error of the mean is √(1/12/n) ≈ 0.0009: 5σ tolerance 0.0046. Variance likewise within 0.002.
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.0046);
    expect(Math.abs(squares / n - mean * mean - 1 / 12)).toBeLessThan(0.002);
  });
});

describe('toleranceSpread', () => {
  const request = {
    input,
    capacitorTolerance: 0.1,
    driveVariation: 0.05,
    trials: 400,
    seed: 2024,
    spec: { outputMinV: 3700, rippleMaxV: 5 },
  };

  it('is reproducible for a seed and changes with the seed', () => {
    const a = toleranceSpread(request);
    expect(toleranceSpread(request)).toEqual(a);
    expect(toleranceSpread({ ...request, seed: 2025 }).outputV.mean).not.toBe(a.outputV.mean);
  });

  it('centres on the nominal analysis and spreads by about the drive variation', () => {
    const nominal = analyzeLadder(input).outputMeanV;
    const r = toleranceSpread(request);
    // The output scales ~1:1 with the drive peak (uniform ±5 % → sd 5 %/√3 ≈ 2.9 % of nominal); capacitor
    // tolerance adds a little through the droop. Mean within 1 % of nominal (sampling error ≈ 0.15 %).
    expect(Math.abs(r.outputV.mean / nominal - 1)).toBeLessThan(0.01);
    expect(r.outputV.sd / nominal).toBeGreaterThan(0.02);
    expect(r.outputV.sd / nominal).toBeLessThan(0.04);
    expect(r.outputV.p5).toBeLessThan(r.outputV.p50);
    expect(r.outputV.p50).toBeLessThan(r.outputV.p95);
    expect(r.outputV.histogram.reduce((s, b) => s + b.count, 0)).toBe(400);
    expect(r.fractionWithinSpec).toBeGreaterThan(0);
    expect(r.fractionWithinSpec).toBeLessThanOrEqual(1);
  });

  it('with zero tolerances every trial equals the nominal analysis', () => {
    const r = toleranceSpread({ ...request, capacitorTolerance: 0, driveVariation: 0, trials: 5 });
    expect(r.outputV.sd).toBe(0);
    expect(r.outputV.mean).toBeCloseTo(analyzeLadder(input).outputMeanV, 9);
  });
});
