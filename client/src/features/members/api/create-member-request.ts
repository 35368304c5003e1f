import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateMemberRequestRequest, MemberRequest } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Asks the project's leads to add a person (engineer or reviewer). */
export function createMemberRequest(projectId: string, request: CreateMemberRequestRequest): Promise<MemberRequest> {
  return apiRequest<MemberRequest>(apiPaths.memberRequests(projectId), { method: 'POST', body: request });
}

export function useCreateMemberRequest(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateMemberRequestRequest) => createMemberRequest(projectId, request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.projects.memberRequests(projectId) }),
  });
}
