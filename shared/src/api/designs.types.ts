import type { Design } from '../designs';
import type { FieldIssue } from '../errors';
import type { DesignReport } from '../analysis';
import type { CapacitorRoleChange } from '../multiplier';
import type { CheckVerdict } from '../safety';
import type { CheckBody, DesignReportWire } from './check-rules';
import type { RevisionState } from '../reviews';

/**
 * The engine's report on one design document (`analyzeDesign`), as stored with a revision and returned
 * by POST /api/analysis/evaluate, after a JSON round trip (non-finite numbers arrive as null). Reports
 * computed against a project's Parts shelf (`analyzeWithShelf`) carry `partIssues`: the part codes the
 * shelf could not resolve, by document path; those positions were checked on the document's own ratings.
 */
export type DesignReportBody = DesignReport & { partIssues?: FieldIssue[] };

/** One row of the Designs list. */
export interface DesignSummary {
  id: string;
  projectId: string;
  name: string;
  ownerId: string;
  ownerName: string;
  latestRevisionNumber: number;
  latestState: RevisionState;
  /** ISO 8601. The time of the latest revision or state change. */
  updatedAt: string;
}

export type DesignSortKey = 'name' | 'updatedAt' | 'state';

/** GET /api/projects/:projectId/designs query. Everything optional; page is 1-based, pageSize ≤ 100. */
export interface DesignListQuery {
  q?: string;
  state?: RevisionState;
  ownerId?: string;
  sort?: DesignSortKey;
  order?: 'asc' | 'desc';
  page?: number;
  pageSize?: number;
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export type DesignPage = Page<DesignSummary>;

/** GET /api/projects/:projectId/designs/:designId */
export interface DesignDetail extends DesignSummary {
  createdAt: string;
  revisions: RevisionSummary[];
}

/** One revision without its document and report. */
export interface RevisionSummary {
  number: number;
  state: RevisionState;
  authorId: string;
  authorName: string;
  createdAt: string;
  changeNote: string;
  baseRevisionNumber: number | null;
  engineVersion: string;
}

/** One revision with its document and report as computed (the rule texts of its checks inline). */
export interface RevisionDetail extends RevisionSummary {
  designId: string;
  projectId: string;
  document: Design;
  report: DesignReportBody;
}

/**
 * GET .../designs/:designId/revisions/:revisionNumber, and the answer to saving one: the revision with its report
 * as the API sends it (`DesignReportWire`: each check rule's text once, in `report.checkRules`). `document` and
 * `report` never change once saved.
 */
export interface RevisionDetailBody extends Omit<RevisionDetail, 'report'> {
  report: DesignReportWire;
}

/** Where a new design's revision 1 comes from. */
export type DesignSource =
  | { kind: 'blank' }
  | { kind: 'template'; templateId: string }
  | { kind: 'duplicate'; designId: string; revisionNumber?: number }
  | { kind: 'document'; document: Design };

/** POST /api/projects/:projectId/designs -> DesignDetail (with revision 1, draft). */
export interface CreateDesignRequest {
  name: string;
  from: DesignSource;
}

/** POST .../designs/:designId/revisions -> RevisionDetail (the new revision n+1, draft). */
export interface SaveRevisionRequest {
  /** The revision the edit started from; must be the design's latest, or the save is refused with 409 stale_base. */
  baseRevisionNumber: number;
  document: Design;
  changeNote: string;
}

/** 409 body when the base of a save is not the latest revision. Nothing was written. */
export interface StaleBaseError {
  statusCode: 409;
  code: 'stale_base';
  message: string;
  latestRevisionNumber: number;
  /** Document paths that differ between the base and the latest revision, e.g. `multiplier.capacitors[2].valueF`. */
  changedFields: string[];
}

/** One input field side by side; `delta` = b − a when both are numbers. Missing values are null. */
export interface InputDifference {
  path: string;
  a: unknown;
  b: unknown;
  delta?: number;
}

/** One numeric headline result side by side; `deltaPct` is relative to a (null when a is 0). */
export interface ResultDifference {
  key: string;
  label?: string;
  unit?: string;
  a: number | null;
  b: number | null;
  delta: number | null;
  deltaPct: number | null;
}

/** The design a compared revision belongs to. */
export interface ComparedDesign {
  id: string;
  name: string;
}

/**
 * GET .../designs/:designId/compare?a=N&b=M[&bDesignId=…]: revision a of the design beside revision b of the same
 * design, or of `bDesignId` (another design of the project). `inputs` lists only fields that differ; `results`
 * lists every headline figure; `roleChanges` the capacitors that keep their number but sit elsewhere in the
 * ladder in b; `checks` each side's Checks as stored.
 */
export interface RevisionComparison {
  a: RevisionSummary;
  b: RevisionSummary;
  designs: { a: ComparedDesign; b: ComparedDesign };
  inputs: InputDifference[];
  results: ResultDifference[];
  roleChanges: CapacitorRoleChange[];
  /** Each side's Checks, their rule texts once in `rules` (keys as in `DesignReportWire`). */
  checks: { a: CheckBody<CheckVerdict>[]; b: CheckBody<CheckVerdict>[]; rules: Record<string, string> };
}

/** POST /api/analysis/evaluate: the engine's report for an unsaved document. */
export interface EvaluateRequest {
  document: Design;
}

export interface EvaluateResponse {
  engineVersion: string;
  report: DesignReportBody;
}

/** The answer of POST /api/analysis/evaluate (and its project twin): the report as the API sends it. */
export interface EvaluateResponseBody {
  engineVersion: string;
  report: DesignReportWire;
}

/** The file of GET .../revisions/:revisionNumber/export, and one accepted body of POST .../designs/import. */
export interface DesignExport {
  format: 'ladderwright-design';
  formatVersion: 1;
  exportedAt: string;
  engineVersion: string;
  design: Design;
}

/**
 * POST /api/projects/:projectId/designs/import body: an export file or a bare design document.
 * The design is named after the document's `name`; the response is the new DesignDetail.
 */
export type ImportDesignRequest = DesignExport | Design;

/** GET /api/design-templates */
export interface DesignTemplate {
  id: string;
  name: string;
  summary: string;
  document: Design;
}
