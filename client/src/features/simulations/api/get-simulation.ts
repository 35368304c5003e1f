import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SimulationJob } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

const pollIntervalMs = 400;

export function isSimulationActive(job: SimulationJob | undefined): boolean {
  return job?.status === 'queued' || job?.status === 'running';
}

/** One simulation job: status, progress and, once it has succeeded, its result. */
export function getSimulation(projectId: string, jobId: string, signal?: AbortSignal): Promise<SimulationJob> {
  return apiRequest<SimulationJob>(apiPaths.simulation(projectId, jobId), { signal });
}

export function getSimulationQueryOptions(projectId: string, jobId: string) {
  return queryOptions({
    queryKey: queryKeys.simulations.job(projectId, jobId),
    queryFn: ({ signal }) => getSimulation(projectId, jobId, signal),
    refetchInterval: (query) => (isSimulationActive(query.state.data) || !query.state.data ? pollIntervalMs : false),
  });
}

/** Polls the job while it is queued or running. */
export function useSimulation(projectId: string, jobId: string | null) {
  return useQuery({ ...getSimulationQueryOptions(projectId, jobId ?? ''), enabled: jobId !== null });
}
