import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SignOff } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** A revision's Sign-off: state, reviewers, approvals, audit history and the commands open to the caller. */
export function getSignOff(
  projectId: string,
  designId: string,
  revisionNumber: number,
  signal?: AbortSignal,
): Promise<SignOff> {
  return apiRequest<SignOff>(apiPaths.revisionAction(projectId, designId, revisionNumber, 'sign-off'), { signal });
}

export function getSignOffQueryOptions(projectId: string, designId: string, revisionNumber: number) {
  return queryOptions({
    queryKey: queryKeys.signOff.state(projectId, designId, revisionNumber),
    queryFn: ({ signal }) => getSignOff(projectId, designId, revisionNumber, signal),
  });
}

export function useSignOff(projectId: string, designId: string, revisionNumber: number) {
  return useQuery(getSignOffQueryOptions(projectId, designId, revisionNumber));
}
