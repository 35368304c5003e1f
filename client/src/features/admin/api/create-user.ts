import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateUserRequest, UserSummary } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export function createUser(request: CreateUserRequest): Promise<UserSummary> {
  return apiRequest<UserSummary>(apiPaths.users, { method: 'POST', body: request });
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.admin.all }),
  });
}
