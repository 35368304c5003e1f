import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { UserListQuery, UserPage } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { searchString } from '../../../lib/search-string';

/** One page of accounts (admin). */
export function getUsers(query: UserListQuery, signal?: AbortSignal): Promise<UserPage> {
  return apiRequest<UserPage>(`${apiPaths.users}${searchString(query)}`, { signal });
}

export function getUsersQueryOptions(query: UserListQuery) {
  return queryOptions({
    queryKey: queryKeys.admin.users(query),
    queryFn: ({ signal }) => getUsers(query, signal),
    placeholderData: keepPreviousData,
  });
}

export function useUsers(query: UserListQuery) {
  return useQuery(getUsersQueryOptions(query));
}
