import { documentFieldLabel, resultFieldLabel } from '@ladderwright/shared/designs';
import type { WindingResult } from '@ladderwright/shared/transformer';
import { checksSection } from './spec-sheet-checks';
import { type Doc, date, heading, INK, keyValues, MARGIN, MUTED, note, printable, q, table } from './spec-sheet-layout';
import { cautionBox } from './spec-sheet-safety';
import { markSheetPages, openSheetDocument } from './sheet-document';
import { windingDrawing } from './transformer-sheet-drawing';
import type { TransformerSheetContent } from './transformer-sheet.types';

/** Maximum leakage the sheet asks for: the geometric estimate plus this share (common practice, no source). */
export const LEAKAGE_ALLOWANCE = 0.5;
/** Maximum DC resistance over the nominal at 20 °C: wire diameter and turn-length tolerances (common practice, no source). */
export const RESISTANCE_ALLOWANCE = 0.15;

const SECTION = 'drive.driver.transformerDesign';
const label = (path: string) => documentFieldLabel(`${SECTION}.${path}`).label;
const result = (key: string) => resultFieldLabel(`transformer.${key}`).label;
const mm = (valueM: number | undefined) => (valueM === undefined ? '—' : `${Number((valueM * 1e3).toPrecision(3))} mm`);
const mm2 = (valueM2: number) => `${Number((valueM2 * 1e6).toPrecision(3))} mm²`;
const mT = (valueT: number) => `${Number((valueT * 1e3).toPrecision(3))} mT`;
/** Resistance in plain ohms: the embedded font has no Ω, and "mohm" would read as megohm to some. */
const ohms = (valueOhm: number) => `${Number(valueOhm.toPrecision(3))} ohm`;
const tolerancePct = (c: TransformerSheetContent) =>
  `±${Number(((c.section.inductanceTolerance ?? 0.1) * 100).toFixed(1))} %`;

function pinsOf(c: TransformerSheetContent, role: WindingResult['role']): string {
  const winding = c.section.windings.find((w) => w.role === role);
  return winding ? `${winding.startPin}–${winding.endPin}` : '—';
}

function titleBlock(doc: Doc, c: TransformerSheetContent): void {
  doc.font('bold').fontSize(18).fillColor(INK).text('Transformer sheet', MARGIN, MARGIN);
  doc.font('semibold').fontSize(13).text(printable(c.designName));
  doc
    .font('regular')
    .fontSize(9)
    .fillColor(MUTED)
    .text(printable(`${c.projectName} · Ladderwright`));
  doc.moveDown(0.6);
  const approvals = c.approvals.length
    ? c.approvals.map((a) => `${a.displayName}, ${date(a.at)}`).join('\n')
    : 'none yet';
  keyValues(doc, [
    ['Revision', String(c.revisionNumber)],
    ['State', c.state],
    ['Author', c.authorName],
    ['Approved by', approvals],
    ['Released', c.releasedBy ? `${c.releasedBy.name}, ${date(c.releasedBy.at)}` : 'not released'],
    ['Generated', `${date(c.generatedAt)} (engine ${c.engineVersion})`],
    [
      'Operating point',
      `${q(c.frequencyHz, 'Hz')}, secondary working voltage ${q(c.secondaryWorkingPeakV, 'V')} peak, at the rated load`,
    ],
  ]);
}

