import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CurrentSimulationResponse } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The revision's current full simulation (same document, same engine version), or null. */
export function getSimulatedFigures(
  projectId: string,
  designId: string,
  revisionNumber: number,
  signal?: AbortSignal,
): Promise<CurrentSimulationResponse> {
  return apiRequest<CurrentSimulationResponse>(apiPaths.simulatedFigures(projectId, designId, revisionNumber), {
    signal,
  });
}

export function getSimulatedFiguresQueryOptions(projectId: string, designId: string, revisionNumber: number) {
  return queryOptions({
    queryKey: queryKeys.simulations.current(projectId, designId, revisionNumber),
    queryFn: ({ signal }) => getSimulatedFigures(projectId, designId, revisionNumber, signal),
    staleTime: 60_000,
  });
}

/** Fetched only while the saved revision is shown: a draft with edits is not the document that was simulated. */
export function useSimulatedFigures(projectId: string, designId: string, revisionNumber: number, enabled: boolean) {
  return useQuery({ ...getSimulatedFiguresQueryOptions(projectId, designId, revisionNumber), enabled });
}
