import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DesignDetail } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** A design with its revision list (newest revision number in `latestRevisionNumber`). */
export function getDesign(projectId: string, designId: string, signal?: AbortSignal): Promise<DesignDetail> {
  return apiRequest<DesignDetail>(apiPaths.design(projectId, designId), { signal });
}

export function getDesignQueryOptions(projectId: string, designId: string) {
  return queryOptions({
    queryKey: queryKeys.designs.detail(projectId, designId),
    queryFn: ({ signal }) => getDesign(projectId, designId, signal),
  });
}

export function useDesign(projectId: string, designId: string) {
  return useQuery(getDesignQueryOptions(projectId, designId));
}
