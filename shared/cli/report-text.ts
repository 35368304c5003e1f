import { formatQuantity } from '../src/units/format-quantity';
import type { QuantityUnit } from '../src/units/quantity.types';
import type { DesignReport, LadderReport } from '../src/analysis/analyze-design';

function row(label: string, value: number | null, unit: QuantityUnit | ''): string {
  return `  ${label.padEnd(26)}${value === null ? '—' : formatQuantity(value, unit, 4)}`;
}

/** Readable table of a ladder or design report (the JSON report is the reference form). */
export function reportAsText(report: LadderReport | DesignReport): string {
  const lines = [
    'designName' in report ? `Design: ${report.designName}` : 'Bare ladder',
    row('no-load output', report.noLoadOutputV, 'V'),
    row('output, cycle mean', report.outputMeanV, 'V'),
    row('output, min / max', report.outputMinV, 'V') + ' / ' + formatQuantity(report.outputMaxV, 'V', 4),
    row('ripple, peak-to-peak', report.ripplePeakToPeakV, 'V'),
    row('droop', report.droopV, 'V'),
    ...('droopWithBleederV' in report
      ? [
          row('open-circuit output', report.openCircuitOutputV, 'V'),
          row('droop with the bleeder', report.droopWithBleederV, 'V'),
          row('bleeder power', report.bleederPowerW, 'W'),
          row('ladder output power', report.ladderOutputPowerW, 'W'),
        ]
      : []),
    row('output impedance', report.outputImpedanceOhm, 'Ohm'),
    `  ${'optimum stages'.padEnd(26)}${report.optimumStages}` +
      (report.optimumStagesClosedForm !== null
        ? ` (closed form √(Vmax·f·C/I) = ${report.optimumStagesClosedForm.toFixed(1)})`
        : ''),
    row('textbook ripple', report.textbookRippleV, 'V'),
    row('textbook drop ΔV0', report.textbookDropV, 'V'),
    row('stored energy', report.storedEnergyJ, 'J'),
    row('stored charge', report.storedChargeC, 'C'),
    row('discharge to safe', report.dischargeTimeS, 's'),
    'Checks:',
    ...report.checks.map(
      (c) => `  ${c.verdict.toUpperCase().padEnd(9)}${c.marginPct.toFixed(1).padStart(8)} %  ${c.id} — ${c.subject}`,
    ),
    `Method: ${report.analysis.method.methodId}: ${report.analysis.method.summary}`,
    report.caution,
  ];
  return lines.join('\n');
}
