import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditPage, AuditQuery } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { searchString } from '../../../lib/search-string';

/** One page of the audit log, newest first (admin). */
export function getAuditEntries(query: AuditQuery, signal?: AbortSignal): Promise<AuditPage> {
  return apiRequest<AuditPage>(`${apiPaths.audit}${searchString(query)}`, { signal });
}

export function getAuditEntriesQueryOptions(query: AuditQuery) {
  return queryOptions({
    queryKey: queryKeys.admin.audit(query),
    queryFn: ({ signal }) => getAuditEntries(query, signal),
    placeholderData: keepPreviousData,
  });
}

export function useAuditEntries(query: AuditQuery) {
  return useQuery(getAuditEntriesQueryOptions(query));
}
