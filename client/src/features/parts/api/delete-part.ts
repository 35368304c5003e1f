import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export function deletePart(projectId: string, partId: string): Promise<void> {
  return apiRequest<void>(apiPaths.part(projectId, partId), { method: 'DELETE' });
}

export function useDeletePart(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (partId: string) => deletePart(projectId, partId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.parts.project(projectId) }),
  });
}
