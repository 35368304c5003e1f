import { useQuery } from '@tanstack/react-query';
import type { Calibration } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** How often a queued or running calibration is read again. */
const POLL_MS = 700;

export function getCalibration(
  projectId: string,
  designId: string,
  revisionNumber: number,
  calibrationId: string,
  signal?: AbortSignal,
) {
  return apiRequest<Calibration>(apiPaths.calibration(projectId, designId, revisionNumber, calibrationId), { signal });
}

/** One calibration, read again while it is queued or running. */
export function useCalibration(
  projectId: string,
  designId: string,
  revisionNumber: number,
  calibrationId: string | null,
) {
  return useQuery({
    queryKey: queryKeys.calibrations.detail(projectId, designId, revisionNumber, calibrationId ?? ''),
    queryFn: ({ signal }) => getCalibration(projectId, designId, revisionNumber, calibrationId ?? '', signal),
    enabled: calibrationId !== null,
    refetchInterval: (query) => {
      const status = query.state.data?.status;
      return status === 'queued' || status === 'running' ? POLL_MS : false;
    },
  });
}
