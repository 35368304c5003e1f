import { checksSection } from './spec-sheet-checks';
import { bomSection } from './spec-sheet-bom';
import { benchRunsSection } from './spec-sheet-bench-runs';
import { performanceSection, titleBlock, windingSection } from './spec-sheet-front';
import { MARGIN, PAGE_BOTTOM, TEXT_WIDTH } from './spec-sheet-layout';
import { outputVsLoadPlot } from './spec-sheet-plot';
import { markSheetPages, openSheetDocument } from './sheet-document';
import { safetySection } from './spec-sheet-safety';
import { schematicSection } from './spec-sheet-schematic';
import type { SpecSheetContent } from './spec-sheet.types';

/** Which Checks rest on the stored simulation's figures, when one is current. */
function checksNote(c: SpecSheetContent): string | null {
  if (c.headline.source === 'estimate')
    return 'Every check rests on the estimate (no current full simulation of this revision).';
  return c.headline.simulatedKeys.includes('discharge')
    ? 'The discharge-time check rests on the simulated discharge; the others on the estimate.'
    : 'Every check rests on the estimate; the simulation gives no figure that a check tests.';
}

/** Renders the supplier spec sheet (A4 PDF, Inter embedded, vector plot). */
export async function renderSpecSheetPdf(c: SpecSheetContent): Promise<Buffer> {
  const { doc, done } = openSheetDocument(`Spec sheet: ${c.designName}, revision ${c.revisionNumber}`, c.isReleased);
  titleBlock(doc, c);
  windingSection(doc, c);
  bomSection(doc, c);
  performanceSection(doc, c);
  schematicSection(doc, c, MARGIN, TEXT_WIDTH, PAGE_BOTTOM);
  outputVsLoadPlot(doc, c);
  benchRunsSection(doc, c);
  checksSection(doc, c.headline.report.checks, checksNote(c));
  safetySection(doc, c);
  markSheetPages(doc, {
    isReleased: c.isReleased,
    banner: `NOT RELEASED: ${c.state} revision, not for manufacture`,
    footer: (page, count) =>
      `${c.designName} · revision ${c.revisionNumber} (${c.state}) · page ${page} of ${count} · High voltage can kill: the standard, local codes and licensed practice govern.`,
  });
  doc.end();
  return done;
}
