import { describe, expect, it } from 'vitest';
import { DERATING, bleederStressChecks } from './ladder-stress';

describe('bleederStressChecks', () => {
  // Equal resistors share the voltage equally (series divider, Ohm's law): 6 kV over 1000 resistors is
  // 6 V each; 6 kV mean over 1000 × 1 MΩ draws 6 µA, 36 µW per resistor.
  it('gives one voltage and one power verdict for a string of 1000 resistors, each at its share', () => {
    const checks = bleederStressChecks(
      { count: 1000, valueOhm: 1e6, ratedPowerW: 0.25, limitingVoltageV: 200 },
      6000,
      6000,
    );
    expect(checks.map((c) => c.id)).toEqual(['bleeder-voltage', 'bleeder-power']);
    expect(checks[0]?.value).toBeCloseTo(6, 12);
    expect(checks[1]?.value).toBeCloseTo(36e-6, 15);
    expect(checks[0]?.subject).toBe('each of the 1000 bleeder resistors');
    expect(checks.every((c) => c.verdict === 'pass')).toBe(true);
    expect(DERATING.resistorVoltage).toBe(0.8);
  });
});
