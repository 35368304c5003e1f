import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateDesignRequest, DesignDetail } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Creates a design with its revision 1 (draft) from blank, a template, a duplicate or a document. */
export function createDesign(projectId: string, request: CreateDesignRequest): Promise<DesignDetail> {
  return apiRequest<DesignDetail>(apiPaths.designs(projectId), { method: 'POST', body: request });
}

export function useCreateDesign(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: CreateDesignRequest) => createDesign(projectId, request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.designs.project(projectId) }),
  });
}
