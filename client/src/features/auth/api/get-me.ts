import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CurrentUser, SignInResponse } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest, isApiError } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The signed-in user, or null when there is no valid session (401). */
export async function getMe(signal?: AbortSignal): Promise<CurrentUser | null> {
  try {
    const response = await apiRequest<SignInResponse>(apiPaths.me, { signal, isUnauthorizedExpected: true });
    return response.user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export function getMeQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.auth.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });
}

export function useMe() {
  return useQuery(getMeQueryOptions());
}
