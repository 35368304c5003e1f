import { describe, expect, it } from 'vitest';
import { collectorToBaseRatio, turnOffMagnetizingPeakA } from './turn-off-overshoot';

// LC tank closed forms (common practice, no source): Z = √(L/C); a current source i0 kept on the node while
// the inductor starts at i0 and the node at v0 gives i = i0 + (v0/Z)·sin ωt, v = v0·cos ωt; with the source
// gone at once, i = i0·cos ωt + (v0/Z)·sin ωt, peaking at √(i0² + (v0/Z)²) where v crosses zero.
describe('the magnetizing current through the turn-off slew', () => {
  const slew = {
    startCurrentA: 0.06,
    primaryVoltageV: 2.8,
    magnetizingInductanceH: 1e-3,
    collectorNodeCapacitanceF: 12e-9,
  };
  const z = Math.sqrt(1e-3 / 12e-9);

  it('a collector current that does not follow the base drive adds v0/Z', () => {
    expect(turnOffMagnetizingPeakA({ ...slew, transconductanceS: 0 })).toBeCloseTo(0.06 + 2.8 / z, 7);
  });

  it('a collector that cuts off at once leaves the tank to peak at √(i0² + (v0/Z)²)', () => {
    expect(turnOffMagnetizingPeakA({ ...slew, transconductanceS: 1e6 })).toBeCloseTo(Math.hypot(0.06, 2.8 / z), 6);
  });

  it('a real base drive lies between the two, and no slew leaves the current as it was', () => {
    const peak = turnOffMagnetizingPeakA({ ...slew, transconductanceS: 7e-3 });
    expect(peak).toBeGreaterThan(Math.hypot(0.06, 2.8 / z));
    expect(peak).toBeLessThan(0.06 + 2.8 / z);
    expect(turnOffMagnetizingPeakA({ ...slew, primaryVoltageV: 0, transconductanceS: 7e-3 })).toBe(0.06);
  });
});

describe('the turn-off slew with the self-capacitance behind the leakage', () => {
  // About the demo E25 section on a 3 V stage: Lp 1 mH, k 0.9943, 100 pF stray + (1 + 100)·5 pF Miller at the
  // collector, 8.4 pF self-capacitance reflected by 60² behind the leakage, a 5.6 kΩ base resistor.
  const lp = 1e-3;
  const k = 0.9943;
  const base = {
    startCurrentA: 0.0596,
    primaryVoltageV: 2.8,
    magnetizingInductanceH: k * lp,
    collectorNodeCapacitanceF: 605e-12 + 30.1e-9,
    transconductanceS: 7.14e-3,
  };
  const leakage = {
    leakageH: (1 - k) * lp,
    collectorCapacitanceF: 605e-12,
    reflectedCapacitanceF: 30.1e-9,
    clampPrimaryV: 3 - 15,
    forwardBeta: 100,
    reverseBeta: 2,
    vceSatV: 0.2,
    vbeOnV: 0.7,
  };

  it('the Ebers–Moll ratio solves V_CE = V_T·ln((1/α_R + x/β_R)/(1 − x/β_F)) for x', () => {
    // Ebers & Moll, Proc. IRE 42 (1954), the saturation voltage at a forced gain x (from memory).
    const vt = (1.380649e-23 * 300.15) / 1.602176634e-19;
    const alphaR = 2 / 3;
    for (const x of [5, 50, 95]) {
      const vce = vt * Math.log((1 / alphaR + x / 2) / (1 - x / 100));
      expect(collectorToBaseRatio(vce, 100, 2)).toBeCloseTo(x, 9);
    }
    // Far above saturation the ratio is β_F; with the collector below the emitter, the current reverses.
    expect(collectorToBaseRatio(2, 100, 2)).toBeCloseTo(100, 6);
    expect(collectorToBaseRatio(-0.3, 100, 2)).toBeLessThan(0);
  });

  it('lies between the instant cut-off √(i0² + (v0/Z)²) and the one-node figure', () => {
    const z = Math.sqrt(base.magnetizingInductanceH / base.collectorNodeCapacitanceF);
    const split = turnOffMagnetizingPeakA({ ...base, leakage });
    expect(split).toBeGreaterThan(Math.hypot(base.startCurrentA, base.primaryVoltageV / z));
    expect(split).toBeLessThan(turnOffMagnetizingPeakA(base));
  });

  it('with a leakage ring far faster than the slew, takes the collector node as one', () => {
    const tight = { ...leakage, leakageH: 1e-4 * lp };
    expect(turnOffMagnetizingPeakA({ ...base, leakage: tight })).toBe(turnOffMagnetizingPeakA(base));
  });
});
