import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { lusolve } from 'mathjs';
import { analyzeLadder, analyzePrepared, operatingFigures, prepareLadder } from './analyze-ladder';
import { buildLadderNetwork } from './topologies';
import type { LadderInput } from './ladder.types';

// Ideal diode for the closed-form comparisons: with Is = 1e-300 A and n = 1e-9 the Shockley drop is below
// 1e-7 V at any current used here, far below every tolerance stated.
const idealDiode = { saturationCurrentA: 1e-300, emissionCoefficient: 1e-9, seriesResistanceOhm: 0 };

function sineLadder(
  capacitorsF: number[],
  peakV: number,
  frequencyHz: number,
  currentA: number,
  overrides: Partial<LadderInput> = {},
): LadderInput {
  return {
    topology: 'half-wave',
    capacitorsF,
    drive: { kind: 'sine', peakV, frequencyHz, sourceResistanceOhm: 0 },
    diode: idealDiode,
    polarity: 1,
    load: { kind: 'current', currentA },
    bleederOhm: null,
    seriesOutputResistanceOhm: 0,
    ...overrides,
  };
}

describe('analyzeLadder against published closed forms', () => {
  it('reproduces the n = 8 cascade check values (FOSSEE companion, ch. 6 example, read; REFERENCES.md §1)', () => {
    // n = 8 stages, C = 0.05 µF, Vmax = 125 kV peak, f = 150 Hz, I = 5 mA.
    const r = analyzeLadder(sineLadder(Array(16).fill(0.05e-6), 125e3, 150, 5e-3));
    // Printed to 0.1 kV, 0.1 % and 0.1: tolerance half the last printed digit.
    expect(Math.abs((r.textbook.dropV ?? NaN) - 248.0e3)).toBeLessThan(0.05e3);
    expect(Math.abs((r.textbook.regulation ?? NaN) * 100 - 12.4)).toBeLessThan(0.05);
    expect(Math.abs((r.textbook.optimumStages ?? NaN) - 13.7)).toBeLessThan(0.05);
    // Standard ripple formula gives 24.0 kV (REFERENCES.md §1 note on the printed 4.53 %).
    expect(Math.abs((r.textbook.rippleV ?? NaN) - 24.0e3)).toBeLessThan(0.05e3);
    expect(Math.abs(r.ripplePeakToPeakV - 24.0e3)).toBeLessThan(0.05e3);
  });

  it('reproduces the unequal doubler example (FOSSEE #3369 Ex 16.1, read; REFERENCES.md §2) with the general method', () => {
    // C1 = 0.01 µF, C2 = 0.05 µF, 100 kV rms (peak √2 · 100 kV), 50 Hz, 5 mA → ripple 2.0 kV, drop 11.0 kV, mean 271.8 kV.
    const r = analyzeLadder(sineLadder([0.01e-6, 0.05e-6], 100e3 * Math.SQRT2, 50, 5e-3));
    // Printed to 0.1 kV: tolerance 0.05 kV.
    expect(Math.abs(r.ripplePeakToPeakV - 2.0e3)).toBeLessThan(0.05e3);
    expect(Math.abs(r.droopV - 11.0e3)).toBeLessThan(0.05e3);
    expect(Math.abs(r.outputMeanV - 271.8e3)).toBeLessThan(0.05e3);
    expect(Math.abs((r.textbook.rippleV ?? NaN) - 2.0e3)).toBeLessThan(0.05e3);
    expect(Math.abs((r.textbook.dropV ?? NaN) - 11.0e3)).toBeLessThan(0.05e3);
  });

  it.each([1, 2, 3, 4, 5, 8, 12])(
    'with equal capacitors, n = %i: ripple equals (q/C)n(n+1)/2 and the mean relates to ΔV0 as derived',
    (n) => {
      const c = 1e-6;
      const currentA = 1e-3;
      const f = 50;
      const q = currentA / f;
      const r = analyzeLadder(sineLadder(Array(2 * n).fill(c), 1000, f, currentA));
      const textbookDrop = (q / c) * ((2 * n ** 3) / 3 + n ** 2 / 2 - n / 6); // J. Lux (read); Kuffel et al. §2.2.2 (from memory)
      // Relative 1e-8 throughout: float rounding plus the ideal diode's residual drop (< 1e-7 V against ≥ 20 V).
      // Ripple: the charge-transfer model gives the published formula exactly.
      expect(Math.abs(r.ripplePeakToPeakV / ((q / c) * ((n * (n + 1)) / 2)) - 1)).toBeLessThan(1e-8);
      // Systematic difference: the textbook ΔV0 neglects that the smoothing column also loses q/(2C) per capacitor
      // in the half-cycle between the two conduction events. Our cycle-mean drop is ΔV0 + n·q/(2C) exactly, and the
      // drop of the peak (maximum) output is ΔV0 − n(n−1)/4 · q/C. For n = 1 both reduce to the doubler formulas.
      expect(Math.abs(r.droopV / (textbookDrop + (n * q) / (2 * c)) - 1)).toBeLessThan(1e-8);
      const peakDrop = r.noLoadOutputV - r.outputMaxV;
      expect(Math.abs(peakDrop - (textbookDrop - ((n * (n - 1)) / 4) * (q / c)))).toBeLessThan(1e-8 * textbookDrop);
      // The relative difference of the mean, (n/2)/(2n³/3 + …), is under 1.5 % from n = 8 up.
      if (n >= 8) expect(Math.abs(r.droopV / textbookDrop - 1)).toBeLessThan(0.015);
    },
  );

  it('full-wave ripple equals I·n/(2fC) (REFERENCES.md §2, read, low-authority; Kuffel et al. from memory)', () => {
    const n = 3;
    const c = 10e-9;
    const r = analyzeLadder({ ...sineLadder(Array(3 * n).fill(c), 1100, 20e3, 300e-6), topology: 'full-wave' });
    expect(Math.abs(r.ripplePeakToPeakV / ((300e-6 * n) / (2 * 20e3 * c)) - 1)).toBeLessThan(1e-9); // float noise only
    expect(r.noLoadOutputV).toBeCloseTo(2 * n * 1100, 6); // 2n·Vmax (REFERENCES.md §1 analogue, read)
  });

  it('bridge doubler gives 2·Vmax at no load and diode PIV 2·Vmax (REFERENCES.md §2, read)', () => {
    const r = analyzeLadder({ ...sineLadder([1e-6, 1e-6], 1000, 50, 0), topology: 'bridge-doubler' });
    expect(r.noLoadOutputV).toBeCloseTo(2000, 6); // ideal diodes: within 1e-6 V
    for (const d of r.diodes) expect(d.peakInverseV).toBeCloseTo(2000, 6);
  });

  it('stresses: PIV 2·Vmax per diode, first oscillating capacitor Vmax, others 2·Vmax (REFERENCES.md §1, read / common practice)', () => {
    const r = analyzeLadder(sineLadder(Array(8).fill(1e-6), 1000, 50, 0));
    for (const d of r.diodes) expect(d.peakInverseV).toBeCloseTo(2000, 6);
    expect(r.capacitors[0]?.maxVoltageV).toBeCloseTo(1000, 6);
    for (const c of r.capacitors.slice(1)) expect(c.maxVoltageV).toBeCloseTo(2000, 6);
  });

  it('odd cell counts give k·Vmax: the tripler (REFERENCES.md §1, read)', () => {
    expect(analyzeLadder(sineLadder([1e-6, 1e-6, 1e-6], 300, 1e3, 0)).noLoadOutputV).toBeCloseTo(900, 6);
    expect(analyzeLadder(sineLadder(Array(5).fill(1e-6), 300, 1e3, 0)).noLoadOutputV).toBeCloseTo(1500, 6);
  });

  it('asymmetric pulse drive: each stage adds one peak-to-peak swing, V0 = n(V₊ + V₋) (REFERENCES.md §1, derived)', () => {
    const pulse = {
      kind: 'pulse' as const,
      forwardPeakV: 180,
      flybackPeakV: 1600,
      frequencyHz: 34e3,
      dutyCycle: 0.9,
      sourceResistanceOhm: 0,
    };
    const r = analyzeLadder({ ...sineLadder(Array(4).fill(4.7e-9), 1, 1, 0), drive: pulse });
    expect(r.noLoadOutputV).toBeCloseTo(2 * (180 + 1600), 6);
    // A negative ladder on the same winding mirrors the waveform: same magnitude, opposite sign.
    const negative = analyzeLadder({ ...sineLadder(Array(4).fill(4.7e-9), 1, 1, 0), drive: pulse, polarity: -1 });
    expect(negative.noLoadOutputV).toBeCloseTo(-2 * (180 + 1600), 6);
  });
});

