import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { NotificationSettings } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export function updateNotificationSettings(settings: NotificationSettings): Promise<NotificationSettings> {
  return apiRequest<NotificationSettings>(apiPaths.notificationSettings, { method: 'PUT', body: settings });
}

export function useUpdateNotificationSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNotificationSettings,
    onSuccess: (settings) => queryClient.setQueryData(queryKeys.auth.notifications(), settings),
  });
}
