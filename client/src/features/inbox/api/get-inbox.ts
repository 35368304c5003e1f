import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Inbox } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** What waits for me, by role (with the count for the top bar), and revisions I submitted. */
export function getInbox(signal?: AbortSignal): Promise<Inbox> {
  return apiRequest<Inbox>(apiPaths.inbox, { signal });
}

export function getInboxQueryOptions() {
  return queryOptions({ queryKey: queryKeys.inbox.mine(), queryFn: ({ signal }) => getInbox(signal) });
}

/** The Inbox, refreshed every minute while the page is open (the top bar shows its count). */
export function useInbox(isEnabled = true) {
  return useQuery({ ...getInboxQueryOptions(), enabled: isEnabled, refetchInterval: 60_000 });
}
