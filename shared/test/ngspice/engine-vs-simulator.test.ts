import { describe, expect, it } from 'vitest';
import { analyzeLadder } from '../../src/multiplier/analyze-ladder';
import { runLadder } from '../../src/runs/ladder-runs';

// The engine's steady-state analysis (shared/src/multiplier) against this simulator's periodic steady
// state, on ladders the textbook closed forms do not cover: unequal capacitors and odd cell counts.
// Agreement measured when this test was written: mean within 0.3–0.45 %, ripple within 3.5–4 % (the
// engine reads slightly lower means and higher ripple). Tolerances: 0.6 % and 5 %.
const diode = { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 };
const drive = { kind: 'sine' as const, peakV: 500, frequencyHz: 20e3, sourceResistanceOhm: 10 };
const load = { kind: 'current' as const, currentA: 1e-3 };

describe('engine steady state agrees with the simulator', () => {
  it.each([
    { name: 'graded capacitors, 3 stages', capacitorsF: [30e-9, 30e-9, 20e-9, 20e-9, 10e-9, 10e-9] },
    { name: 'odd cell count 3', capacitorsF: [10e-9, 10e-9, 10e-9] },
    { name: 'odd cell count 5', capacitorsF: [10e-9, 10e-9, 10e-9, 10e-9, 10e-9] },
  ])('$name', ({ capacitorsF }) => {
    const engine = analyzeLadder({
      topology: 'half-wave',
      capacitorsF,
      drive,
      diode,
      polarity: 1,
      load,
      bleederOhm: null,
      seriesOutputResistanceOhm: 0,
    });
    const sim = runLadder(
      { topology: 'half-wave', cellCount: capacitorsF.length, capacitorsF, diode, drive, load },
      { until: 'steady', maxStepPerPeriod: 200 },
    );
    expect(sim.method).toBe('periodic-steady-state');
    expect(Math.abs(engine.outputMeanV / sim.outputMeanV - 1)).toBeLessThan(0.006);
    expect(Math.abs(engine.ripplePeakToPeakV / sim.ripplePeakToPeakV - 1)).toBeLessThan(0.05);
  });
});
