import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Part, PartListQuery } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

function toSearch(query: PartListQuery): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}

/** The project's Parts shelf, filtered by the server. */
export function getParts(projectId: string, query: PartListQuery = {}, signal?: AbortSignal): Promise<Part[]> {
  return apiRequest<Part[]>(`${apiPaths.parts(projectId)}${toSearch(query)}`, { signal });
}

export function getPartsQueryOptions(projectId: string, query: PartListQuery = {}) {
  return queryOptions({
    queryKey: queryKeys.parts.list(projectId, query),
    queryFn: ({ signal }) => getParts(projectId, query, signal),
  });
}

export function useParts(projectId: string, query: PartListQuery = {}) {
  return useQuery(getPartsQueryOptions(projectId, query));
}
