import { join } from 'node:path';
import PDFDocument from 'pdfkit';
import { formatQuantity } from '@ladderwright/shared/units';
import { STRESS_CHECK_IDS } from '@ladderwright/shared/multiplier';
import type { CheckVerdict } from '@ladderwright/shared/safety';
import { schematicSection } from './spec-sheet-schematic';
import type { SpecSheetContent } from './spec-sheet.types';

type Doc = InstanceType<typeof PDFDocument>;

/** pdfkit embeds the .woff files; the .woff2 ones crash at doc.end() (STACK.md). */
const FONT_DIR = join(require.resolve('@fontsource/inter/package.json'), '..', 'files');
const FONTS = {
  regular: 'inter-latin-400-normal.woff',
  semibold: 'inter-latin-600-normal.woff',
  bold: 'inter-latin-700-normal.woff',
};

const INK = '#1d2733';
const MUTED = '#5b6775';
const RULE = '#c9d1da';
const ACCENT = '#1f5f8b';
const WARN = '#b3261e';
const MARGIN = 48;
const PAGE_BOTTOM = 842 - 64;

/** The Inter latin subset has no Ω, ≤ or ≥: spell them so no glyph is lost. */
function printable(text: string): string {
  return text.replace(/Ω/g, 'ohm').replace(/≤/g, '<=').replace(/≥/g, '>=');
}

function q(value: number | null | undefined, unit: Parameters<typeof formatQuantity>[1], figures = 3): string {
  return value === null || value === undefined || !Number.isFinite(value)
    ? '—'
    : printable(formatQuantity(value, unit, figures));
}

function pct(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : `${value.toFixed(0)} %`;
}

function date(iso: string | Date): string {
  return (typeof iso === 'string' ? iso : iso.toISOString()).slice(0, 16).replace('T', ' ') + ' UTC';
}

function ensureRoom(doc: Doc, height: number): void {
  if (doc.y + height > PAGE_BOTTOM) doc.addPage();
}

function heading(doc: Doc, text: string): void {
  ensureRoom(doc, 60);
  doc.moveDown(0.8).font('semibold').fontSize(12).fillColor(ACCENT).text(text, MARGIN);
  const y = doc.y + 2;
  doc
    .moveTo(MARGIN, y)
    .lineTo(595 - MARGIN, y)
    .lineWidth(0.6)
    .strokeColor(RULE)
    .stroke();
  doc.y = y + 6;
  doc.font('regular').fontSize(9).fillColor(INK);
}

/** A table with fixed column widths; repeats the header after a page break. */
function table(doc: Doc, columns: { title: string; width: number }[], rows: string[][]): void {
  const rowHeight = 15;
  const drawHeader = () => {
    let x = MARGIN;
    const top = doc.y;
    doc.font('semibold').fontSize(8).fillColor(MUTED);
    for (const column of columns) {
      doc.text(column.title, x + 2, top, { width: column.width - 4, lineBreak: false });
      x += column.width;
    }
    doc.y = top + rowHeight - 2;
    doc.font('regular').fontSize(8.5).fillColor(INK);
  };
  ensureRoom(doc, rowHeight * 3);
  drawHeader();
  rows.forEach((row, index) => {
    if (doc.y + rowHeight > PAGE_BOTTOM) {
      doc.addPage();
      drawHeader();
    }
    const top = doc.y;
    if (index % 2 === 0)
      doc
        .rect(MARGIN, top - 3, 595 - 2 * MARGIN, rowHeight)
        .fill('#f1f4f7')
        .fillColor(INK);
    let x = MARGIN;
    row.forEach((cell, i) => {
      const width = columns[i]?.width ?? 60;
      doc.text(printable(cell), x + 2, top, { width: width - 4, lineBreak: false, ellipsis: true });
      x += width;
    });
    doc.y = top + rowHeight;
  });
  doc.x = MARGIN;
}

function keyValues(doc: Doc, pairs: [string, string][], labelWidth = 190): void {
  for (const [label, value] of pairs) {
    ensureRoom(doc, 14);
    const top = doc.y;
    doc
      .font('regular')
      .fontSize(9)
      .fillColor(MUTED)
      .text(label, MARGIN, top, { width: labelWidth - 8 });
    const afterLabel = doc.y;
    doc.fillColor(INK).text(printable(value), MARGIN + labelWidth, top, { width: 595 - 2 * MARGIN - labelWidth });
    doc.y = Math.max(afterLabel, doc.y) + 2;
  }
  doc.x = MARGIN;
}