function scheduleSection(doc: Doc, c: TransformerSheetContent): void {
  heading(doc, 'Windings');
  windingDrawing(doc, c.section);
  doc.moveDown(0.6);
  doc.font('semibold').fontSize(9.5).fillColor(INK).text('Winding schedule, from the core outward', MARGIN);
  doc.moveDown(0.3);
  const { section, report } = c;
  const layerTape = section.layerTape;
  table(
    doc,
    [
      { title: 'Order', width: 30 },
      { title: 'Winding', width: 58 },
      { title: 'Pins', width: 56 },
      { title: 'Turns', width: 34 },
      { title: 'Wire', width: 112 },
      { title: 'Ø copper / overall', width: 88 },
      { title: 'Layers', width: 50 },
      { title: 'Layer tape', width: 71 },
    ],
    section.windings.map((winding, index) => {
      const figures = report.windings.find((w) => w.role === winding.role);
      const wraps = winding.layerTapeWraps ?? 0;
      return [
        String(index + 1),
        winding.name ?? winding.role,
        `${winding.startPin} (dot)–${winding.endPin}`,
        String(winding.turns),
        winding.wire.code,
        `${mm(winding.wire.copperDiameterM)} / ${mm(winding.wire.overallDiameterM)}`,
        figures ? `${figures.layers} × ${figures.turnsPerLayer} t` : '—',
        wraps > 0 && layerTape ? `${wraps} wrap${wraps === 1 ? '' : 's'}` : 'none',
      ];
    }),
  );
  doc.moveDown(0.3);
  keyValues(doc, [
    ...(layerTape ? [['Layer tape', `${layerTape.code} (${mm(layerTape.thicknessM)})`] as [string, string]] : []),
    [
      'Between adjacent windings',
      `${section.windingTape.code} (${mm(section.windingTape.thicknessM)}) × ${section.windingTapeWraps} wraps`,
    ],
    [label('endMarginM'), `${mm(section.endMarginM ?? 0)} at each end of every winding`],
  ]);
}

function electricalSection(doc: Doc, c: TransformerSheetContent): void {
  heading(doc, 'Electrical requirements (test at 20 °C)');
  const { report } = c;
  const tolerance = tolerancePct(c);
  const primaryPins = pinsOf(c, 'primary');
  const rows: string[][] = report.windings.map((w) => [
    `${w.name} inductance`,
    pinsOf(c, w.role),
    q(w.inductanceH, 'H'),
    tolerance,
    'other windings open, low level',
  ]);
  rows.push([
    'Leakage inductance',
    primaryPins,
    q(report.leakagePrimarySecondaryH, 'H'),
    `max ${q(report.leakagePrimarySecondaryH * (1 + LEAKAGE_ALLOWANCE), 'H')}`,
    'at the primary with the secondary shorted',
  ]);
  for (const w of report.windings) {
    rows.push([
      `${w.name} DC resistance`,
      pinsOf(c, w.role),
      ohms(w.dcResistanceOhm),
      `max ${ohms(w.dcResistanceOhm * (1 + RESISTANCE_ALLOWANCE))}`,
      'at 20 °C',
    ]);
  }
  const turns = (role: WindingResult['role']) => report.windings.find((w) => w.role === role)?.turns ?? Number.NaN;
  rows.push([
    'Turns ratio secondary : primary',
    `${pinsOf(c, 'secondary')} : ${primaryPins}`,
    `${turns('secondary')} : ${turns('primary')}`,
    'exact turns',
    'by turns count or voltage ratio',
  ]);
  table(
    doc,
    [
      { title: 'Parameter', width: 132 },
      { title: 'Pins', width: 52 },
      { title: 'Nominal', width: 62 },
      { title: 'Tolerance, limit', width: 80 },
      { title: 'Condition', width: 173 },
    ],
    rows,
  );
  note(
    doc,
    `Measure inductances at a low level well below saturation (e.g. 10 kHz, 0.1 V). Maximum leakage is the estimate from the winding geometry plus ${LEAKAGE_ALLOWANCE * 100} %; maximum DC resistance is the nominal plus ${RESISTANCE_ALLOWANCE * 100} % (wire and turn-length tolerances). Both allowances are common practice, no source. Primary inductance is commonly specified to ±10 % to ±15 % (Power Integrations AN-18, Transformer Gapping). The secondary's self-capacitance is about ${q(report.secondaryCapacitanceF, 'F')} (estimate, for information).`,
  );
}

