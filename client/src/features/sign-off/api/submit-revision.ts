import { useMutation } from '@tanstack/react-query';
import type { SignOff, SubmitRevisionRequest } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { useApplySignOff } from '../hooks/use-apply-sign-off';

/** Submits a draft revision to one or more reviewers; 409 with the reason when the state or caller forbids it. */
export function submitRevision(
  projectId: string,
  designId: string,
  revisionNumber: number,
  request: SubmitRevisionRequest,
): Promise<SignOff> {
  return apiRequest<SignOff>(apiPaths.revisionAction(projectId, designId, revisionNumber, 'submit'), {
    method: 'POST',
    body: request,
  });
}

export function useSubmitRevision(projectId: string, designId: string, revisionNumber: number) {
  const applySignOff = useApplySignOff(projectId, designId, revisionNumber);
  return useMutation({
    mutationFn: (request: SubmitRevisionRequest) => submitRevision(projectId, designId, revisionNumber, request),
    onSuccess: applySignOff,
  });
}
