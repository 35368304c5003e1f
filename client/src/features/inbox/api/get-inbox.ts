import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Inbox } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Revisions submitted to me and waiting, and revisions I submitted. */
export function getInbox(signal?: AbortSignal): Promise<Inbox> {
  return apiRequest<Inbox>(apiPaths.inbox, { signal });
}

export function getInboxQueryOptions() {
  return queryOptions({ queryKey: queryKeys.inbox.mine(), queryFn: ({ signal }) => getInbox(signal) });
}

export function useInbox() {
  return useQuery(getInboxQueryOptions());
}
