import { STRESS_CHECK_IDS } from '@ladderwright/shared/multiplier';
import { type CheckRow, type CheckVerdict, describeMargin, mergeCheckRows } from '@ladderwright/shared/safety';
import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';
import { type Doc, heading, MUTED, note, printable, table } from './spec-sheet-layout';

const verdictRank: Record<CheckVerdict['verdict'], number> = { fail: 0, marginal: 1, pass: 2 };

/** Worst first (fail, marginal, pass; the smaller margin first among equals), as the Workbench's Checks. */
export function worstFirst<T extends Pick<CheckVerdict, 'verdict' | 'marginPct'>>(checks: readonly T[]): T[] {
  return [...checks].sort((a, b) => verdictRank[a.verdict] - verdictRank[b.verdict] || a.marginPct - b.marginPct);
}

/** A verdict with the Workbench's margin words: "pass, 38 % below the limit". */
export function verdictWords(check: Pick<CheckVerdict, 'verdict' | 'value' | 'limit' | 'marginPct'>): string {
  return `${check.verdict}, ${describeMargin(check)}`;
}

/**
 * The bleeder string's checks: one voltage and one power check for the whole string (engine 1.2.0 on), or the
 * per-resistor checks that reports stored by older engines carry (`bleeder-voltage-r1`, `bleeder-power-r1`, …).
 */
export function bleederChecks(checks: readonly CheckVerdict[]): CheckVerdict[] {
  const whole = checks.filter(
    (check) => check.id === STRESS_CHECK_IDS.bleederVoltage || check.id === STRESS_CHECK_IDS.bleederPower,
  );
  return whole.length > 0 ? whole : checks.filter((check) => /^bleeder-(voltage|power)-r\d+$/.test(check.id));
}

/** The worst of a part's checks in the Workbench's words, or a dash when none speaks of it. */
export function partVerdict(checks: readonly CheckVerdict[]): string {
  const worst = worstFirst(checks)[0];
  return worst ? verdictWords(worst) : '—';
}

const quantityUnits = new Set<string>(['V', 'A', 'F', 'Ohm', 'Hz', 'W', 'J', 'C', 's', 'H', 'm']);

function valueText(value: number | null, unit: string): string {
  if (value === null) return 'unbounded';
  if (quantityUnits.has(unit)) return printable(formatQuantity(value, unit as QuantityUnit));
  return `${Number(value.toPrecision(3))} ${unit}`.trim();
}

/**
 * The standards a merged row names. A rule with no standard before its colon is a whole sentence; its closing
 * parenthesis says where the limit comes from ("derating, common practice, no source").
 */
function standardsText(row: CheckRow): string {
  return row.standards
    .map((standard) => (standard.length > 40 ? (/\(([^()]*)\)\s*$/.exec(standard)?.[1] ?? standard) : standard))
    .join('; ');
}

/**
 * The Checks as the Workbench lists them: one row per limit naming every standard that sets it, worst first,
 * with the margin in words; passing rows are counted, the others listed.
 */
export function checksSection(doc: Doc, checks: readonly CheckVerdict[], sourceNote: string | null): void {
  heading(doc, 'Checks');
  const rows = worstFirst(mergeCheckRows(checks));
  const counts = { pass: 0, marginal: 0, fail: 0 };
  for (const row of rows) counts[row.verdict] += 1;
  doc.font('semibold').fontSize(9).text(`${counts.fail} fail · ${counts.marginal} marginal · ${counts.pass} pass`);
  if (sourceNote) note(doc, sourceNote);
  doc.moveDown(0.3);
  table(
    doc,
    [
      { title: 'Subject', width: 132 },
      { title: 'Verdict, margin', width: 140 },
      { title: 'Value', width: 56 },
      { title: 'Limit', width: 56 },
      { title: 'Set by', width: 115 },
    ],
    rows.map((row) => [
      row.subject,
      verdictWords(row),
      valueText(row.value, row.unit),
      valueText(row.limit, row.unit),
      standardsText(row),
    ]),
  );
  doc.moveDown(0.2);
  doc.fillColor(MUTED);
}
