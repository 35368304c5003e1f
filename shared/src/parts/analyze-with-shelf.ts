import type { Design } from '../designs/design.types';
import type { FieldIssue } from '../errors';
import { analyzeDesign, type DesignReport } from '../analysis/analyze-design';
import { fillPartRatings, type ShelfPart } from './fill-part-ratings';

/** The design report with the shelf look-up it was computed after. */
export interface ShelfDesignReport extends DesignReport {
  /**
   * Part codes the shelf could not resolve (unknown code, or a part of another kind), by document path.
   * Those positions are checked against the ratings written in the document itself.
   */
  partIssues: FieldIssue[];
}

/**
 * `analyzeDesign` on the design with its referenced shelf ratings filled in (`fillPartRatings`), so the
 * Checks compare each stress against the rating the shelf holds for that part code. Unresolved codes do
 * not stop the analysis: they come back as `partIssues` (warnings), as templates and imported designs
 * carry codes of other shelves. Used by the server for the stored report and by the Workbench preview.
 */
export function analyzeWithShelf(design: Design, parts: readonly ShelfPart[]): ShelfDesignReport {
  const { design: filled, issues } = fillPartRatings(design, parts);
  return { ...analyzeDesign(filled), partIssues: issues };
}
