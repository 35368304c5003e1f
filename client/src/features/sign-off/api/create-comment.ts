import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateCommentRequest, ReviewComment } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Starts a thread (optionally anchored to an input path or result key) or replies to one. */
export function createComment(
  projectId: string,
  designId: string,
  revisionNumber: number,
  request: CreateCommentRequest,
): Promise<ReviewComment> {
  return apiRequest<ReviewComment>(apiPaths.revisionAction(projectId, designId, revisionNumber, 'comments'), {
    method: 'POST',
    body: request,
  });
}

export function useCreateComment(projectId: string, designId: string, revisionNumber: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateCommentRequest) => createComment(projectId, designId, revisionNumber, request),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.signOff.comments(projectId, designId, revisionNumber) }),
  });
}
