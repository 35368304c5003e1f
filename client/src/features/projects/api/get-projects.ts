import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ProjectSummary } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The projects the signed-in user is a member of. */
export function getProjects(signal?: AbortSignal): Promise<ProjectSummary[]> {
  return apiRequest<ProjectSummary[]>(apiPaths.projects, { signal });
}

export function getProjectsQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.projects.list(),
    queryFn: ({ signal }) => getProjects(signal),
  });
}

export function useProjects() {
  return useQuery(getProjectsQueryOptions());
}
