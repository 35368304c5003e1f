import { simulationSourceLabel } from '@ladderwright/shared/analysis';
import { DISCHARGE_RULE_LABELS, documentFieldLabel, resultFieldLabel } from '@ladderwright/shared/designs';
import { dischargeRuleLimits } from '@ladderwright/shared/safety';
import type { SpecSheetContent } from './spec-sheet.types';
import { type Doc, ensureRoom, heading, INK, keyValues, MARGIN, q, TEXT_WIDTH, WARN } from './spec-sheet-layout';

/** Stored energy and charge, the discharge through the bleeder against the rule, and the high-voltage caution. */
export function safetySection(doc: Doc, c: SpecSheetContent): void {
  heading(doc, 'Stored energy, discharge and safety');
  const { document } = c;
  const report = c.headline.report;
  const rule = document.targets.dischargeRule;
  const ruleV = dischargeRuleLimits(rule).voltageV;
  const safeV = document.targets.safeVoltageV;
  // A stored simulation discharges to the rule's voltage: it gives the time to the safe voltage only where they are one.
  const simulated = c.headline.simulatedKeys.includes('discharge') ? ` (${simulationSourceLabel(c.headline)})` : null;
  const timeTo = (timeS: number | null | undefined, source: string) =>
    timeS === null || timeS === undefined ? 'no discharge path: fit a bleeder' : `${q(timeS, 's')}${source}`;
  keyValues(doc, [
    [`${resultFieldLabel('storedEnergyJ').label}, all capacitors`, q(report.storedEnergyJ, 'J')],
    [`${resultFieldLabel('storedChargeC').label}, all capacitors`, q(report.storedChargeC, 'C')],
    [
      `Bleeder discharge to ${q(safeV, 'V')}`,
      timeTo(report.dischargeTimeS, ruleV === safeV && simulated ? simulated : ' (estimate)'),
    ],
    ...(ruleV === safeV || report.dischargeTimeToRuleS === undefined
      ? []
      : [
          [
            `Bleeder discharge to ${q(ruleV, 'V')}`,
            timeTo(report.dischargeTimeToRuleS, simulated ?? ' (estimate)'),
          ] as [string, string],
        ]),
    [
      documentFieldLabel('targets.dischargeRule').label,
      typeof rule === 'string'
        ? DISCHARGE_RULE_LABELS[rule]
        : `to ${q(rule.voltageV, 'V')} within ${q(rule.timeS, 's')}`,
    ],
  ]);
  cautionBox(
    doc,
    'These figures are design predictions. The standard that applies to the equipment, local codes and licensed practice govern every build and test. Discharge the output and every ladder node before touching the assembly.',
  );
}

/** The boxed high-voltage caution with its own sentence under the heading. */
export function cautionBox(doc: Doc, text: string): void {
  ensureRoom(doc, 70);
  doc.moveDown(0.6);
  const top = doc.y;
  doc.rect(MARGIN, top, TEXT_WIDTH, 52).lineWidth(1.2).strokeColor(WARN).stroke();
  doc
    .font('bold')
    .fontSize(10)
    .fillColor(WARN)
    .text('HIGH VOLTAGE CAN KILL', MARGIN + 10, top + 8);
  doc
    .font('regular')
    .fontSize(8.5)
    .fillColor(INK)
    .text(text, MARGIN + 10, doc.y + 2, { width: TEXT_WIDTH - 20 });
  doc.y = top + 60;
  doc.x = MARGIN;
}
