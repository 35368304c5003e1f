import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MemberRequest } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export type MemberRequestDecision = { requestId: string } & (
  { decision: 'accept' } | { decision: 'decline'; reason?: string }
);

/** A lead accepts (the person becomes a member) or declines (with an optional reason) a pending request. */
export function decideMemberRequest(projectId: string, input: MemberRequestDecision): Promise<MemberRequest> {
  return apiRequest<MemberRequest>(apiPaths.memberRequestDecision(projectId, input.requestId, input.decision), {
    method: 'POST',
    body: input.decision === 'decline' && input.reason ? { reason: input.reason } : {},
  });
}

export function useDecideMemberRequest(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: MemberRequestDecision) => decideMemberRequest(projectId, input),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.projects.all }),
        queryClient.invalidateQueries({ queryKey: queryKeys.inbox.all }),
      ]),
  });
}
