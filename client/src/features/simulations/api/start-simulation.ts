import { useMutation } from '@tanstack/react-query';
import type { StartSimulationRequest, StartSimulationResponse } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';

/** Queues a simulation job (202); poll it with getSimulation. */
export function startSimulation(projectId: string, request: StartSimulationRequest): Promise<StartSimulationResponse> {
  return apiRequest<StartSimulationResponse>(apiPaths.simulations(projectId), { method: 'POST', body: request });
}

export function useStartSimulation(projectId: string) {
  return useMutation({ mutationFn: (request: StartSimulationRequest) => startSimulation(projectId, request) });
}
