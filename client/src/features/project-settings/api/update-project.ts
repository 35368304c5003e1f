import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProjectDetail, UpdateProjectRequest } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Saves the project's name, description, default targets and acceptance window (lead). */
export function updateProject(projectId: string, request: UpdateProjectRequest): Promise<ProjectDetail> {
  return apiRequest<ProjectDetail>(apiPaths.project(projectId), { method: 'PATCH', body: request });
}

export function useUpdateProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: UpdateProjectRequest) => updateProject(projectId, request),
    onSuccess: (project) => {
      queryClient.setQueryData(queryKeys.projects.detail(projectId), project);
      return queryClient.invalidateQueries({ queryKey: queryKeys.projects.list() });
    },
  });
}
