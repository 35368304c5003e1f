import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export function deleteBenchRun(projectId: string, designId: string, revisionNumber: number, benchRunId: string) {
  return apiRequest<void>(apiPaths.benchRun(projectId, designId, revisionNumber, benchRunId), { method: 'DELETE' });
}

export function useDeleteBenchRun(projectId: string, designId: string, revisionNumber: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (benchRunId: string) => deleteBenchRun(projectId, designId, revisionNumber, benchRunId),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.benchRuns.revision(projectId, designId, revisionNumber) }),
  });
}
