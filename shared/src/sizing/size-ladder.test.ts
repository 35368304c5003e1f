import { describe, expect, it } from 'vitest';
import { analyzeLadder } from '../multiplier/analyze-ladder';
import { seriesMantissas } from '../units/e-series';
import { sizeLadder } from './size-ladder';

const drive = { kind: 'sine' as const, peakV: 480, frequencyHz: 25e3, sourceResistanceOhm: 150 };

describe('sizeLadder', () => {
  const result = sizeLadder({
    targetOutputV: -6000,
    loadCurrentA: 30e-6,
    rippleMaxV: 30,
    drive,
    safeVoltageV: 50,
    series: 'E12',
    topologies: ['half-wave'],
  });

  it('returns ranked candidates that meet the target and the ripple limit when re-analysed', () => {
    expect(result.candidates.length).toBeGreaterThan(3);
    for (const c of result.candidates) {
      const r = analyzeLadder({
        topology: c.topology,
        capacitorsF: c.capacitorsF,
        drive,
        diode: c.diode,
        polarity: -1,
        load: { kind: 'current', currentA: 30e-6 },
        bleederOhm: null,
        seriesOutputResistanceOhm: 0,
      });
      expect(r.outputMeanV).toBeLessThanOrEqual(-6000);
      expect(r.outputMeanV).toBeGreaterThanOrEqual(-6000 * 1.3);
      expect(r.ripplePeakToPeakV).toBeLessThanOrEqual(30);
    }
    const ranks = result.candidates.map((c) => c.rank);
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
  });

  it('uses only E12 values (IEC 60063) for capacitors, graded ones included', () => {
    const mantissas = new Set(seriesMantissas('E12'));
    for (const c of result.candidates) {
      for (const f of c.capacitorsF) {
        const m = Math.round(f / 10 ** (Math.floor(Math.log10(f)) - 1));
        expect(mantissas.has(m)).toBe(true);
      }
    }
  });

  it('prefers the cheaper candidate when the parts list has costs', () => {
    const parts = {
      capacitors: [
        { valueF: 2.2e-9, ratedVoltageV: 2000, costEach: 0.3, partCode: 'NF-C222-2K' },
        { valueF: 4.7e-9, ratedVoltageV: 2000, costEach: 0.9, partCode: 'NF-C472-2K' },
      ],
      diodes: [
        {
          saturationCurrentA: 2e-9,
          emissionCoefficient: 8,
          seriesResistanceOhm: 40,
          ratedPivV: 2000,
          ratedAverageCurrentA: 0.05,
          ratedSurgeCurrentA: 10,
          costEach: 0.2,
        },
      ],
      resistors: [{ valueOhm: 100e6, ratedPowerW: 0.5, limitingVoltageV: 2500, costEach: 0.1 }],
    };
    const priced = sizeLadder({
      targetOutputV: -6000,
      loadCurrentA: 30e-6,
      rippleMaxV: 60,
      drive,
      safeVoltageV: 50,
      parts,
      gradings: ['equal'],
      topologies: ['half-wave'],
    });
    const costs = priced.candidates.map((c) => c.cost ?? Infinity);
    expect(costs[0]).toBeLessThanOrEqual(Math.min(...costs));
    expect(priced.candidates[0]?.bleeder?.count).toBeGreaterThanOrEqual(3); // ~6.5 kV over 2.5 kV × 0.8 elements
  });

  it('stops at maxCandidates and reports how many it evaluated', () => {
    const capped = sizeLadder({ targetOutputV: 3000, loadCurrentA: 1e-4, rippleMaxV: 10, drive, maxCandidates: 500 });
    expect(capped.evaluatedCount).toBe(500);
  });
});