function coreSection(doc: Doc, c: TransformerSheetContent): void {
  heading(doc, 'Core and gap');
  const { core } = c.section;
  const { report } = c;
  keyValues(doc, [
    [label('core'), core.code],
    [
      'Ae, le, Ve',
      `${mm2(core.effectiveAreaM2)}, ${mm(core.pathLengthM)}, ${Number((core.volumeM3 * 1e9).toPrecision(4))} mm³`,
    ],
    [label('core.ungappedAlHPerTurn2'), `${q(core.ungappedAlHPerTurn2, 'H')} per turn²`],
    [
      `${result('gap.gapM')} (total in the magnetic path)`,
      report.gap.gapM === 0
        ? 'none (ungapped)'
        : `${q(report.gap.gapM, 'm')}: a centre-leg gap, or spacers of half this (the path crosses them twice)`,
    ],
    [
      result('gap.alHPerTurn2'),
      `${q(report.gap.alHPerTurn2, 'H')} per turn² ${tolerancePct(c)}; set the gap to meet it`,
    ],
    [label('core.saturationFluxDensity100T'), mT(core.saturationFluxDensity100T)],
    [
      result('peakFluxDensityT'),
      `${mT(report.peakFluxDensityT)} at the rated load, ${Number(report.saturationMarginPct.toPrecision(3))} % below Bsat at 100 °C`,
    ],
    [
      'Losses',
      `core ${q(report.coreLossW, 'W')}, copper ${q(report.copperLossW, 'W')}, temperature rise about ${Number(report.temperatureRiseC.toPrecision(2))} °C`,
    ],
  ]);
}

function insulationSection(doc: Doc, c: TransformerSheetContent): void {
  heading(doc, 'Insulation and hipot');
  const { report, section } = c;
  keyValues(doc, [
    [
      result('hipotTestVoltageV'),
      `${q(report.hipotTestVoltageV, 'V')} between the secondary and the primary, feedback and core tied together, for 60 s, no breakdown (2·U + 1000 V, U the peak working voltage; common practice, no source)`,
    ],
    [
      result('windingInsulationV'),
      `${q(report.windingInsulationV, 'V')} (${section.windingTape.code} × ${section.windingTapeWraps})`,
    ],
    [
      result('flangeCreepageM'),
      `${mm(report.flangeCreepageM)} provided, ${mm(report.requiredCreepageM)} required (IEC 60664-1 from the working voltage)`,
    ],
  ]);
  doc.moveDown(0.3);
  table(
    doc,
    [
      { title: 'Winding', width: 80 },
      { title: 'Turn to turn', width: 70 },
      { title: 'Layer end to end', width: 86 },
      { title: 'Layer to layer', width: 80 },
      { title: 'Layer insulation', width: 86 },
      { title: 'Enamel grade', width: 97 },
    ],
    report.windings.map((w) => [
      w.name,
      q(w.turnToTurnV, 'V'),
      q(w.layerEndToEndV, 'V'),
      w.layers > 1 ? q(w.layerToLayerV, 'V') : 'one layer',
      w.layers > 1 ? q(w.layerInsulationV, 'V') : '—',
      String(section.windings.find((s) => s.role === w.role)?.wire.grade ?? '—'),
    ]),
  );
}

/**
 * Renders the transformer sheet for the magnetics supplier (A4 PDF, Inter embedded): the winding drawing with
 * dots and pins, the winding schedule, inductances with tolerances, maximum leakage, DC resistances, core and gap,
 * hipot and insulation, the transformer's Checks and the high-voltage caution; "NOT RELEASED" until released.
 */
export async function renderTransformerSheetPdf(c: TransformerSheetContent): Promise<Buffer> {
  const { doc, done } = openSheetDocument(
    `Transformer sheet: ${c.designName}, revision ${c.revisionNumber}`,
    c.isReleased,
  );
  titleBlock(doc, c);
  scheduleSection(doc, c);
  electricalSection(doc, c);
  coreSection(doc, c);
  insulationSection(doc, c);
  checksSection(doc, c.report.checks, 'The transformer’s own Checks at the rated load (estimate).');
  cautionBox(
    doc,
    'The secondary of this transformer carries kilovolts. The figures are design predictions; the standard that applies to the equipment, local codes and licensed practice govern every build and test, including the hipot test.',
  );
  markSheetPages(doc, {
    isReleased: c.isReleased,
    banner: `NOT RELEASED: ${c.state} revision, do not wind for production`,
    footer: (page, count) =>
      `${c.designName} · transformer · revision ${c.revisionNumber} (${c.state}) · page ${page} of ${count} · High voltage can kill: the applicable standard, local codes and licensed practice govern.`,
  });
  doc.end();
  return done;
}
