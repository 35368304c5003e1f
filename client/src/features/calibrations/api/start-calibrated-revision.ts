import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CalibratedRevisionResponse } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';

/** Saves the design's next revision with the fitted values and a change note naming the bench runs. */
export function startCalibratedRevision(
  projectId: string,
  designId: string,
  revisionNumber: number,
  calibrationId: string,
) {
  return apiRequest<CalibratedRevisionResponse>(
    `${apiPaths.calibration(projectId, designId, revisionNumber, calibrationId)}/revision`,
    { method: 'POST', body: {} },
  );
}

export function useStartCalibratedRevision(projectId: string, designId: string, revisionNumber: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (calibrationId: string) => startCalibratedRevision(projectId, designId, revisionNumber, calibrationId),
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
