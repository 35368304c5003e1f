import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Takes the project out of the archive (lead): it takes changes again. */
export function unarchiveProject(projectId: string): Promise<void> {
  return apiRequest<void>(apiPaths.unarchiveProject(projectId), { method: 'POST' });
}

export function useUnarchiveProject(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => unarchiveProject(projectId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.projects.all }),
  });
}
