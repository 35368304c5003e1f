import type { Design } from '../designs/design.types';
import type { CheckVerdict } from '../safety/check.types';
import type { TransformerSection } from '../transformer/transformer.types';
import { analyzeDesign, type DesignReport } from './analyze-design';
import { withGivenTransformer } from './transformer-report';
import { withTransformerSection } from './transformer-sizer-inputs';

/** A Check of the design that a transformer section leaves worse than the design's given numbers do. */
export interface WorsenedCheck {
  id: string;
  subject: string;
  verdict: 'marginal' | 'fail';
  /** Its verdict on the given numbers; null where the given numbers have no such Check. */
  givenVerdict: CheckVerdict['verdict'] | null;
}

const SEVERITY: Record<CheckVerdict['verdict'], number> = { pass: 0, marginal: 1, fail: 2 };

/**
 * What applying `section` does to the rest of the design: the design's Checks other than the transformer's own
 * (those the Sizer already judges) whose verdict on the section is worse than on the given numbers
 * (`givenReport`, the design analysed on its given transformer numbers): a core can fit its bobbin and keep its
 * flux margin and still leave the driver short of power or base drive, through the resistance, leakage and
 * self-capacitance its windings bring. One `analyzeDesign` of the design on the section.
 */
export function checksWorsenedBySection(
  design: Design,
  section: TransformerSection,
  givenReport: DesignReport,
): WorsenedCheck[] {
  const given = new Map(givenReport.checks.map((c) => [c.id, c.verdict]));
  const after = analyzeDesign(withTransformerSection(design, section));
  const worsened: WorsenedCheck[] = [];
  for (const check of after.checks) {
    if (check.id.startsWith('transformer.') || check.verdict === 'pass') continue;
    const before = given.get(check.id) ?? null;
    if (before !== null && SEVERITY[check.verdict] <= SEVERITY[before]) continue;
    worsened.push({ id: check.id, subject: check.subject, verdict: check.verdict, givenVerdict: before });
  }
  return worsened;
}

/**
 * `checksWorsenedBySection` for many sections of one design (a Sizer's ranked cores): the design is analysed on
 * its given numbers once, at the first section asked about.
 */
export function sectionAssessor(design: Design): (section: TransformerSection) => WorsenedCheck[] {
  let given: DesignReport | null = null;
  return (section) => {
    given ??= analyzeDesign(withGivenTransformer(design));
    return checksWorsenedBySection(design, section, given);
  };
}
