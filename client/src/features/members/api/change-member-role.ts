import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProjectMember } from '@ladderwright/shared/api';
import type { ProjectRole } from '@ladderwright/shared/auth';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Changes a member's project role (lead); 409 when it would leave the project without a lead. */
export function changeMemberRole(projectId: string, userId: string, role: ProjectRole): Promise<ProjectMember> {
  return apiRequest<ProjectMember>(apiPaths.projectMember(projectId, userId), { method: 'PATCH', body: { role } });
}

export function useChangeMemberRole(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: ProjectRole }) => changeMemberRole(projectId, userId, role),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.projects.all }),
  });
}
