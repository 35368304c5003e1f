import { useMutation } from '@tanstack/react-query';
import type { CreatePasswordResetRequest, PasswordResetLink } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';

/** Issues a one-time password-reset link: returned once (`show`) or mailed to the account (`mail`). */
export function createResetLink(userId: string, request: CreatePasswordResetRequest): Promise<PasswordResetLink> {
  return apiRequest<PasswordResetLink>(apiPaths.passwordResetLink(userId), { method: 'POST', body: request });
}

export function useCreateResetLink() {
  return useMutation({
    mutationFn: ({ userId, request }: { userId: string; request: CreatePasswordResetRequest }) =>
      createResetLink(userId, request),
  });
}
