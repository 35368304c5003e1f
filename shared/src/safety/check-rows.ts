import type { CheckVerdict } from './check.types';

/** One row of the Checks: a limit on one subject, with every rule (standard) that sets the same limit. */
export interface CheckRow extends CheckVerdict {
  /** The ids of the merged checks, the first one's first. */
  ids: string[];
  /** Each merged rule's source as its text names it before the first colon (e.g. `IEC 61010-1 (from memory)`). */
  standards: string[];
  /** The full rule texts, one per merged check. */
  rules: string[];
}

/** The part of a rule that names its source: the text before the first colon, or the whole rule without one. */
function standardOf(rule: string): string {
  const colon = rule.indexOf(':');
  return (colon > 0 ? rule.slice(0, colon) : rule).trim();
}

/**
 * The checks with those that test the same value of the same subject against the same limit merged into one row
 * (two standards setting 45 µC on the stored charge give one row naming both), in their first order.
 */
export function mergeCheckRows(checks: readonly CheckVerdict[]): CheckRow[] {
  const rows = new Map<string, CheckRow>();
  for (const check of checks) {
    const key = JSON.stringify([check.subject, check.unit, check.limit, check.value, check.verdict]);
    const row = rows.get(key);
    if (row) {
      row.ids.push(check.id);
      row.rules.push(check.rule);
      const standard = standardOf(check.rule);
      if (!row.standards.includes(standard)) row.standards.push(standard);
    } else {
      rows.set(key, { ...check, ids: [check.id], standards: [standardOf(check.rule)], rules: [check.rule] });
    }
  }
  return [...rows.values()];
}

/** Two significant figures, no trailing zeros: 22.46 → "22", 1.234 → "1.2", 0.456 → "0.46". */
function twoFigures(value: number): string {
  if (value >= 10) return Math.round(value).toString();
  return Number(value.toPrecision(2)).toString();
}

/** A small ratio (under 1 %) as per cent to two significant figures: 1.28e-4 → "0.013". */
function percentOf(ratio: number): string {
  return Number(Math.max(0, ratio * 100).toPrecision(2)).toString();
}

/** Per cent of a bounded share (0–100): integer from 10 up, one decimal below. */
function share(pct: number): string {
  const bounded = Math.min(100, Math.max(0, pct));
  return bounded >= 10 ? Math.round(bounded).toString() : Number(bounded.toFixed(1)).toString();
}

/**
 * A check's distance from its limit in a bounded, readable form, instead of a signed percentage that runs to
 * thousands: "38 % below the limit", "40 % over the limit", "22× the limit", "2.0× the minimum",
 * "15 % short of the minimum". An upper limit is told from a lower one by the sign convention of `marginPct`
 * ((limit − value)/limit for an upper limit, (value − limit)/limit for a lower one). Given the verdict, the words
 * agree with it: a marginal check past its limit is marginal by its rule, not by a thin margin, so it is not given
 * as a multiple ("over the limit, in service only" for a check whose rule covers a service condition only).
 */
export function describeMargin(
  check: Pick<CheckVerdict, 'value' | 'limit' | 'marginPct'> &
    Partial<Pick<CheckVerdict, 'verdict' | 'isServiceCondition'>>,
): string {
  const { value, limit, marginPct } = check;
  if (value === null) return 'unbounded';
  if (!(limit > 0) || !Number.isFinite(value)) {
    const sign = marginPct > 0 ? '+' : marginPct < 0 ? '−' : '±';
    return `${sign}${share(Math.abs(marginPct))} % margin`;
  }
  if (value === limit) return 'at the limit';
  const ratio = value / limit;
  const isUpperLimit = marginPct > 0 === value < limit;
  const isPastLimit = isUpperLimit ? value > limit : value < limit;
  if (check.verdict === 'marginal' && isPastLimit) {
    if (check.isServiceCondition === true)
      return isUpperLimit ? 'over the limit, in service only' : 'short of the minimum, in service only';
    if (isUpperLimit ? ratio >= 2 : ratio <= 0.5)
      return isUpperLimit ? 'over the limit, marginal by its rule' : 'short of the minimum, marginal by its rule';
  }
  if (isUpperLimit) {
    // Far below, "100 % below" hides how far: a current of 1.3 mA against a 10 A rating reads "0.013 % of the limit".
    if (value < limit)
      return ratio < 0.01 ? `${percentOf(ratio)} % of the limit` : `${share((1 - ratio) * 100)} % below the limit`;
    return ratio < 2 ? `${share((ratio - 1) * 100)} % over the limit` : `${twoFigures(ratio)}× the limit`;
  }
  if (value > limit)
    return ratio < 2 ? `${share((ratio - 1) * 100)} % above the minimum` : `${twoFigures(ratio)}× the minimum`;
  return `${share((1 - ratio) * 100)} % short of the minimum`;
}