describe('analyzeLadder: flat-top (pulse) drive', () => {
  it('square-wave doubler: C1 and C2 share the load through the forward phase, C2 alone through the flyback', () => {
    // Derived here (no published source): while the source holds its forward level, D2 stays conducting and
    // ties C2 to the pump node, so the output falls at I/(C1 + C2); during the flyback D2 is off and it falls
    // at I/C2. Ripple = I·tH/(C1 + C2) + I·tL/C2. Relative 1e-6: ideal diode, float noise only.
    const c1 = 4.7e-9;
    const c2 = 10e-9;
    const f = 34e3;
    const current = 50e-6;
    const pulse = {
      kind: 'pulse' as const,
      forwardPeakV: 1000,
      flybackPeakV: 1000,
      frequencyHz: f,
      dutyCycle: 0.5,
      sourceResistanceOhm: 0,
    };
    const r = analyzeLadder({ ...sineLadder([c1, c2], 1, 1, current), drive: pulse });
    const half = 0.5 / f;
    expect(Math.abs(r.ripplePeakToPeakV / ((current * half) / (c1 + c2) + (current * half) / c2) - 1)).toBeLessThan(
      1e-6,
    );
    // The instantaneous-transfer figure q/C2 is an upper bound for a flat-top drive.
    expect(r.ripplePeakToPeakV).toBeLessThan(current / f / c2);
  });
});

