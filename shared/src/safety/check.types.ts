/**
 * One verdict of the Checks panel. `value` null means unbounded (e.g. no discharge path). The high-voltage caution
 * that travels with the verdicts is the report's `caution`, given once for all of them.
 */
export interface CheckVerdict {
  id: string;
  subject: string;
  /** The rule applied, naming its source and the thresholds. */
  rule: string;
  verdict: 'pass' | 'marginal' | 'fail';
  /** Margin to the limit in percent: (limit − value)/limit·100 for an upper limit, (value − limit)/limit·100 for a lower one. */
  marginPct: number;
  value: number | null;
  limit: number;
  unit: string;
  /**
   * The rule covers a service condition only (the winding removed, say): past its limit the check is marginal, not
   * failed, however far past, and its margin is read that way.
   */
  isServiceCondition?: boolean;
}
