import type { CheckVerdict } from './check.types';

/** Travels with every report that gives safety verdicts (once, as the report's `caution`). */
export const HV_CAUTION =
  'High voltage can kill. These figures support design work only: the standard that applies to the equipment, local codes and licensed practice govern.';

/** Margin below which an upper-limit safety verdict is marginal rather than pass. */
export const SAFETY_MARGINAL_BELOW_PCT = 20;

export type HazardStandard = 'IEC 61010-1' | 'IEC 60335-1';

/**
 * Stored-charge limit for an accessible part at a given voltage.
 * IEC 61010-1 (2010 ed., from memory, REFERENCES.md §4): not hazardous at or below 70 V DC; above it
 * 45 µC up to 15 kV and 350 mJ above 15 kV.
 * IEC 60335-1 8.1.4 (read, quoted text, REFERENCES.md §4): 0.1 µF for 42.4–450 V peak, 45 µC for
 * 450 V–15 kV, 350 mJ above 15 kV.
 */
export function storedChargeLimit(
  voltageV: number,
  standard: HazardStandard,
): { kind: 'none' | 'charge' | 'capacitance' | 'energy'; limit: number; unit: string; text: string } {
  const v = Math.abs(voltageV);
  if (standard === 'IEC 61010-1') {
    if (v <= 70)
      return {
        kind: 'none',
        limit: 70,
        unit: 'V',
        text: 'IEC 61010-1 (from memory): not hazardous at or below 70 V DC',
      };
    if (v <= 15e3)
      return { kind: 'charge', limit: 45e-6, unit: 'C', text: 'IEC 61010-1 (from memory): 45 µC up to 15 kV' };
    return { kind: 'energy', limit: 0.35, unit: 'J', text: 'IEC 61010-1 (from memory): 350 mJ above 15 kV' };
  }
  if (v <= 42.4)
    return { kind: 'none', limit: 42.4, unit: 'V', text: 'IEC 60335-1 8.1.4 (read): no limit at or below 42.4 V peak' };
  if (v <= 450)
    return {
      kind: 'capacitance',
      limit: 0.1e-6,
      unit: 'F',
      text: 'IEC 60335-1 8.1.4 (read): 0.1 µF for 42.4–450 V peak',
    };
  if (v <= 15e3)
    return { kind: 'charge', limit: 45e-6, unit: 'C', text: 'IEC 60335-1 8.1.4 (read): 45 µC for 450 V–15 kV' };
  return { kind: 'energy', limit: 0.35, unit: 'J', text: 'IEC 60335-1 8.1.4 (read): 350 mJ above 15 kV' };
}

/**
 * A verdict built field by field in one fixed order. A spread of the callers' objects (each of its own shape)
 * goes through V8's generic copy, which was a tenth of a ladder analysis with its hundred Checks.
 */
function checkVerdict(
  fields: Omit<CheckVerdict, 'verdict' | 'marginPct' | 'limit'>,
  limit: number,
  verdict: CheckVerdict['verdict'],
  marginPct: number,
): CheckVerdict {
  return {
    id: fields.id,
    subject: fields.subject,
    rule: fields.rule,
    value: fields.value,
    unit: fields.unit,
    limit,
    verdict,
    marginPct,
  };
}

/** Upper-limit safety verdict: pass with ≥ 20 % margin, marginal 0–20 %, fail above the limit. */
export function upperLimitVerdict(
  fields: Omit<CheckVerdict, 'verdict' | 'marginPct'>,
  marginalBelowPct = SAFETY_MARGINAL_BELOW_PCT,
): CheckVerdict {
  const value = fields.value;
  const marginPct = value === null ? -100 : ((fields.limit - value) / fields.limit) * 100;
  const verdict = marginPct < 0 ? 'fail' : marginPct < marginalBelowPct ? 'marginal' : 'pass';
  return checkVerdict(fields, fields.limit, verdict, marginPct);
}

/** Lower-limit verdict (the value must reach the limit, e.g. provided creepage): same thresholds. */
export function lowerLimitVerdict(fields: Omit<CheckVerdict, 'verdict' | 'marginPct'>): CheckVerdict {
  const value = fields.value ?? 0;
  const marginPct = ((value - fields.limit) / fields.limit) * 100;
  const verdict = marginPct < 0 ? 'fail' : marginPct < SAFETY_MARGINAL_BELOW_PCT ? 'marginal' : 'pass';
  return checkVerdict(fields, fields.limit, verdict, marginPct);
}

/**
 * Component-rating verdict with derating: pass at or below rating × derating, marginal between the
 * derated figure and the rating, fail above the rating. `limit` reports the derated figure.
 */
export function deratedVerdict(
  fields: Omit<CheckVerdict, 'verdict' | 'marginPct' | 'limit'>,
  ratingValue: number,
  derating: number,
): CheckVerdict {
  const limit = ratingValue * derating;
  const value = fields.value ?? Infinity;
  const marginPct = ((limit - value) / limit) * 100;
  const verdict = value <= limit ? 'pass' : value <= ratingValue ? 'marginal' : 'fail';
  return checkVerdict(fields, limit, verdict, marginPct);
}
