import { fittedParameterText } from '@ladderwright/shared/api';
import type { SpecSheetContent } from './spec-sheet.types';
import {
  date,
  type Doc,
  ensureRoom,
  heading,
  INK,
  MARGIN,
  MUTED,
  pct,
  printable,
  table,
  TEXT_WIDTH,
} from './spec-sheet-layout';

const BENCH_KIND_LABEL = { 'load-sweep': 'load sweep', 'scope-capture': 'scope capture' } as const;

/** Each live bench run of the revision: data file and its hash, who uploaded it, and the verdict with margin. */
export function benchRunsSection(doc: Doc, c: SpecSheetContent): void {
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
        { width: TEXT_WIDTH },
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
  calibrationLines(doc, c);
}

/** One line per finished calibration: when, against which runs, each fitted value with its interval and its method. */
function calibrationLines(doc: Doc, c: SpecSheetContent): void {
  for (const calibration of c.calibrations ?? []) {
    const result = calibration.result;
    if (!result) continue;
    const values = result.parameters.map(fittedParameterText).join('; ');
    const runs = calibration.input.runs.map((run) => run.label).join(', ');
    const warning = result.warnings.length > 0 ? ' Identifiability warning.' : '';
    ensureRoom(doc, 14);
    doc
      .font('regular')
      .fontSize(8)
      .fillColor(MUTED)
      .text(
        printable(
          `Calibration ${date(calibration.createdAt)} against ${runs}, ${(result.confidence * 100).toFixed(0)} % intervals: ${values}.${warning}`,
        ),
        MARGIN,
        doc.y,
        { width: TEXT_WIDTH },
      );
  }
  doc.fillColor(INK);
}
