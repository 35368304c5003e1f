import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Calibration } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export function cancelCalibration(projectId: string, designId: string, revisionNumber: number, calibrationId: string) {
  return apiRequest<Calibration>(`${apiPaths.calibration(projectId, designId, revisionNumber, calibrationId)}/cancel`, {
    method: 'POST',
    body: {},
  });
}

export function useCancelCalibration(projectId: string, designId: string, revisionNumber: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (calibrationId: string) => cancelCalibration(projectId, designId, revisionNumber, calibrationId),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.calibrations.revision(projectId, designId, revisionNumber) }),
  });
}
