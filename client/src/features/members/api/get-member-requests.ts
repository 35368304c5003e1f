import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MemberRequest } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** A lead: pending requests first, then the latest decided; anyone else: their own requests with the outcome. */
export function getMemberRequests(projectId: string, signal?: AbortSignal): Promise<MemberRequest[]> {
  return apiRequest<MemberRequest[]>(apiPaths.memberRequests(projectId), { signal });
}

export function getMemberRequestsQueryOptions(projectId: string) {
  return queryOptions({
    queryKey: queryKeys.projects.memberRequests(projectId),
    queryFn: ({ signal }) => getMemberRequests(projectId, signal),
  });
}

export function useMemberRequests(projectId: string) {
  return useQuery(getMemberRequestsQueryOptions(projectId));
}
