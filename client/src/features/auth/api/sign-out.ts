import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { apiRequest, isApiError } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Ends the session; a session that had already expired (401) counts as signed out. */
export async function signOut(): Promise<void> {
  try {
    await apiRequest<void>(apiPaths.signOut, { method: 'POST', isUnauthorizedExpected: true });
  } catch (error) {
    if (!(isApiError(error) && error.status === 401)) throw error;
  }
}

/** Ends the session and forgets every cached answer that belonged to it. */
export function useSignOut(options: { onSuccess?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      queryClient.setQueryData(queryKeys.auth.me(), null);
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== queryKeys.auth.all[0] });
    },
    onSuccess: () => options.onSuccess?.(),
  });
}
