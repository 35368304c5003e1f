import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProjectDetail } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** One project with its members; the server answers 404 when it does not exist or the user is not a member. */
export function getProject(projectId: string, signal?: AbortSignal): Promise<ProjectDetail> {
  return apiRequest<ProjectDetail>(apiPaths.project(projectId), { signal });
}

export function getProjectQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.projects.detail(projectId),
    queryFn: ({ signal }) => getProject(projectId, signal),
  });
}

export function useProject(projectId: string) {
  return useQuery(getProjectQueryOptions(projectId));
}
