import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Calibration, StartCalibrationRequest } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export function startCalibration(
  projectId: string,
  designId: string,
  revisionNumber: number,
  request: StartCalibrationRequest,
) {
  return apiRequest<Calibration>(apiPaths.calibrations(projectId, designId, revisionNumber), {
    method: 'POST',
    body: request,
  });
}

export function useStartCalibration(projectId: string, designId: string, revisionNumber: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: StartCalibrationRequest) => startCalibration(projectId, designId, revisionNumber, request),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.calibrations.revision(projectId, designId, revisionNumber) }),
  });
}