describe('analyzeLadder: stray capacitance', () => {
  it('costs output even at no load, independent of frequency (Everhart & Lorrain, Rev. Sci. Instrum. 24, 221 (1953), abstract read)', () => {
    const withStray = (f: number) =>
      analyzeLadder({ ...sineLadder(Array(8).fill(2.2e-9), 500, f, 0), strayCapacitanceF: 10e-12 }).noLoadOutputV;
    expect(withStray(25e3)).toBeLessThan(4000 - 50);
    // Relative 1e-12: the no-load loss has no frequency in it at all.
    expect(Math.abs(withStray(1e3) / withStray(100e3) - 1)).toBeLessThan(1e-12);
  });

  it('doubler: the stray on the oscillating node forms a divider with C1, 2Vp·C1/(C1 + Cs) (common practice, no source)', () => {
    const c1 = 1e-9;
    const cs = 20e-12;
    const r = analyzeLadder({ ...sineLadder([c1, c1], 500, 25e3, 0), strayCapacitanceF: cs });
    // The model is first order in Cs/C1 = 0.02: it differs from the exact divider by about (Cs/C1)² = 4e-4 relative.
    expect(Math.abs(r.noLoadOutputV / ((2 * 500 * c1) / (c1 + cs)) - 1)).toBeLessThan(5e-4);
  });
});

