import { useMutation } from '@tanstack/react-query';
import type { CompletePasswordResetRequest } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';

/** Sets a new password with a one-time link's token (no session needed); 400 naming `token` when it is spent. */
export function completePasswordReset(request: CompletePasswordResetRequest): Promise<void> {
  return apiRequest<void>(apiPaths.completePasswordReset, {
    method: 'POST',
    body: request,
    isUnauthorizedExpected: true,
  });
}

export function useCompletePasswordReset() {
  return useMutation({ mutationFn: completePasswordReset });
}
