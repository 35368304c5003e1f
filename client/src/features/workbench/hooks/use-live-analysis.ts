import { useMemo } from 'react';
import { useDebouncedValue } from '@mantine/hooks';
import type { Design } from '@ladderwright/shared/designs';
import { validateDesign } from '@ladderwright/shared/designs';
import { analyzeDesign, type DesignReport } from '@ladderwright/shared/multiplier';
import { isDomainError } from '@ladderwright/shared/errors';

export interface LiveAnalysis {
  /** The engine's report on the debounced document; null while the document has field issues. */
  report: DesignReport | null;
  /** validateDesign's field issues by document path (first message per path). */
  issues: Record<string, string>;
  /** A problem the engine reported that is not tied to one field, e.g. a ladder that does not converge. */
  engineError: string | null;
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

/** Runs the shared engine in the browser on the document being edited, ~150 ms after the last keystroke. */
export function useLiveAnalysis(document: Design): LiveAnalysis {
  const [debounced] = useDebouncedValue(document, debounceMs);
  const result = useMemo(() => {
    try {
      const valid = validateDesign(debounced);
      try {
        return { report: analyzeDesign(valid), issues: {}, engineError: null };
      } catch (error) {
        const issues = issuesOf(error);
        return { report: null, issues, engineError: error instanceof Error ? error.message : String(error) };
      }
    } catch (error) {
      return { report: null, issues: issuesOf(error), engineError: null };
    }
  }, [debounced]);
  return { ...result, isPending: debounced !== document };
}
