import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RevisionComparison } from '@ladderwright/shared/api';
import { apiPaths, type RevisionRef } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/**
 * Two revisions side by side, of one design or of two designs of the project: inputs that differ, every headline
 * result with deltas, capacitors that change place, and both sides' Checks.
 */
export function compareRevisions(
  projectId: string,
  a: RevisionRef,
  b: RevisionRef,
  signal?: AbortSignal,
): Promise<RevisionComparison> {
  return apiRequest<RevisionComparison>(
    apiPaths.compareRevisions(projectId, a.designId, a.revisionNumber, b.revisionNumber, b.designId),
    { signal },
  );
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
