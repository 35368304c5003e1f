import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SimulationJob } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Asks the server to stop a queued or running job. */
export function cancelSimulation(projectId: string, jobId: string): Promise<SimulationJob> {
  return apiRequest<SimulationJob>(apiPaths.cancelSimulation(projectId, jobId), { method: 'POST' });
}

export function useCancelSimulation(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (jobId: string) => cancelSimulation(projectId, jobId),
    onSettled: (_job, _error, jobId) =>
      queryClient.invalidateQueries({ queryKey: queryKeys.simulations.job(projectId, jobId) }),
  });
}
