import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateUserRequest, UserSummary } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Changes an account's role, or deactivates (ending its sessions) or reactivates it. */
export function updateUser(userId: string, request: UpdateUserRequest): Promise<UserSummary> {
  return apiRequest<UserSummary>(apiPaths.user(userId), { method: 'PATCH', body: request });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, request }: { userId: string; request: UpdateUserRequest }) => updateUser(userId, request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.admin.all }),
  });
}
