import type { NotificationData } from '@mantine/notifications';

/**
 * Shows a notification. The notification stack and its transition library load apart from the first screen
 * (app/provider.tsx mounts the stack lazily), so the call loads them first; it never throws.
 */
export function showNotification(data: NotificationData): void {
  void import('@mantine/notifications').then(({ notifications }) => notifications.show(data));
}
