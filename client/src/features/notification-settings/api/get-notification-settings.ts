import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationSettings } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** For each mail kind, whether the signed-in user receives it. */
export function getNotificationSettings(signal?: AbortSignal): Promise<NotificationSettings> {
  return apiRequest<NotificationSettings>(apiPaths.notificationSettings, { signal });
}

export function getNotificationSettingsQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.auth.notifications(),
    queryFn: ({ signal }) => getNotificationSettings(signal),
  });
}

export function useNotificationSettings() {
  return useQuery(getNotificationSettingsQueryOptions());
}
