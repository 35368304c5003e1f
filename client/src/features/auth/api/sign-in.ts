import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignInRequest, SignInResponse } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export function signIn(request: SignInRequest): Promise<SignInResponse> {
  return apiRequest<SignInResponse>(apiPaths.signIn, { method: 'POST', body: request, isUnauthorizedExpected: true });
}

/** Signs in and primes the who-am-I query with the returned user. */
export function useSignIn(options: { onSuccess?: (response: SignInResponse) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (response) => {
      queryClient.removeQueries({ queryKey: queryKeys.projects.all });
      queryClient.setQueryData(queryKeys.auth.me(), response.user);
      options.onSuccess?.(response);
    },
  });
}
