import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { DesignListQuery, DesignPage } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

function toSearch(query: DesignListQuery): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}

/** One page of a project's Designs, searched, filtered and sorted by the server. */
export function getDesigns(projectId: string, query: DesignListQuery, signal?: AbortSignal): Promise<DesignPage> {
  return apiRequest<DesignPage>(`${apiPaths.designs(projectId)}${toSearch(query)}`, { signal });
}

export function getDesignsQueryOptions(projectId: string, query: DesignListQuery) {
  return queryOptions({
    queryKey: queryKeys.designs.list(projectId, query),
    queryFn: ({ signal }) => getDesigns(projectId, query, signal),
    placeholderData: keepPreviousData,
  });
}

export function useDesigns(projectId: string, query: DesignListQuery) {
  return useQuery(getDesignsQueryOptions(projectId, query));
}
