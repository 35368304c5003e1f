import type { DesignReport } from '../analysis';
import type { FieldIssue } from '../errors';

/** A check as the API sends it: its rule text named by `ruleKey` in the report's `checkRules`, not repeated. */
export type CheckBody<C extends { rule: string }> = Omit<C, 'rule'> & { ruleKey: string };

type DriverBody = Omit<NonNullable<DesignReport['driver']>, 'checks'> & {
  checks: CheckBody<NonNullable<DesignReport['driver']>['checks'][number]>[];
};
type TransformerBody = Omit<NonNullable<DesignReport['transformer']>, 'checks'> & {
  checks: CheckBody<NonNullable<DesignReport['transformer']>['checks'][number]>[];
};

/**
 * A report as the API sends it (GET a revision, POST evaluate, a saved revision): every check of the report, of its
 * driver and of its designed transformer names its rule by key, and `checkRules` gives each distinct rule text once
 * (keys `r1`, `r2`, … in order of first use). A ladder has one rule per kind of check however many capacitors it
 * has, so the rules travel once instead of once per check. `expandCheckRules` gives back the report as computed.
 */
export type DesignReportWire = Omit<DesignReport, 'checks' | 'driver' | 'transformer'> & {
  checkRules: Record<string, string>;
  checks: CheckBody<DesignReport['checks'][number]>[];
  driver: DriverBody | null;
  transformer?: TransformerBody;
  partIssues?: FieldIssue[];
};

/** Puts each distinct rule text of `checks` in `rules` once and names it by key on each check. */
function packChecks<C extends { rule: string }>(checks: readonly C[], rules: Map<string, string>): CheckBody<C>[] {
  return checks.map((check) => {
    const { rule, ...rest } = check;
    let key = rules.get(rule);
    if (key === undefined) {
      key = `r${rules.size + 1}`;
      rules.set(rule, key);
    }
    return { ...rest, ruleKey: key };
  });
}

/** Looks each check's rule up by its key; a check stored with its text inline (older answers) keeps it. */
function expandChecks<C extends { rule: string }>(
  checks: readonly (CheckBody<C> | C)[],
  rules: Readonly<Record<string, string>>,
): C[] {
  return checks.map((check) => {
    if ('rule' in check && typeof check.rule === 'string') return check;
    const { ruleKey, ...rest } = check as CheckBody<C>;
    return { ...rest, rule: rules[ruleKey] ?? '' } as unknown as C;
  });
}

/** Two lists of checks as the API sends them (Compare designs): each rule text once in `rules`. */
export function packCheckLists<C extends { rule: string }>(
  a: readonly C[],
  b: readonly C[],
): { a: CheckBody<C>[]; b: CheckBody<C>[]; rules: Record<string, string> } {
  const rules = new Map<string, string>();
  const packed = { a: packChecks(a, rules), b: packChecks(b, rules) };
  return { ...packed, rules: rulesRecord(rules) };
}

/** One list of checks as computed, each rule looked up in `rules` (see packCheckLists). */
export function expandCheckList<C extends { rule: string }>(
  checks: readonly (CheckBody<C> | C)[],
  rules: Readonly<Record<string, string>>,
): C[] {
  return expandChecks(checks, rules);
}

function rulesRecord(rules: ReadonlyMap<string, string>): Record<string, string> {
  const record: Record<string, string> = {};
  for (const [rule, key] of rules) record[key] = rule;
  return record;
}

/** The report as the API sends it: each check's rule text given once in `checkRules` (see DesignReportWire). */
export function packCheckRules(report: DesignReport & { partIssues?: FieldIssue[] }): DesignReportWire {
  const { transformer, ...rest } = report;
  const rules = new Map<string, string>();
  const checks = packChecks(report.checks, rules);
  const driver = report.driver && { ...report.driver, checks: packChecks(report.driver.checks, rules) };
  const transformerBody = transformer && { ...transformer, checks: packChecks(transformer.checks, rules) };
  return {
    ...rest,
    checkRules: rulesRecord(rules),
    checks,
    driver,
    ...(transformerBody ? { transformer: transformerBody } : {}),
  };
}

/**
 * The report as computed, from the API's answer: each check's rule looked up in `checkRules`. A report that already
 * carries its rules inline (no `checkRules`) comes back as it is.
 */
export function expandCheckRules(
  body: DesignReportWire | (DesignReport & { partIssues?: FieldIssue[] }),
): DesignReport & { partIssues?: FieldIssue[] } {
  if (!('checkRules' in body)) return body;
  const { checkRules: rules, ...report } = body;
  return {
    ...report,
    checks: expandChecks(report.checks, rules),
    driver: report.driver && { ...report.driver, checks: expandChecks(report.driver.checks, rules) },
    ...(report.transformer
      ? { transformer: { ...report.transformer, checks: expandChecks(report.transformer.checks, rules) } }
      : {}),
  } as DesignReport & { partIssues?: FieldIssue[] };
}