describe('analyzeLadder: the one-pass solve against a dense linear solve (mathjs lusolve)', () => {
  it('graded capacitors, 6 cells: capacitor voltages agree with the periodic charge-balance system solved densely', () => {
    // Graded ladder (J. Lux, read): stage k gets (n − k + 1)·C. Both columns graded.
    const caps = [3e-6, 3e-6, 2e-6, 2e-6, 1e-6, 1e-6];
    const vp = 1000;
    const f = 50;
    const current = 2e-3;
    const q = current / f;
    const halfPeriodS = 0.5 / f;
    const k = caps.length;
    const r = analyzeLadder(sineLadder(caps, vp, f, current));
    // Independent formulation with 2k unknowns: a (capacitor voltages after the positive peak) and b (after the
    // negative peak). Odd diodes conduct at the negative peak, even ones at the positive peak, each passing q.
    const rows: number[][] = [];
    const rhs: number[] = [];
    const at = (state: 0 | 1, j: number) => state * k + (j - 1);
    const isOutputColumn = (j: number) => (k - j) % 2 === 0;
    for (let j = 1; j <= k; j += 1) {
      // b_j − a_j: load discharge over the half-cycle plus the charge the odd diodes move through cap j.
      let chargeThroughCap = 0;
      for (let m = j; m <= k; m += 2) {
        if (m % 2 === 1) chargeThroughCap += q;
        if (m + 1 <= k && (m + 1) % 2 === 1) chargeThroughCap -= q;
      }
      const row = Array(2 * k).fill(0);
      row[at(1, j)] = 1;
      row[at(0, j)] = -1;
      rows.push(row);
      const cj = caps[j - 1] as number;
      rhs.push(chargeThroughCap / cj - (isOutputColumn(j) ? (current * halfPeriodS) / cj : 0));
    }
    for (let i = 1; i <= k; i += 1) {
      // Diode i at its conduction boundary (ideal): N_i − N_{i−1} = Σ_j (−1)^{i−j} V_j + (−1)^{i+1}·v = 0,
      // at v = −vp for odd i (state b) and v = +vp for even i (state a): both give Σ_j (−1)^{i−j} V_j = vp.
      const state: 0 | 1 = i % 2 === 1 ? 1 : 0;
      const row = Array(2 * k).fill(0);
      for (let j = 1; j <= i; j += 1) row[at(state, j)] = (i - j) % 2 === 0 ? 1 : -1;
      rows.push(row);
      rhs.push(vp);
    }
    const x = (lusolve(rows, rhs) as number[][]).map((v) => v[0] as number);
    // Tolerance 1e-6 V: dense LU against the one-pass solve, both in float64, on kilovolt values (plus the
    // ideal diode's residual drop < 1e-7 V per diode).
    caps.forEach((cj, idx) => {
      const j = idx + 1;
      const fall = isOutputColumn(j) ? (current * halfPeriodS) / cj : 0;
      const a = x[at(0, j)] as number;
      const b = x[at(1, j)] as number;
      const values = [a, a - fall, b, b - fall];
      expect(Math.abs((r.capacitors[idx]?.maxVoltageV ?? NaN) - Math.max(...values.map(Math.abs)))).toBeLessThan(1e-6);
      expect(Math.abs((r.capacitors[idx]?.swingV ?? NaN) - (Math.max(...values) - Math.min(...values)))).toBeLessThan(
        1e-6,
      );
    });
    const outputAfterPositivePeak = [2, 4, 6].reduce((sum, j) => sum + (x[at(0, j)] as number), 0);
    expect(Math.abs(r.outputMaxV - outputAfterPositivePeak)).toBeLessThan(1e-6);
  });
});

