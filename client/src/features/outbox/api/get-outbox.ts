import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Outbox } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Mail the local fake SMTP server captured (admins only). */
export function getOutbox(signal?: AbortSignal): Promise<Outbox> {
  return apiRequest<Outbox>(apiPaths.outbox, { signal });
}

export function getOutboxQueryOptions() {
  return queryOptions({ queryKey: queryKeys.outbox.list(), queryFn: ({ signal }) => getOutbox(signal) });
}

export function useOutbox() {
  return useQuery(getOutboxQueryOptions());
}
