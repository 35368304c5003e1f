import { DomainError } from '../errors';
import type { DischargeRule } from '../designs/design.types';
import { upperLimitVerdict } from './hazard-limits';
import type { CheckVerdict } from './check.types';
import type { MethodInfo } from '../methods';
import { cascadeDischargeTimeS, type DischargePhase } from './cascade-discharge';

export const DISCHARGE_METHOD: MethodInfo = {
  methodId: 'bleeder-cascade-v2',
  summary:
    'Bleeder discharge of the ladder with the drive stopped, interval by interval: while a set of diodes conducts the output decays as V·e^(−t/RC), C the capacitance the bleeder sees through them; a diode joins when its anode reaches its cathode; the times to the level are summed and compared with the selected rule.',
  assumptions: [
    'the winding ends stand at 0 V once the drive stops; the capacitors start at their mean operating voltages',
    'diodes ideal (no forward drop, no leakage); a diode that starts to conduct keeps conducting; the bleeder is the only discharge path',
    'verdict marginal when the time uses more than 80 % of the allowance',
  ],
  source:
    'NFPA 70 Art. 460.6 and NFPA 79 6.5.1 (read); NEC 460.28 (from memory); V(t) = V0·e^(−t/RC) per interval; checked against ngspice on the exported netlist',
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
  /** The ladder's discharge through the bleeder, interval by interval (`cascadeDischargePhases`). */
  phases: readonly DischargePhase[];
  safeVoltageV: number;
  rule: DischargeRule;
  storedChargeC: number;
}

/** Bleeder discharge check against the selected rule; marginal when the time uses more than 80 % of the allowance. */
export function dischargeCheck(input: DischargeInput): {
  /** To the safe voltage, s; null without a bleeder. */
  dischargeTimeS: number | null;
  /** To the rule's voltage, s; null without a bleeder. */
  dischargeTimeToRuleS: number | null;
  verdict: CheckVerdict;
} {
  const rule = dischargeRuleLimits(input.rule);
  const ruleText = `${rule.text}; bleeder discharge of the ladder interval by interval (each capacitor drains as its diodes conduct); marginal within 20 % of the allowed time`;
  const timeTo = (bleederOhm: number, levelV: number) => cascadeDischargeTimeS(input.phases, bleederOhm, levelV);
  const exempt = rule.exemptBelowChargeC !== null && input.storedChargeC <= rule.exemptBelowChargeC;
  if (exempt) {
    return {
      dischargeTimeS: input.bleederOhm ? timeTo(input.bleederOhm, input.safeVoltageV) : null,
      dischargeTimeToRuleS: input.bleederOhm ? timeTo(input.bleederOhm, rule.voltageV) : null,
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
      dischargeTimeToRuleS: null,
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
  const toRule = timeTo(input.bleederOhm, rule.voltageV);
  return {
    dischargeTimeS: timeTo(input.bleederOhm, input.safeVoltageV),
    dischargeTimeToRuleS: toRule,
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
