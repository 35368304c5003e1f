import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DesignTemplate } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The demo templates a new design can start from. */
export function getDesignTemplates(signal?: AbortSignal): Promise<DesignTemplate[]> {
  return apiRequest<DesignTemplate[]>(apiPaths.designTemplates, { signal });
}

export function getDesignTemplatesQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.designs.templates(),
    queryFn: ({ signal }) => getDesignTemplates(signal),
    staleTime: Infinity,
  });
}

export function useDesignTemplates(isEnabled = true) {
  return useQuery({ ...getDesignTemplatesQueryOptions(), enabled: isEnabled });
}
