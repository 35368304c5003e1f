import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchRunDetail } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** One bench run with its measured points and the comparison with the prediction. */
export function getBenchRun(
  projectId: string,
  designId: string,
  revisionNumber: number,
  benchRunId: string,
  signal?: AbortSignal,
) {
  return apiRequest<BenchRunDetail>(apiPaths.benchRun(projectId, designId, revisionNumber, benchRunId), { signal });
}

export function getBenchRunQueryOptions(
  projectId: string,
  designId: string,
  revisionNumber: number,
  benchRunId: string,
) {
  return queryOptions({
    queryKey: queryKeys.benchRuns.detail(projectId, designId, revisionNumber, benchRunId),
    queryFn: ({ signal }) => getBenchRun(projectId, designId, revisionNumber, benchRunId, signal),
  });
}

export function useBenchRun(projectId: string, designId: string, revisionNumber: number, benchRunId: string | null) {
  return useQuery({
    ...getBenchRunQueryOptions(projectId, designId, revisionNumber, benchRunId ?? ''),
    enabled: benchRunId !== null,
  });
}
