import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchRunSummary } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The live bench runs of one revision, newest first, with their verdicts. */
export function getBenchRuns(projectId: string, designId: string, revisionNumber: number, signal?: AbortSignal) {
  return apiRequest<BenchRunSummary[]>(apiPaths.benchRuns(projectId, designId, revisionNumber), { signal });
}

export function getBenchRunsQueryOptions(projectId: string, designId: string, revisionNumber: number) {
  return queryOptions({
    queryKey: queryKeys.benchRuns.revision(projectId, designId, revisionNumber),
    queryFn: ({ signal }) => getBenchRuns(projectId, designId, revisionNumber, signal),
  });
}

export function useBenchRuns(projectId: string, designId: string, revisionNumber: number) {
  return useQuery(getBenchRunsQueryOptions(projectId, designId, revisionNumber));
}
