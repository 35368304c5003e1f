import { simulationSourceLabel } from '@ladderwright/shared/analysis';
import { documentFieldLabel, resultFieldLabel } from '@ladderwright/shared/designs';
import type { SpecSheetContent } from './spec-sheet.types';
import {
  type Doc,
  date,
  heading,
  INK,
  MUTED,
  keyValues,
  MARGIN,
  note,
  q,
  table,
  TEXT_WIDTH,
  WARN,
} from './spec-sheet-layout';

const TRANSFORMER = 'drive.driver.transformer';
const label = (path: string): string => documentFieldLabel(path).label;

export function titleBlock(doc: Doc, c: SpecSheetContent): void {
  doc.font('bold').fontSize(18).fillColor(INK).text('Spec sheet', MARGIN, MARGIN);
  doc.font('semibold').fontSize(13).text(c.designName);
  doc.font('regular').fontSize(9).fillColor(MUTED).text(`${c.projectName} · Ladderwright`);
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
    ['Figures', figuresLine(c)],
  ]);
}

/** Where the headline figures come from: the stored simulation of this revision, or the estimate. */
function figuresLine(c: SpecSheetContent): string {
  const { headline } = c;
  if (headline.source === 'estimate') return 'estimate (instant analysis); no current full simulation of this revision';
  const names = headline.simulatedKeys.join(', ');
  return `${simulationSourceLabel(headline)} (${names}), run ${headline.simulatedAt ? date(headline.simulatedAt) : ''} on this document with engine ${c.engineVersion}; the rest estimate`;
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

export function windingSection(doc: Doc, c: SpecSheetContent): void {
  heading(doc, 'Transformer winding spec');
  const w = c.winding;
  if (w.kind === 'driver') {
    const frequencySource = c.headline.differences.some((entry) => entry.key === 'frequency')
      ? 'simulation'
      : 'estimate';
    const frequency =
      frequencySource === 'simulation'
        ? (c.headline.differences.find((entry) => entry.key === 'frequency')?.simulation ?? w.frequencyHz)
        : w.frequencyHz;
    keyValues(doc, [
      [
        `${label(`${TRANSFORMER}.primaryTurns`)} / feedback / secondary`,
        `${w.primaryTurns} / ${w.feedbackTurns} / ${w.secondaryTurns}`,
      ],
      [label(`${TRANSFORMER}.primaryInductanceH`), q(w.primaryInductanceH, 'H')],
      [label(`${TRANSFORMER}.couplingCoefficient`), w.couplingCoefficient.toFixed(3)],
      [`${label(`${TRANSFORMER}.saturationCurrentA`)}, min`, q(w.saturationCurrentA, 'A')],
      ['Secondary peak working voltage', q(w.secondaryPeakV, 'V')],
      [
        `Operating frequency (${frequencySource === 'simulation' ? simulationSourceLabel(c.headline) : 'estimate'})`,
        frequencySource === 'simulation' && c.headline.isOscillationIrregular
          ? `${q(frequency, 'Hz')}, mean of irregular cycles (bursts)`
          : q(frequency, 'Hz'),
      ],
      [
        `${label(`${TRANSFORMER}.insulation.ratedVoltageV`)}, to primary/feedback`,
        w.insulationRatedV ? `rated ${q(w.insulationRatedV, 'V')} min` : 'rating to be stated by the supplier',
      ],
      ['Hipot test, secondary to primary/feedback', `${q(w.hipotTestV, 'V')} (${w.hipotMethod})`],
    ]);
  } else {
    keyValues(doc, [
      ['Secondary waveform', w.waveform],
      [label('drive.peakV'), q(w.secondaryPeakV, 'V')],
      [label('drive.frequencyHz'), q(w.frequencyHz, 'Hz')],
      [
        'Insulation requirement',
        `secondary-to-primary insulation rated for at least ${q(w.secondaryPeakV, 'V')} peak working voltage; hipot test voltage per the applicable standard`,
      ],
    ]);
  }
}

/** "from simulation" or "estimate" after a figure, as the Workbench marks it. */
function sourceOf(c: SpecSheetContent, key: 'output' | 'ripple'): string {
  return c.headline.simulatedKeys.includes(key) ? simulationSourceLabel(c.headline) : 'estimate';
}

export function performanceSection(doc: Doc, c: SpecSheetContent): void {
  heading(doc, 'Predicted performance and acceptance test limits');
  const { acceptance, document } = c;
  const report = c.headline.report;
  table(
    doc,
    [
      { title: 'Quantity (at the rated load)', width: 150 },
      { title: 'Predicted', width: 75 },
      { title: 'Source', width: 75 },
      { title: 'Acceptance limit for the supplier test', width: 199 },
    ],
    [
      [label('targets.loadCurrentA'), q(report.analysis.loadCurrentA, 'A'), 'design', 'test at this load'],
      [
        resultFieldLabel('outputMeanV').label,
        q(report.outputMeanV, 'V', 4),
        sourceOf(c, 'output'),
        `${q(acceptance.outputLowV, 'V', 4)} to ${q(acceptance.outputHighV, 'V', 4)}`,
      ],
      [
        resultFieldLabel('ripplePeakToPeakV').label,
        q(report.ripplePeakToPeakV, 'V'),
        sourceOf(c, 'ripple'),
        `max ${q(acceptance.rippleMaxV, 'V')}`,
      ],
      [resultFieldLabel('noLoadOutputV').label, q(report.noLoadOutputV, 'V', 4), 'estimate', 'for information'],
      [
        resultFieldLabel('outputImpedanceOhm').label,
        q(report.outputImpedanceOhm, 'Ohm'),
        'estimate',
        'for information',
      ],
      [label('targets.outputV'), q(document.targets.outputV, 'V', 4), 'design', 'design target'],
    ],
  );
  doc.moveDown(0.3);
  note(
    doc,
    `Output window: the predicted spread over the stated capacitor tolerances at ${(acceptance.coverage * 100).toFixed(0)} % coverage ` +
      `(mean ± k standard deviations, k = ${acceptance.coverageFactor}, JCGM 100:2008 Table G.1), plus a bench allowance of ` +
      `${(acceptance.benchAllowanceFraction * 100).toFixed(1)} % of the target` +
      `${acceptance.isStretchedToTarget ? ', stretched to contain the design target' : ''}.`,
  );
  differencesNote(doc, c);
  if (acceptance.isPredictionBelowTarget) {
    doc.moveDown(0.3);
    doc
      .font('semibold')
      .fillColor(WARN)
      .text('The prediction misses a design target; agree the limits before the build.', MARGIN);
    doc.font('regular').fillColor(INK);
  }
}

/** Where estimate and simulation both speak, their difference, in words; beyond the estimate's tolerance in red. */
function differencesNote(doc: Doc, c: SpecSheetContent): void {
  const differences = c.headline.differences;
  if (differences.length === 0) return;
  doc.moveDown(0.3);
  doc.font('semibold').fontSize(8).fillColor(INK).text('Estimate against the simulation', MARGIN, doc.y, {
    width: TEXT_WIDTH,
  });
  for (const entry of differences) {
    note(doc, `${entry.label}: ${entry.text}.`, entry.exceedsTolerance ? WARN : MUTED);
  }
}
