import {
  packCheckRules,
  type RevisionDetail,
  type RevisionDetailBody,
  type RevisionSummary,
} from '@ladderwright/shared/api';
import type { DesignReport } from '@ladderwright/shared/analysis';
import type { RevisionModel } from './revision.model';

/** The list shape of a revision loaded with its author. */
export function toRevisionSummary(revision: RevisionModel): RevisionSummary {
  const author = revision.author;
  if (!author) throw new Error('revision loaded without its author');
  return {
    number: revision.number,
    state: revision.state,
    authorId: revision.authorId,
    authorName: author.displayName,
    createdAt: revision.createdAt.toISOString(),
    changeNote: revision.changeNote,
    baseRevisionNumber: revision.baseRevisionNumber,
    engineVersion: revision.engineVersion,
  };
}

/** The full shape: summary plus the stored document and report exactly as written. */
export function toRevisionDetail(revision: RevisionModel, projectId: string): RevisionDetail {
  return {
    ...toRevisionSummary(revision),
    designId: revision.designId,
    projectId,
    document: revision.document,
    report: revision.report,
  };
}

/** A revision as the API sends it: its report's check rules each given once (`packCheckRules`). */
export function toRevisionDetailBody(detail: RevisionDetail): RevisionDetailBody {
  return { ...detail, report: packCheckRules(detail.report) };
}

/** A revision row as `RevisionsService.getJson` reads it, without the document and report. */
export interface RevisionDetailHeadRow {
  id: string;
  number: number;
  state: RevisionDetail['state'];
  authorId: string;
  authorName: string;
  createdAt: Date | string;
  changeNote: string;
  baseRevisionNumber: number | null;
  engineVersion: string;
  designId: string;
}

/**
 * `toRevisionDetailBody` as the UTF-8 bytes of its JSON text, with the stored document spliced in as PostgreSQL
 * prints it and the report in the API's form (`contentTail`, from `revisionContentTail`): same keys in the same
 * order, and no parse and re-serialisation of the document.
 */
export function revisionDetailBytes(row: RevisionDetailHeadRow, projectId: string, contentTail: Buffer): Buffer {
  const head: Omit<RevisionDetail, 'document' | 'report'> = {
    number: row.number,
    state: row.state,
    authorId: row.authorId,
    authorName: row.authorName,
    createdAt: new Date(row.createdAt).toISOString(),
    changeNote: row.changeNote,
    baseRevisionNumber: row.baseRevisionNumber,
    engineVersion: row.engineVersion,
    designId: row.designId,
    projectId,
  };
  return Buffer.concat([Buffer.from(JSON.stringify(head).slice(0, -1), 'utf8'), contentTail]);
}

/**
 * The end of a revision's detail answer: its stored document as JSON text, its report in the API's form (each check
 * rule's text once; the one parse of it, made once per revision and instance since the caller keeps the answer),
 * then the closing brace.
 */
export function revisionContentTail(documentJson: string, reportJson: string): Buffer {
  const report = JSON.stringify(packCheckRules(JSON.parse(reportJson) as DesignReport));
  return Buffer.from(`,"document":${documentJson},"report":${report}}`, 'utf8');
}

/** A file-name stem from a design name: lower-case letters, digits and dashes. */
export function fileStem(name: string): string {
  const stem = name
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return stem || 'design';
}
