import { queryOptions, useQuery } from '@tanstack/react-query';
import { expandCheckList, type RevisionComparison } from '@ladderwright/shared/api';
import type { CheckVerdict } from '@ladderwright/shared/safety';
import { apiPaths, type RevisionRef } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/**
 * Two revisions side by side, of one design or of two designs of the project: inputs that differ, every headline
 * result with deltas, capacitors that change place, and both sides' Checks.
 */
/** The comparison with each side's Checks as computed: every check's rule looked up in the answer's map. */
export type ComparedRevisions = Omit<RevisionComparison, 'checks'> & {
  checks: { a: CheckVerdict[]; b: CheckVerdict[] };
};

export async function compareRevisions(
  projectId: string,
  a: RevisionRef,
  b: RevisionRef,
  signal?: AbortSignal,
): Promise<ComparedRevisions> {
  const body = await apiRequest<RevisionComparison>(
    apiPaths.compareRevisions(projectId, a.designId, a.revisionNumber, b.revisionNumber, b.designId),
    { signal },
  );
  const { rules, a: checksA, b: checksB } = body.checks;
  return { ...body, checks: { a: expandCheckList(checksA, rules), b: expandCheckList(checksB, rules) } };
}

export function compareRevisionsQueryOptions(projectId: string, a: RevisionRef, b: RevisionRef) {
  return queryOptions({
    queryKey: queryKeys.designs.compare(projectId, a.designId, a.revisionNumber, b.designId, b.revisionNumber),
    queryFn: ({ signal }) => compareRevisions(projectId, a, b, signal),
    staleTime: Infinity,
  });
}

const none: RevisionRef = { designId: '', revisionNumber: 0 };

/** Runs only with two references that name different revisions. */
export function useCompareRevisions(projectId: string, a: RevisionRef | null, b: RevisionRef | null) {
  const isSame = a !== null && b !== null && a.designId === b.designId && a.revisionNumber === b.revisionNumber;
  return useQuery({
    ...compareRevisionsQueryOptions(projectId, a ?? none, b ?? none),
    enabled: a !== null && b !== null && !isSame,
  });
}
