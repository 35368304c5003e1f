import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReviewComment, UpdateCommentRequest } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export interface UpdateCommentInput {
  commentId: string;
  request: UpdateCommentRequest;
}

/** Resolves or reopens a thread. */
export function updateComment(
  projectId: string,
  designId: string,
  revisionNumber: number,
  { commentId, request }: UpdateCommentInput,
): Promise<ReviewComment> {
  return apiRequest<ReviewComment>(
    apiPaths.revisionAction(projectId, designId, revisionNumber, `comments/${encodeURIComponent(commentId)}`),
    { method: 'PATCH', body: request },
  );
}

export function useUpdateComment(projectId: string, designId: string, revisionNumber: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateCommentInput) => updateComment(projectId, designId, revisionNumber, input),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.signOff.comments(projectId, designId, revisionNumber) }),
  });
}
