import { describe, expect, it } from 'vitest';
import { evaluate } from 'mathjs';
import { DISCHARGE_RULE_LABELS, NAMED_DISCHARGE_RULES } from '../designs';
import { describeMargin } from './check-rows';
import { dischargeCheck, dischargeRuleLimits, dischargeTimeS, trappedChargeCheck } from './discharge';

describe('bleeder discharge', () => {
  it('t = RC ln(V0/Vsafe) (REFERENCES.md §4; outside check: mathjs)', () => {
    const t = dischargeTimeS(100e6, 1e-9, 6000, 50);
    // Relative 1e-12: identical formula evaluated by mathjs with units.
    expect(Math.abs(t / evaluate('100 Mohm * 1 nF * log(6000 / 50)').toNumber('s') - 1)).toBeLessThan(1e-12);
  });

  it('fails without a bleeder and applies the NFPA 79 60 µC exemption', () => {
    const noBleeder = dischargeCheck({
      bleederOhm: null,
      phases: [{ startV: 5000, capacitanceF: 1e-9 }],
      safeVoltageV: 50,
      rule: '50V-1min',
      storedChargeC: 5e-6,
    });
    expect(noBleeder.verdict.verdict).toBe('fail');
    expect(noBleeder.dischargeTimeS).toBeNull();
    const exempt = dischargeCheck({
      bleederOhm: null,
      phases: [{ startV: 5000, capacitanceF: 1e-9 }],
      safeVoltageV: 60,
      rule: '60V-5s',
      storedChargeC: 5e-6,
    });
    expect(exempt.verdict.verdict).toBe('pass');
  });
});

describe('discharge rules', () => {
  it.each([
    ['50V-1min', 50, 60], // NFPA 70 Art. 460.6 (read)
    ['50V-5min', 50, 300], // Cal/OSHA Title 8 §2893 (read)
    ['60V-5s', 60, 5], // NFPA 79 6.5.1 (read)
  ] as const)('%s is %i V within %i s (REFERENCES.md §4)', (rule, voltageV, timeS) => {
    expect(dischargeRuleLimits(rule)).toMatchObject({ voltageV, timeS });
  });

  it.each(NAMED_DISCHARGE_RULES)('%s reads as the voltage and time it holds', (rule) => {
    const { voltageV, timeS } = dischargeRuleLimits(rule);
    const words = /^to (\d+) V within (\d+) (s|min)$/.exec(DISCHARGE_RULE_LABELS[rule]);
    expect(words).not.toBeNull();
    expect(Number(words![1])).toBe(voltageV);
    expect(Number(words![2]) * (words![3] === 'min' ? 60 : 1)).toBe(timeS);
  });

  it('marks a discharge using 80–100 % of the allowed time as marginal', () => {
    // τ = 100 MΩ · 10 nF = 1 s; from 5 kV to 50 V takes ln(100) ≈ 4.6 s against 5 s: 8 % margin → marginal.
    const result = dischargeCheck({
      bleederOhm: 100e6,
      phases: [{ startV: 5000, capacitanceF: 10e-9 }],
      safeVoltageV: 60,
      rule: { voltageV: 50, timeS: 5 },
      storedChargeC: 50e-6,
    });
    expect(result.verdict.verdict).toBe('marginal');
    expect(result.verdict.value).toBeCloseTo(Math.log(100), 9);
  });
});

describe('trapped charge', () => {
  it('reports the winding-end capacitor above the safe voltage as marginal (service condition) with its charge', () => {
    const check = trappedChargeCheck({ windingEndCapacitorV: 480, windingEndCapacitorF: 2.2e-9, safeVoltageV: 50 });
    expect(check?.verdict).toBe('marginal');
    expect(check?.isServiceCondition).toBe(true);
    if (!check) throw new Error('a check is expected');
    expect(describeMargin(check)).toBe('over the limit, in service only');
    expect(check?.rule).toMatch(/1\.06 µC/); // 2.2 nF × 480 V = 1.056 µC
  });

  it('has nothing to report for a topology without an oscillating column', () => {
    expect(trappedChargeCheck({ windingEndCapacitorV: null, windingEndCapacitorF: 0, safeVoltageV: 50 })).toBeNull();
  });
});
