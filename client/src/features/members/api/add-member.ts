import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddMemberRequest, ProjectMember } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Adds the account with this e-mail to the project (lead). */
export function addMember(projectId: string, request: AddMemberRequest): Promise<ProjectMember> {
  return apiRequest<ProjectMember>(apiPaths.projectMembers(projectId), { method: 'POST', body: request });
}

export function useAddMember(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: AddMemberRequest) => addMember(projectId, request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.projects.all }),
  });
}
