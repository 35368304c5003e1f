import { useQueryClient } from '@tanstack/react-query';
import type { SignOff } from '@ladderwright/shared/api';
import { queryKeys } from '../../../lib/query-keys';

/**
 * After a Sign-off command: keep the server's answer as the revision's Sign-off and refresh what shows the
 * state elsewhere (the design's revision list, the Inbox).
 */
export function useApplySignOff(projectId: string, designId: string, revisionNumber: number) {
  const queryClient = useQueryClient();
  return (signOff: SignOff) => {
    queryClient.setQueryData(queryKeys.signOff.state(projectId, designId, revisionNumber), signOff);
    return Promise.all([
      queryClient.invalidateQueries({ queryKey: queryKeys.signOff.all }),
      queryClient.invalidateQueries({ queryKey: queryKeys.designs.detail(projectId, designId) }),
      queryClient.invalidateQueries({ queryKey: queryKeys.inbox.all }),
      queryClient.invalidateQueries({ queryKey: queryKeys.outbox.all }),
    ]);
  };
}
