import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Calibration } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The calibrations of a revision, newest first. */
export function getCalibrations(projectId: string, designId: string, revisionNumber: number, signal?: AbortSignal) {
  return apiRequest<Calibration[]>(apiPaths.calibrations(projectId, designId, revisionNumber), { signal });
}

export function getCalibrationsQueryOptions(projectId: string, designId: string, revisionNumber: number) {
  return queryOptions({
    queryKey: queryKeys.calibrations.revision(projectId, designId, revisionNumber),
    queryFn: ({ signal }) => getCalibrations(projectId, designId, revisionNumber, signal),
  });
}

export function useCalibrations(projectId: string, designId: string, revisionNumber: number) {
  return useQuery(getCalibrationsQueryOptions(projectId, designId, revisionNumber));
}
