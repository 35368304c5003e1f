import { STRESS_CHECK_IDS } from '@ladderwright/shared/multiplier';
import type { CheckVerdict } from '@ladderwright/shared/safety';
import type { SpecSheetContent } from './spec-sheet.types';
import { bleederChecks, partVerdict } from './spec-sheet-checks';
import { type Column, type Doc, heading, q, table } from './spec-sheet-layout';

/** The verdict of the checks with these ids, worst first, in the Workbench's words. */
function verdictOf(checks: readonly CheckVerdict[], ...ids: string[]): string {
  return partVerdict(checks.filter((check) => ids.includes(check.id)));
}

const VERDICT_COLUMN: Column = { title: 'Verdict, margin', width: 137 };

/** Capacitors, diodes and the output resistors with ratings, working figures and each part's worst check. */
export function bomSection(doc: Doc, c: SpecSheetContent): void {
  heading(doc, 'Multiplier BOM');
  const { document } = c;
  const report = c.headline.report;
  const checks = report.checks;
  const capRows = document.multiplier.capacitors.map((cap, i) => {
    const stress = report.analysis.capacitors[i];
    return [
      `C${i + 1}`,
      cap.partCode ?? '—',
      q(cap.valueF, 'F'),
      `±${(cap.tolerance * 100).toFixed(0)} %`,
      q(cap.ratedVoltageV, 'V'),
      q(stress?.maxVoltageV, 'V'),
      verdictOf(checks, STRESS_CHECK_IDS.capacitorVoltage(i + 1)),
    ];
  });
  const diode = document.multiplier.diode;
  const diodeRows = report.analysis.diodes.map((d) => [
    `D${d.index}`,
    diode.partCode ?? '—',
    `PIV ${q(diode.ratedPivV, 'V')}`,
    `${q(diode.ratedAverageCurrentA, 'A')} avg`,
    q(d.peakInverseV, 'V'),
    q(d.averageCurrentA, 'A'),
    // PIV, average and surge current: the diode's worst.
    partVerdict(checks.filter((check) => new RegExp(`^diode-[a-z-]+-d${d.index}$`).test(check.id))),
  ]);
  table(
    doc,
    [
      { title: 'Ref', width: 34 },
      { title: 'Part code', width: 80 },
      { title: 'Value', width: 60 },
      { title: 'Tolerance', width: 52 },
      { title: 'Rated', width: 60 },
      { title: 'Working peak', width: 76 },
      VERDICT_COLUMN,
    ],
    capRows,
  );
  doc.moveDown(0.5);
  table(
    doc,
    [
      { title: 'Ref', width: 34 },
      { title: 'Part code', width: 80 },
      { title: 'Rated PIV', width: 60 },
      { title: 'Rated avg', width: 52 },
      { title: 'Working PIV', width: 60 },
      { title: 'Avg current', width: 76 },
      VERDICT_COLUMN,
    ],
    diodeRows,
  );
  const bleeder = document.outputNetwork.bleeder;
  doc.moveDown(0.5);
  const resistorRows: string[][] = [];
  if (bleeder) {
    resistorRows.push([
      bleeder.count === 1 ? 'R1' : `R1–R${bleeder.count}`,
      bleeder.partCode ?? '—',
      `${bleeder.count} × ${q(bleeder.valueOhm, 'Ohm')}`,
      `${q(bleeder.ratedPowerW, 'W')}, ${q(bleeder.limitingVoltageV, 'V')}`,
      'bleeder string',
      // Voltage and power of the string (one check each from engine 1.2.0; per resistor before).
      partVerdict(bleederChecks(checks)),
    ]);
  }
  resistorRows.push(['Rs', '—', q(document.outputNetwork.seriesOutputResistanceOhm, 'Ohm'), '', 'series output', '']);
  table(
    doc,
    [
      { title: 'Ref', width: 34 },
      { title: 'Part code', width: 80 },
      { title: 'Value', width: 72 },
      { title: 'Power, voltage rating', width: 100 },
      { title: 'Use', width: 76 },
      VERDICT_COLUMN,
    ],
    resistorRows,
  );
}