function titleBlock(doc: Doc, c: SpecSheetContent): void {
  doc.font('bold').fontSize(18).fillColor(INK).text('Spec sheet', MARGIN, MARGIN);
  doc.font('semibold').fontSize(13).text(printable(c.designName));
  doc
    .font('regular')
    .fontSize(9)
    .fillColor(MUTED)
    .text(`${printable(c.projectName)} · Ladderwright`);
  doc.moveDown(0.6);
  const approvals = c.approvals.length
    ? c.approvals.map((a) => `${a.displayName}, ${date(a.at)}${a.note ? ` ("${a.note}")` : ''}`).join('\n')
    : 'none yet';
  keyValues(doc, [
    ['Revision', String(c.revisionNumber)],
    ['State', c.state],
    ['Author', c.authorName],
    ['Approved by', approvals],
    ...overrideRows(c),
    ['Released', c.releasedBy ? `${c.releasedBy.name}, ${date(c.releasedBy.at)}` : 'not released'],
    ['Generated', `${date(c.generatedAt)} (engine ${c.engineVersion})`],
  ]);
}

/** Every recorded gate override: the command, who, when, the reason and the gates it went past. */
function overrideRows(c: SpecSheetContent): [string, string][] {
  return c.overrides.map((override) => [
    `OVERRIDE (${override.command})`,
    `${override.actorName ?? 'unknown'}, ${date(override.at)}: "${override.reason}"\nPast: ${override.overridden
      .map((reason) => reason.message)
      .join('; ')}`,
  ]);
}

function windingSection(doc: Doc, c: SpecSheetContent): void {
  heading(doc, 'Transformer winding spec');
  const w = c.winding;
  if (w.kind === 'driver') {
    keyValues(doc, [
      ['Turns, primary / feedback / secondary', `${w.primaryTurns} / ${w.feedbackTurns} / ${w.secondaryTurns}`],
      ['Primary magnetizing inductance', q(w.primaryInductanceH, 'H')],
      ['Coupling coefficient k', w.couplingCoefficient.toFixed(3)],
      ['Primary saturation current, min', q(w.saturationCurrentA, 'A')],
      ['Secondary peak working voltage', q(w.secondaryPeakV, 'V')],
      ['Operating frequency (estimate)', q(w.frequencyHz, 'Hz')],
      [
        'Insulation, secondary to primary/feedback',
        w.insulationRatedV ? `rated ${q(w.insulationRatedV, 'V')} min` : 'rating to be stated by the supplier',
      ],
      ['Hipot test, secondary to primary/feedback', `${q(w.hipotTestV, 'V')} (${w.hipotMethod})`],
    ]);
  } else {
    keyValues(doc, [
      ['Secondary waveform', w.waveform],
      ['Secondary peak voltage', q(w.secondaryPeakV, 'V')],
      ['Frequency', q(w.frequencyHz, 'Hz')],
      [
        'Insulation requirement',
        `secondary-to-primary insulation rated for at least ${q(w.secondaryPeakV, 'V')} peak working voltage; hipot test voltage per the applicable standard`,
      ],
    ]);
  }
}

function marginOf(checks: CheckVerdict[], id: string): string {
  const check = checks.find((candidate) => candidate.id === id);
  return check ? `${check.verdict} ${pct(check.marginPct)}` : '—';
}

