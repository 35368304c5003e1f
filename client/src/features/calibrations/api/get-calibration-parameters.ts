import { useQuery } from '@tanstack/react-query';
import type { CalibrationParameterOption } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** The parameters the engine can fit for a revision, with their declared prior ranges. */
export function getCalibrationParameters(
  projectId: string,
  designId: string,
  revisionNumber: number,
  signal?: AbortSignal,
) {
  return apiRequest<CalibrationParameterOption[]>(
    `${apiPaths.calibrations(projectId, designId, revisionNumber)}/parameters`,
    { signal },
  );
}

export function useCalibrationParameters(projectId: string, designId: string, revisionNumber: number) {
  return useQuery({
    queryKey: [...queryKeys.calibrations.revision(projectId, designId, revisionNumber), 'parameters'],
    queryFn: ({ signal }) => getCalibrationParameters(projectId, designId, revisionNumber, signal),
  });
}
