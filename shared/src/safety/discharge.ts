import { DomainError } from '../errors';
import type { DischargeRule } from '../designs/design.types';
import { upperLimitVerdict } from './hazard-limits';
import type { CheckVerdict } from './check.types';
import type { MethodInfo } from '../methods';

export const DISCHARGE_METHOD: MethodInfo = {
  methodId: 'bleeder-rc-v1',
  summary:
    'Bleeder discharge V(t) = V0·e^(−t/RC), t = RC·ln(V0/V_end), with the energy-equivalent capacitance at the output; compared with the selected rule.',
  assumptions: [
    'the oscillating column drains through the diodes into the smoothing column and the bleeder as the output falls',
    'diode forward drops and leakage neglected; the bleeder is the only discharge path',
    'verdict marginal when the time uses more than 80 % of the allowance',
  ],
  source: 'NFPA 70 Art. 460.6 and NFPA 79 6.5.1 (read); NEC 460.28 (from memory); V(t) = V0·e^(−t/RC)',
};

/** A discharge rule as voltage and time, with where it comes from (REFERENCES.md §4). */
export function dischargeRuleLimits(rule: DischargeRule): {
  voltageV: number;
  timeS: number;
  text: string;
  exemptBelowChargeC: number | null;
} {
  if (typeof rule === 'object')
    return { ...rule, text: `custom rule: ≤ ${rule.voltageV} V within ${rule.timeS} s`, exemptBelowChargeC: null };
  if (rule === '50V-1min')
    return {
      voltageV: 50,
      timeS: 60,
      text: 'NFPA 70 Art. 460.6 (read): ≤ 50 V within 1 min',
      exemptBelowChargeC: null,
    };
  if (rule === '50V-5min')
    return {
      voltageV: 50,
      timeS: 300,
      text: 'Cal/OSHA Title 8 §2893 (read); NEC 460.28 (from memory): ≤ 50 V within 5 min',
      exemptBelowChargeC: null,
    };
  return {
    voltageV: 60,
    timeS: 5,
    text: 'NFPA 79 6.5.1 (read): ≤ 60 V within 5 s unless stored charge ≤ 60 µC',
    exemptBelowChargeC: 60e-6,
  };
}

/** Time for an RC discharge from v0 to vEnd: t = R·C·ln(v0/vEnd) (REFERENCES.md §4). 0 when already below. */
export function dischargeTimeS(resistanceOhm: number, capacitanceF: number, v0: number, vEnd: number): number {
  if (!(resistanceOhm > 0) || !(capacitanceF >= 0) || !(vEnd > 0)) {
    throw new DomainError('invalid_argument', 'discharge needs positive resistance and end voltage', 'bleeder');
  }
  const ratio = Math.abs(v0) / vEnd;
  return ratio <= 1 ? 0 : resistanceOhm * capacitanceF * Math.log(ratio);
}

export interface DischargeInput {
  bleederOhm: number | null;
  /** Energy-equivalent capacitance at the output (all stored energy drains through the bleeder). */
  equivalentCapacitanceF: number;
  outputV: number;
  safeVoltageV: number;
  rule: DischargeRule;
  storedChargeC: number;
}

/** Bleeder discharge check against the selected rule; marginal when the time uses more than 80 % of the allowance. */
export function dischargeCheck(input: DischargeInput): { dischargeTimeS: number | null; verdict: CheckVerdict } {
  const rule = dischargeRuleLimits(input.rule);
  const ruleText = `${rule.text}; bleeder RC with the energy-equivalent capacitance (the oscillating column drains through the diodes); marginal within 20 % of the allowed time`;
  const exempt = rule.exemptBelowChargeC !== null && input.storedChargeC <= rule.exemptBelowChargeC;
  if (exempt) {
    return {
      dischargeTimeS: input.bleederOhm
        ? dischargeTimeS(input.bleederOhm, input.equivalentCapacitanceF, input.outputV, input.safeVoltageV)
        : null,
      verdict: {
        id: 'discharge-time',
        subject: 'bleeder discharge',
        rule: ruleText,
        verdict: 'pass',
        marginPct: 100,
        value: input.storedChargeC,
        limit: rule.exemptBelowChargeC ?? 0,
        unit: 'C',
      },
    };
  }
  if (!input.bleederOhm) {
    return {
      dischargeTimeS: null,
      verdict: upperLimitVerdict({
        id: 'discharge-time',
        subject: 'no bleeder',
        rule: ruleText,
        value: null,
        limit: rule.timeS,
        unit: 's',
      }),
    };
  }
  const toRule = dischargeTimeS(input.bleederOhm, input.equivalentCapacitanceF, input.outputV, rule.voltageV);
  return {
    dischargeTimeS: dischargeTimeS(input.bleederOhm, input.equivalentCapacitanceF, input.outputV, input.safeVoltageV),
    verdict: upperLimitVerdict({
      id: 'discharge-time',
      subject: `bleeder to ${rule.voltageV} V`,
      rule: ruleText,
      value: toRule,
      limit: rule.timeS,
      unit: 's',
    }),
  };
}

export interface TrappedChargeInput {
  /** Operating voltage of the oscillating-column capacitor at the winding end (null when the topology has none). */
  windingEndCapacitorV: number | null;
  windingEndCapacitorF: number;
  safeVoltageV: number;
}

/**
 * Charge left on the oscillating column after switch-off when the bleeder sits only at the output. With
 * the winding connected the column drains through the diodes into the bleeder; with the winding
 * disconnected (service) the capacitor at the winding end keeps its charge: that case is reported, as
 * marginal (a service condition, not normal use) when it exceeds the safe voltage.
 */
export function trappedChargeCheck(input: TrappedChargeInput): CheckVerdict | null {
  if (input.windingEndCapacitorV === null) return null;
  const v = Math.abs(input.windingEndCapacitorV);
  const over = v > input.safeVoltageV;
  return {
    id: 'trapped-charge',
    subject: 'oscillating column, winding disconnected',
    rule: `capacitor at the winding end keeps ${(input.windingEndCapacitorF * v * 1e6).toPrecision(3)} µC when the winding is removed; compared with the safe voltage; marginal (service condition) when above; a bleeder across it or a discharge procedure clears it (common practice)`,
    verdict: over ? 'marginal' : 'pass',
    marginPct: ((input.safeVoltageV - v) / input.safeVoltageV) * 100,
    value: v,
    limit: input.safeVoltageV,
    unit: 'V',
    isServiceCondition: true,
  };
}
