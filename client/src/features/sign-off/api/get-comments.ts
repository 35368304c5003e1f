import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReviewComment } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The revision's comment threads, oldest first, each with its replies. */
export function getComments(
  projectId: string,
  designId: string,
  revisionNumber: number,
  signal?: AbortSignal,
): Promise<ReviewComment[]> {
  return apiRequest<ReviewComment[]>(apiPaths.revisionAction(projectId, designId, revisionNumber, 'comments'), {
    signal,
  });
}

export function getCommentsQueryOptions(projectId: string, designId: string, revisionNumber: number) {
  return queryOptions({
    queryKey: queryKeys.signOff.comments(projectId, designId, revisionNumber),
    queryFn: ({ signal }) => getComments(projectId, designId, revisionNumber, signal),
  });
}

export function useComments(projectId: string, designId: string, revisionNumber: number) {
  return useQuery(getCommentsQueryOptions(projectId, designId, revisionNumber));
}