describe('analyzeLadder properties (fast-check)', () => {
  const ladderArb = fc.record({
    cells: fc.integer({ min: 1, max: 16 }),
    capF: fc.double({ min: 1e-10, max: 1e-5, noNaN: true }),
    peakV: fc.double({ min: 10, max: 5e4, noNaN: true }),
    frequencyHz: fc.double({ min: 50, max: 1e5, noNaN: true }),
    currentA: fc.double({ min: 1e-7, max: 1e-3, noNaN: true }),
    sourceOhm: fc.double({ min: 0, max: 1e3, noNaN: true }),
  });
  const diode = { saturationCurrentA: 1e-9, emissionCoefficient: 4, seriesResistanceOhm: 10 };

  it('ripple falls as capacitance grows', () => {
    fc.assert(
      fc.property(ladderArb, fc.double({ min: 1.1, max: 10, noNaN: true }), (p, factor) => {
        const base = sineLadder(Array(p.cells).fill(p.capF), p.peakV, p.frequencyHz, p.currentA, { diode });
        const small = analyzeLadder(base);
        const large = analyzeLadder({ ...base, capacitorsF: base.capacitorsF.map((c) => c * factor) });
        return large.ripplePeakToPeakV < small.ripplePeakToPeakV;
      }),
      { numRuns: 200 },
    );
  });

  it('no-load output equals cells × peak minus the diode drops (zero current: Shockley drop 0)', () => {
    fc.assert(
      fc.property(ladderArb, (p) => {
        const r = analyzeLadder(
          sineLadder(Array(p.cells).fill(p.capF), p.peakV, p.frequencyHz, 0, {
            diode,
            drive: { kind: 'sine', peakV: p.peakV, frequencyHz: p.frequencyHz, sourceResistanceOhm: p.sourceOhm },
          }),
        );
        const drops = r.diodes.reduce((s, d) => s + d.forwardDropV, 0);
        // Relative 1e-12: exact arithmetic up to float rounding over ≤ 16 additions.
        return Math.abs(r.noLoadOutputV - (p.cells * p.peakV - drops)) <= 1e-12 * p.cells * p.peakV;
      }),
      { numRuns: 200 },
    );
  });

  it('loaded output never exceeds no-load, and the drop grows with current', () => {
    fc.assert(
      fc.property(ladderArb, (p) => {
        const input = sineLadder(Array(p.cells).fill(p.capF), p.peakV, p.frequencyHz, p.currentA, {
          diode,
          drive: { kind: 'sine', peakV: p.peakV, frequencyHz: p.frequencyHz, sourceResistanceOhm: p.sourceOhm },
        });
        const r = analyzeLadder(input);
        const heavier = analyzeLadder({ ...input, load: { kind: 'current', currentA: p.currentA * 2 } });
        return (
          r.outputMaxV <= r.noLoadOutputV && r.outputMeanV <= r.noLoadOutputV && heavier.outputMeanV < r.outputMeanV
        );
      }),
      { numRuns: 200 },
    );
  });
});

describe('the shortcuts of repeated solves', () => {
  it('screens with the same output and ripple as the full analysis (Sizer)', () => {
    for (const topology of ['half-wave', 'full-wave'] as const) {
      const prepared = prepareLadder(
        sineLadder(Array<number>(6).fill(2.2e-9), 480, 25e3, 30e-6, {
          topology,
          polarity: -1,
          bleederOhm: 1e9,
          seriesOutputResistanceOhm: 10e6,
          drive: { kind: 'sine', peakV: 480, frequencyHz: 25e3, sourceResistanceOhm: 150 },
        }),
      );
      const figures = operatingFigures(prepared);
      const full = analyzePrepared(prepared, { operatingPointOnly: true });
      // The same solve in the same order: equal to the last bit.
      expect(figures.outputMeanV).toBe(full.outputMeanV);
      expect(figures.ripplePeakToPeakV).toBe(full.ripplePeakToPeakV);
    }
  });

  it('builds each network with its own capacitor values on a shared structure', () => {
    const caps = [1e-9, 2e-9, 3e-9, 4e-9];
    const a = buildLadderNetwork('half-wave', caps);
    const b = buildLadderNetwork('half-wave', [5e-9, 6e-9, 7e-9, 8e-9]);
    expect(a.capF).toEqual([1e-9, 2e-9, 3e-9, 4e-9]);
    expect(b.capF).toEqual([5e-9, 6e-9, 7e-9, 8e-9]);
    expect(b.capTop).toEqual(a.capTop);
    // The values are copied: the caller's array may change afterwards.
    caps[0] = 9e-9;
    expect(a.capF[0]).toBe(1e-9);
  });
});
