import { roundStep } from '@ladderwright/shared/units';
import type { SpecSheetContent } from './spec-sheet.types';
import {
  ACCENT,
  type Doc,
  ensureRoom,
  heading,
  INK,
  MARGIN,
  MUTED,
  PAGE_WIDTH,
  q,
  RULE,
  WARN,
} from './spec-sheet-layout';

/** Grid divisions of each axis of the output-vs-load plot. */
const AXIS_DIVISIONS = 4;

/**
 * The end of an axis from 0 that holds `largest` in `divisions` equal steps of 1, 2, 2.5 or 5 × 10^n, so every grid
 * line carries a round figure (4 kV in 1 kV steps, not 3.78 kV in 945 V steps).
 */
export function roundedAxisEnd(largest: number, divisions: number): number {
  return roundStep(largest, divisions) * divisions;
}

/**
 * The predicted output magnitude against load current: with a driver, the supply's own curve (driver and ladder
 * solved together at each load, as the Workbench draws it); else the ladder's regulation at its fixed drive.
 */
export function predictedLoadCurve(report: SpecSheetContent['report']): { x: number; y: number }[] {
  const driver = report.driver;
  if (driver) return driver.operatingPoint.curve.map((p) => ({ x: p.loadCurrentA, y: Math.abs(p.outputV) }));
  return report.curves.regulation.map((p) => ({ x: p.x, y: Math.abs(p.y) }));
}

/** Output vs load current as vector paths, with the acceptance window and the rated load marked. */
export function outputVsLoadPlot(doc: Doc, c: SpecSheetContent): void {
  const points = predictedLoadCurve(c.report);
  if (points.length < 2) return;
  const sweeps = loadSweeps(c);
  // Heading, plot, axis labels and caption move to a new page together.
  ensureRoom(doc, 270);
  heading(doc, sweeps.length > 0 ? 'Output vs load (predicted, bench points marked)' : 'Output vs load (predicted)');
  const left = MARGIN + 56;
  const top = doc.y + 6;
  const width = PAGE_WIDTH - 2 * MARGIN - 72;
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
  const maxX = roundedAxisEnd(largestX || 1, AXIS_DIVISIONS);
  const maxY = roundedAxisEnd(largestY * 1.05 || 1, AXIS_DIVISIONS);
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
  for (let i = 0; i <= AXIS_DIVISIONS; i++) {
    const y = top + (height * i) / AXIS_DIVISIONS;
    doc
      .moveTo(left, y)
      .lineTo(left + width, y)
      .stroke();
    doc
      .font('regular')
      .fontSize(7)
      .fillColor(MUTED)
      .text(q((maxY * (AXIS_DIVISIONS - i)) / AXIS_DIVISIONS, 'V'), left - 54, y - 4, { width: 50, align: 'right' });
  }
  for (let i = 0; i <= AXIS_DIVISIONS; i++) {
    const x = left + (width * i) / AXIS_DIVISIONS;
    doc
      .moveTo(x, top)
      .lineTo(x, top + height)
      .stroke();
    doc.text(q((maxX * i) / AXIS_DIVISIONS, 'A'), x - 25, top + height + 4, { width: 50, align: 'center' });
  }
  doc.rect(left, top, width, height).lineWidth(0.8).strokeColor(INK).stroke();
  const [first, ...rest] = points;
  if (first) {
    doc.moveTo(sx(first.x), sy(first.y));
    for (const p of rest) doc.lineTo(sx(p.x), sy(p.y));
    doc.lineWidth(1.6).strokeColor(ACCENT).stroke();
  }
  sweeps.forEach((run, index) => {
    // One marker per half point of the page: markers closer than that print as one, and a run of tens of
    // thousands of points would otherwise cost seconds of drawing and megabytes of PDF for nothing visible.
    const drawn = new Set<string>();
    for (const p of run.points) {
      if (p.x < 0 || p.x > maxX) continue;
      const x = sx(p.x);
      const y = sy(Math.abs(p.y));
      const spot = `${Math.round(x * 2)},${Math.round(y * 2)}`;
      if (drawn.has(spot)) continue;
      drawn.add(spot);
      benchMarker(doc, index, x, y);
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
export function benchMarker(doc: Doc, index: number, x: number, y: number): void {
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
