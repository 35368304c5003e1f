import { describe, expect, it } from 'vitest';
import { analyzeDesign } from '../analysis/analyze-design';
import { DRIVER_SIZER_DEFAULTS, designOf, sizeDriverSupply, type DriverSizerRequest } from './size-driver-supply';

// A small grid so the test stays fast: two cell counts, two ladder sizes, two capacitor values, one bleeder.
const request: DriverSizerRequest = {
  targetOutputV: 1500,
  loadCurrentA: 5e-6,
  rippleMaxV: 5,
  stage: DRIVER_SIZER_DEFAULTS.stage,
  cellCounts: [1, 2],
  ladderCells: [3, 4],
  capacitorsF: [1e-9, 4.7e-9],
  bleedersOhm: [470e6],
};
const result = sizeDriverSupply(request);

describe('driver Sizer', () => {
  it('offers whole supplies whose output the full analysis puts within ±3 % of the target at the rated load', () => {
    expect(result.evaluatedCount).toBe(8);
    expect(result.candidates.length).toBeGreaterThan(0);
    for (const c of result.candidates) {
      const stage = {
        ...request.stage,
        supply: { ...request.stage.supply, ...(c.cellsInSeries !== null ? { cellsInSeries: c.cellsInSeries } : {}) },
        transformer: { ...request.stage.transformer, secondaryTurns: c.secondaryTurns },
      } as typeof request.stage;
      const report = analyzeDesign(designOf(stage, request, c.ladderCells, c.capacitorF, c.bleederOhm));
      // ±3 %: the Sizer's stated tolerance, checked by the product's own full analysis of the candidate design.
      expect(Math.abs(report.outputMeanV / 1500 - 1)).toBeLessThanOrEqual(0.03);
      expect(report.ripplePeakToPeakV).toBeLessThanOrEqual(5);
      expect(c.batteryLifeS).toBeGreaterThan(0);
    }
  });

  it('ranks by the worst driver check, then by battery life', () => {
    const order = { pass: 0, marginal: 1, fail: 2 };
    for (let i = 1; i < result.candidates.length; i++) {
      const a = result.candidates[i - 1]!;
      const b = result.candidates[i]!;
      const byVerdict = order[a.worstCheck.verdict] - order[b.worstCheck.verdict];
      expect(byVerdict).toBeLessThanOrEqual(0);
      if (byVerdict === 0) expect(a.batteryLifeS!).toBeGreaterThanOrEqual(b.batteryLifeS!);
    }
    expect(result.candidates.map((c) => c.rank)).toEqual(result.candidates.map((_, i) => i + 1));
  });

  it('lands the ladder-limited output by the turns ratio: fewer ladder cells need more turns (V ≈ n·(V₊ + V₋))', () => {
    const three = result.candidates.find((c) => c.ladderCells === 3 && c.cellsInSeries === 2);
    const four = result.candidates.find((c) => c.ladderCells === 4 && c.cellsInSeries === 2);
    expect(three).toBeDefined();
    expect(four).toBeDefined();
    expect(three!.turnsRatio).toBeGreaterThan(four!.turnsRatio);
  });
});
