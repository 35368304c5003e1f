import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RevisionComparison } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Two revisions side by side: inputs that differ and every headline result, with deltas. */
export function compareRevisions(
  projectId: string,
  designId: string,
  a: number,
  b: number,
  signal?: AbortSignal,
): Promise<RevisionComparison> {
  return apiRequest<RevisionComparison>(apiPaths.compareRevisions(projectId, designId, a, b), { signal });
}

export function compareRevisionsQueryOptions(projectId: string, designId: string, a: number, b: number) {
  return queryOptions({
    queryKey: queryKeys.designs.compare(projectId, designId, a, b),
    queryFn: ({ signal }) => compareRevisions(projectId, designId, a, b, signal),
    staleTime: Infinity,
  });
}

export function useCompareRevisions(projectId: string, designId: string, a: number | null, b: number | null) {
  return useQuery({
    ...compareRevisionsQueryOptions(projectId, designId, a ?? 0, b ?? 0),
    enabled: a !== null && b !== null && a !== b,
  });
}
