import { useMemo } from 'react';
import { useDebouncedValue } from '@mantine/hooks';
import type { Design } from '@ladderwright/shared/designs';
import { validateDesign } from '@ladderwright/shared/designs';
import { analyzeDesign, type DesignReport } from '@ladderwright/shared/multiplier';
import { isDomainError, type FieldIssue } from '@ladderwright/shared/errors';
import { analyzeWithShelf, type ShelfPart } from '@ladderwright/shared/parts';

export interface LiveAnalysis {
  /** The engine's report on the debounced document; null while the document has field issues. */
  report: DesignReport | null;
  /** validateDesign's field issues by document path (first message per path). */
  issues: Record<string, string>;
  /** A problem the engine reported that is not tied to one field, e.g. a ladder that does not converge. */
  engineError: string | null;
  /** Part codes the shelf could not resolve (with a shelf only); those positions use the document's ratings. */
  partIssues: FieldIssue[];
  /** True while the shown figures lag behind the typed document. */
  isPending: boolean;
}

const debounceMs = 150;

function issuesOf(error: unknown): Record<string, string> {
  const issues: Record<string, string> = {};
  if (isDomainError(error)) {
    for (const issue of error.issues) issues[issue.path] ??= issue.message;
  }
  return issues;
}

/**
 * Runs the shared engine in the browser on the document being edited, ~150 ms after the last keystroke.
 * With the project's `shelf`, the referenced parts' ratings are filled in first (`analyzeWithShelf`), as
 * the server does for a saved revision, so the preview and the stored report agree.
 */
export function useLiveAnalysis(document: Design, shelf?: readonly ShelfPart[]): LiveAnalysis {
  const [debounced] = useDebouncedValue(document, debounceMs);
  const result = useMemo(() => {
    const none: FieldIssue[] = [];
    try {
      const valid = validateDesign(debounced);
      try {
        if (!shelf) return { report: analyzeDesign(valid), issues: {}, engineError: null, partIssues: none };
        const { partIssues, ...report } = analyzeWithShelf(valid, shelf);
        return { report, issues: {}, engineError: null, partIssues };
      } catch (error) {
        const issues = issuesOf(error);
        return {
          report: null,
          issues,
          engineError: error instanceof Error ? error.message : String(error),
          partIssues: none,
        };
      }
    } catch (error) {
      return { report: null, issues: issuesOf(error), engineError: null, partIssues: none };
    }
  }, [debounced, shelf]);
  return { ...result, isPending: debounced !== document };
}
