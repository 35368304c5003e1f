import { validateDesign, type Design } from '@ladderwright/shared/designs';
import { isDomainError, type FieldIssue } from '@ladderwright/shared/errors';
import { analyzeDesign, type DesignReport } from '@ladderwright/shared/analysis';
import { analyzeWithShelf, type ShelfPart } from '@ladderwright/shared/parts';

/** The live preview of one document: the engine's report, or why there is none. */
export interface LiveAnalysisResult {
  /** The engine's report; null while the document has field issues or the engine refused it. */
  report: DesignReport | null;
  /** validateDesign's (or the engine's) field issues by document path, first message per path. */
  issues: Record<string, string>;
  /** A problem the engine reported that is not tied to one field, e.g. a ladder that does not converge. */
  engineError: string | null;
  /** Part codes the shelf could not resolve (with a shelf only); those positions use the document's ratings. */
  partIssues: FieldIssue[];
}

/** What the page posts to the live-analysis worker: one document, numbered so a stale answer is dropped. */
export interface LiveAnalysisRequest {
  sequence: number;
  document: Design;
  shelf?: readonly ShelfPart[];
}

/** What the worker posts back for one request. */
export interface LiveAnalysisAnswer {
  sequence: number;
  result: LiveAnalysisResult;
}

function issuesOf(error: unknown): Record<string, string> {
  const issues: Record<string, string> = {};
  if (isDomainError(error)) {
    for (const issue of error.issues) issues[issue.path] ??= issue.message;
  }
  return issues;
}

/**
 * Validates a document and runs the shared engine on it; with the project's `shelf`, the referenced parts'
 * ratings are filled in first (`analyzeWithShelf`), as the server does for a saved revision. Every refusal
 * becomes part of the answer, never a thrown error.
 */
export function answerLiveAnalysis({ sequence, document, shelf }: LiveAnalysisRequest): LiveAnalysisAnswer {
  const none: FieldIssue[] = [];
  let valid: Design;
  try {
    valid = validateDesign(document);
  } catch (error) {
    return { sequence, result: { report: null, issues: issuesOf(error), engineError: null, partIssues: none } };
  }
  try {
    if (!shelf)
      return { sequence, result: { report: analyzeDesign(valid), issues: {}, engineError: null, partIssues: none } };
    const { partIssues, ...report } = analyzeWithShelf(valid, shelf);
    return { sequence, result: { report, issues: {}, engineError: null, partIssues } };
  } catch (error) {
    const issues = issuesOf(error);
    // A refusal tied to a field is shown beside that field; only the rest is an engine error.
    const isFieldIssue = Object.keys(issues).length > 0;
    const engineError = isFieldIssue ? null : error instanceof Error ? error.message : String(error);
    return { sequence, result: { report: null, issues, engineError, partIssues: none } };
  }
}
