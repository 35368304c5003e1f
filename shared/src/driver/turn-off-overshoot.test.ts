import { describe, expect, it } from 'vitest';
import { turnOffMagnetizingPeakA } from './turn-off-overshoot';

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