function bomSection(doc: Doc, c: SpecSheetContent): void {
  heading(doc, 'Multiplier BOM');
  const { document, report } = c;
  const capRows = document.multiplier.capacitors.map((cap, i) => {
    const stress = report.analysis.capacitors[i];
    return [
      `C${i + 1}`,
      cap.partCode ?? '—',
      q(cap.valueF, 'F'),
      `±${(cap.tolerance * 100).toFixed(0)} %`,
      q(cap.ratedVoltageV, 'V'),
      q(stress?.maxVoltageV, 'V'),
      marginOf(report.checks, STRESS_CHECK_IDS.capacitorVoltage(i + 1)),
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
    marginOf(report.checks, STRESS_CHECK_IDS.diodePiv(d.index)),
  ]);
  const columns = [
    { title: 'Ref', width: 38 },
    { title: 'Part code', width: 92 },
    { title: 'Value / rating', width: 78 },
    { title: 'Tolerance', width: 62 },
    { title: 'Rated', width: 62 },
    { title: 'Working', width: 70 },
    { title: 'Verdict, margin', width: 97 },
  ];
  table(doc, columns, capRows);
  doc.moveDown(0.5);
  table(
    doc,
    [
      { title: 'Ref', width: 38 },
      { title: 'Part code', width: 92 },
      { title: 'Rated PIV', width: 78 },
      { title: 'Rated current', width: 62 },
      { title: 'Working PIV', width: 62 },
      { title: 'Avg current', width: 70 },
      { title: 'Verdict, margin', width: 97 },
    ],
    diodeRows,
  );
  const bleeder = document.outputNetwork.bleeder;
  doc.moveDown(0.5);
  const resistorRows: string[][] = [];
  if (bleeder) {
    resistorRows.push([
      `R1–R${bleeder.count}`,
      bleeder.partCode ?? '—',
      `${bleeder.count} × ${q(bleeder.valueOhm, 'Ohm')}`,
      `${q(bleeder.ratedPowerW, 'W')}, ${q(bleeder.limitingVoltageV, 'V')}`,
      'bleeder string',
      '',
      // One verdict for the whole string; reports stored by older engines carry one per resistor.
      marginOf(
        report.checks,
        report.checks.some((c) => c.id === STRESS_CHECK_IDS.bleederVoltage)
          ? STRESS_CHECK_IDS.bleederVoltage
          : STRESS_CHECK_IDS.bleederVoltageFirstResistor,
      ),
    ]);
  }
  resistorRows.push([
    'Rs',
    '—',
    q(document.outputNetwork.seriesOutputResistanceOhm, 'Ohm'),
    '',
    'series output',
    '',
    '',
  ]);
  table(
    doc,
    [
      { title: 'Ref', width: 38 },
      { title: 'Part code', width: 92 },
      { title: 'Value', width: 78 },
      { title: 'Power, voltage', width: 100 },
      { title: 'Use', width: 72 },
      { title: '', width: 2 },
      { title: 'Verdict, margin', width: 117 },
    ],
    resistorRows,
  );
}

function performanceSection(doc: Doc, c: SpecSheetContent): void {
  heading(doc, 'Predicted performance and acceptance test limits');
  const { report, acceptance, document } = c;
  const loadA = report.analysis.loadCurrentA;
  table(
    doc,
    [
      { title: 'Quantity (at the rated load)', width: 170 },
      { title: 'Predicted', width: 110 },
      { title: 'Acceptance limit for the supplier test', width: 219 },
    ],
    [
      ['Load current', q(loadA, 'A'), 'test at this load'],
      [
        'Output, mean',
        q(report.outputMeanV, 'V', 4),
        `${q(acceptance.outputLowV, 'V', 4)} to ${q(acceptance.outputHighV, 'V', 4)}`,
      ],
      ['Ripple, peak-to-peak', q(report.ripplePeakToPeakV, 'V'), `max ${q(acceptance.rippleMaxV, 'V')}`],
      ['No-load output', q(report.noLoadOutputV, 'V', 4), 'for information'],
      ['Output impedance', q(report.outputImpedanceOhm, 'Ohm'), 'for information'],
      ['Target output', q(document.targets.outputV, 'V', 4), 'design target'],
    ],
  );
  doc
    .moveDown(0.3)
    .fontSize(8)
    .text(
      `Output window: the predicted spread over the stated capacitor tolerances at ${(acceptance.coverage * 100).toFixed(0)} % coverage ` +
        `(mean ± k standard deviations, k = ${acceptance.coverageFactor}, JCGM 100:2008 Table G.1), plus a bench allowance of ` +
        `${(acceptance.benchAllowanceFraction * 100).toFixed(1)} % of the target` +
        `${acceptance.isStretchedToTarget ? ', stretched to contain the design target' : ''}.`,
      MARGIN,
    )
    .fontSize(9);
  if (acceptance.isPredictionBelowTarget) {
    doc
      .moveDown(0.3)
      .font('semibold')
      .fillColor(WARN)
      .text('The prediction misses a design target; agree the limits before the build.', MARGIN);
    doc.font('regular').fillColor(INK);
  }
}

/** Output vs load current as vector paths, with the acceptance window and the rated load marked. */
function outputVsLoadPlot(doc: Doc, c: SpecSheetContent): void {
  const points = c.report.curves.regulation.map((p) => ({ x: p.x, y: Math.abs(p.y) }));
  if (points.length < 2) return;
  const sweeps = loadSweeps(c);
  // Heading, plot, axis labels and caption move to a new page together.
  ensureRoom(doc, 270);
  heading(doc, sweeps.length > 0 ? 'Output vs load (predicted, bench points marked)' : 'Output vs load (predicted)');
  const left = MARGIN + 56;
  const top = doc.y + 6;
  const width = 595 - 2 * MARGIN - 72;
  const height = 160;
  const measured = sweeps.flatMap((run) => run.points.map((p) => ({ x: p.x, y: Math.abs(p.y) })));
  // A loop, not Math.max(...points): a spread of tens of thousands of bench points overflows the stack.
  let largestX = -Infinity;
  let largestY = Math.abs(c.acceptance.outputHighV);
  for (const series of [points, measured]) {
    for (const p of series) {
      if (p.x > largestX) largestX = p.x;
      if (p.y > largestY) largestY = p.y;
    }
  }
  const maxX = largestX || 1;
  const maxY = largestY * 1.05 || 1;
  const sx = (x: number) => left + (x / maxX) * width;
  const sy = (y: number) => top + height - (y / maxY) * height;

  doc.save();
  const low = Math.abs(c.acceptance.outputLowV);
  const high = Math.abs(c.acceptance.outputHighV);
  doc
    .rect(left, sy(high), width, sy(low) - sy(high))
    .fillOpacity(0.12)
    .fill(ACCENT)
    .fillOpacity(1);
  doc.lineWidth(0.5).strokeColor(RULE);
  for (let i = 0; i <= 4; i++) {
    const y = top + (height * i) / 4;
    doc
      .moveTo(left, y)
      .lineTo(left + width, y)
      .stroke();
    doc
      .font('regular')
      .fontSize(7)
      .fillColor(MUTED)
      .text(q((maxY * (4 - i)) / 4, 'V'), left - 54, y - 4, { width: 50, align: 'right' });
  }
  for (let i = 0; i <= 4; i++) {
    const x = left + (width * i) / 4;
    doc
      .moveTo(x, top)
      .lineTo(x, top + height)
      .stroke();
    doc.text(q((maxX * i) / 4, 'A'), x - 25, top + height + 4, { width: 50, align: 'center' });
  }
  doc.rect(left, top, width, height).lineWidth(0.8).strokeColor(INK).stroke();
  const [first, ...rest] = points;
  if (first) {
    doc.moveTo(sx(first.x), sy(first.y));
    for (const p of rest) doc.lineTo(sx(p.x), sy(p.y));
    doc.lineWidth(1.6).strokeColor(ACCENT).stroke();
  }
  sweeps.forEach((run, index) => {
    for (const p of run.points) {
      if (p.x >= 0 && p.x <= maxX) benchMarker(doc, index, sx(p.x), sy(Math.abs(p.y)));
    }
  });
  const loadA = c.report.analysis.loadCurrentA;
  if (loadA > 0 && loadA <= maxX) {
    doc
      .moveTo(sx(loadA), top)
      .lineTo(sx(loadA), top + height)
      .dash(3, { space: 2 })
      .lineWidth(0.8)
      .strokeColor(WARN)
      .stroke()
      .undash();
    doc
      .fontSize(7)
      .fillColor(WARN)
      .text('rated load', sx(loadA) + 3, top + 3, { lineBreak: false });
  }
  doc.restore();
  doc.y = top + height + 18;
  doc.x = MARGIN;
  doc
    .font('regular')
    .fontSize(8)
    .fillColor(MUTED)
    .text(
      'Shaded band: acceptance window for the output. Load current on the horizontal axis, output magnitude on the vertical.',
      MARGIN,
    );
  if (sweeps.length > 0) {
    doc.moveDown(0.3);
    const top = doc.y;
    doc.text('Markers: measured points of the load-sweep bench runs,', MARGIN, top, { lineBreak: false });
    let x = MARGIN + doc.widthOfString('Markers: measured points of the load-sweep bench runs,') + 8;
    sweeps.forEach((run, index) => {
      benchMarker(doc, index, x + 3, top + 4.5);
      const label = `run ${run.runNumber}`;
      doc.fillColor(MUTED).text(label, x + 10, top, { lineBreak: false });
      x += 10 + doc.widthOfString(label) + 10;
    });
    doc.y = top + 12;
    doc.x = MARGIN;
  }
  doc.fillColor(INK);
}

const MARKER_COLOURS = ['#c25400', '#2e7d32', '#6a1b9a'];

/** A small vector marker per run: circle, square, triangle in turn, so runs read apart without colour. */
function benchMarker(doc: Doc, index: number, x: number, y: number): void {
  const r = 2.4;
  const colour = MARKER_COLOURS[index % MARKER_COLOURS.length] ?? INK;
  doc.save().lineWidth(0.9).strokeColor(colour).fillColor('#ffffff');
  const shape = index % 3;
  if (shape === 0) doc.circle(x, y, r);
  else if (shape === 1) doc.rect(x - r, y - r, 2 * r, 2 * r);
  else doc.polygon([x, y - r - 0.4], [x + r + 0.4, y + r], [x - r - 0.4, y + r]);
  doc.fillAndStroke('#ffffff', colour).restore();
}

/** Load-sweep runs with their number in the Bench runs table (1 = newest). */
function loadSweeps(c: SpecSheetContent): { runNumber: number; points: { x: number; y: number }[] }[] {
  return c.benchRuns
    .map((run, i) => ({ run, runNumber: i + 1 }))
    .filter(({ run }) => run.kind === 'load-sweep' && run.points.length > 0)
    .map(({ run, runNumber }) => ({ runNumber, points: run.points }));
}

const BENCH_KIND_LABEL = { 'load-sweep': 'load sweep', 'scope-capture': 'scope capture' } as const;

/** Each live bench run of the revision: data file and its hash, who uploaded it, and the verdict with margin. */
function benchRunsSection(doc: Doc, c: SpecSheetContent): void {
  ensureRoom(doc, 100);
  heading(doc, 'Bench runs');
  if (c.benchRuns.length === 0) {
    doc.font('regular').fontSize(9).fillColor(MUTED).text('No bench runs were recorded for this revision.', MARGIN);
    doc.fillColor(INK);
    return;
  }
  const rows = c.benchRuns.map((run, i) => {
    const data = run.files.find((file) => file.role === 'data');
    return [
      String(i + 1),
      BENCH_KIND_LABEL[run.kind],
      data?.originalName ?? '—',
      data ? data.sha256.slice(0, 12) : '—',
      `±${(run.tolerance * 100).toFixed(1)} %`,
      `${(run.worstDeviation * 100).toFixed(1)} %`,
      `${run.verdict} · ${pct(run.marginPct)}`,
    ];
  });
  table(
    doc,
    [
      { title: 'Run', width: 26 },
      { title: 'Kind', width: 70 },
      { title: 'Data file', width: 130 },
      { title: 'SHA-256 (first 12)', width: 82 },
      { title: 'Tolerance', width: 52 },
      { title: 'Worst deviation', width: 66 },
      { title: 'Verdict, margin', width: 73 },
    ],
    rows,
  );
  doc.moveDown(0.4);
  c.benchRuns.forEach((run, i) => {
    ensureRoom(doc, 14);
    const title = run.title ? `${run.title}: ` : '';
    const photos = run.files.filter((file) => file.role === 'photo').length;
    doc
      .font('regular')
      .fontSize(8)
      .fillColor(MUTED)
      .text(
        printable(
          `Run ${i + 1}. ${title}uploaded by ${run.uploadedByName || 'unknown'}, ${date(run.createdAt)}; ${run.pointCount} point${run.pointCount === 1 ? '' : 's'}${photos ? `, ${photos} photo${photos === 1 ? '' : 's'}` : ''}.`,
        ),
        MARGIN,
        doc.y,
        { width: 595 - 2 * MARGIN },
      );
  });
  doc.moveDown(0.3);
  doc
    .fontSize(8)
    .fillColor(MUTED)
    .text(
      'Deviation = (measured − predicted) / predicted; margin = (tolerance − worst deviation) / tolerance.',
      MARGIN,
    );
  doc.fillColor(INK);
}

function safetySection(doc: Doc, c: SpecSheetContent): void {
  heading(doc, 'Stored energy, discharge and safety');
  const { report, document } = c;
  keyValues(doc, [
    ['Stored energy, all capacitors', q(report.storedEnergyJ, 'J')],
    ['Stored charge, all capacitors', q(report.storedChargeC, 'C')],
    [
      `Bleeder discharge to ${q(document.targets.safeVoltageV, 'V')}`,
      report.dischargeTimeS === null ? 'no discharge path: fit a bleeder' : q(report.dischargeTimeS, 's'),
    ],
    [
      'Discharge rule',
      typeof document.targets.dischargeRule === 'string'
        ? document.targets.dischargeRule
        : `${q(document.targets.dischargeRule.voltageV, 'V')} within ${q(document.targets.dischargeRule.timeS, 's')}`,
    ],
  ]);
  const failing = report.checks.filter((check) => check.verdict !== 'pass');
  if (failing.length > 0) {
    doc.moveDown(0.3);
    table(
      doc,
      [
        { title: 'Check not passing', width: 200 },
        { title: 'Verdict', width: 70 },
        { title: 'Margin', width: 70 },
        { title: 'Value / limit', width: 159 },
      ],
      failing.map((check) => [
        check.subject,
        check.verdict,
        pct(check.marginPct),
        `${q(check.value, check.unit as 'V')} / ${q(check.limit, check.unit as 'V')}`,
      ]),
    );
  }
  ensureRoom(doc, 70);
  doc.moveDown(0.6);
  const top = doc.y;
  doc
    .rect(MARGIN, top, 595 - 2 * MARGIN, 52)
    .lineWidth(1.2)
    .strokeColor(WARN)
    .stroke();
  doc
    .font('bold')
    .fontSize(10)
    .fillColor(WARN)
    .text('HIGH VOLTAGE CAN KILL', MARGIN + 10, top + 8);
  doc
    .font('regular')
    .fontSize(8.5)
    .fillColor(INK)
    .text(
      'These figures are design predictions. The standard that applies to the equipment, local codes and licensed practice govern every build and test. Discharge the output and every ladder node before touching the assembly.',
      MARGIN + 10,
      doc.y + 2,
      { width: 595 - 2 * MARGIN - 20 },
    );
  doc.y = top + 60;
  doc.x = MARGIN;
}

/** Marks and footers on every page, drawn last over the buffered pages. */
function decoratePages(doc: Doc, c: SpecSheetContent): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const previousBottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    if (!c.isReleased) {
      doc.save();
      doc.rotate(-35, { origin: [297, 421] });
      doc
        .font('bold')
        .fontSize(64)
        .fillColor(WARN)
        .fillOpacity(0.14)
        .text('NOT RELEASED', 40, 390, { width: 515, align: 'center', lineBreak: false });
      doc.restore();
      doc.save();
      doc.rect(0, 0, 595, 18).fill(WARN);
      doc
        .font('bold')
        .fontSize(8.5)
        .fillColor('#ffffff')
        .text(`NOT RELEASED: ${c.state} revision, not for manufacture`, 0, 5, {
          width: 595,
          align: 'center',
          lineBreak: false,
        });
      doc.restore();
    }
    doc.font('regular').fontSize(7).fillColor(MUTED).fillOpacity(1);
    doc.text(
      printable(
        `${c.designName} · revision ${c.revisionNumber} (${c.state}) · page ${i - range.start + 1} of ${range.count} · High voltage can kill: the standard, local codes and licensed practice govern.`,
      ),
      MARGIN,
      842 - 36,
      { width: 595 - 2 * MARGIN, align: 'center', lineBreak: false },
    );
    doc.page.margins.bottom = previousBottom;
  }
}

/** Renders the supplier spec sheet (A4 PDF, Inter embedded, vector plot). */
export async function renderSpecSheetPdf(c: SpecSheetContent): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: MARGIN, bottom: 56, left: MARGIN, right: MARGIN },
    bufferPages: true,
    info: {
      Title: `Spec sheet: ${c.designName}, revision ${c.revisionNumber}`,
      Author: 'Ladderwright',
      Subject: c.isReleased ? 'Released revision' : 'NOT RELEASED',
    },
  });
  doc.registerFont('regular', join(FONT_DIR, FONTS.regular));
  doc.registerFont('semibold', join(FONT_DIR, FONTS.semibold));
  doc.registerFont('bold', join(FONT_DIR, FONTS.bold));
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.font('regular');
  titleBlock(doc, c);
  windingSection(doc, c);
  bomSection(doc, c);
  performanceSection(doc, c);
  schematicSection(doc, c, MARGIN, 595 - 2 * MARGIN, PAGE_BOTTOM);
  outputVsLoadPlot(doc, c);
  benchRunsSection(doc, c);
  safetySection(doc, c);
  decoratePages(doc, c);
  doc.end();
  return done;
}
