import type { NotificationData } from '@mantine/notifications';

/**
 * Shows a notification. The notification stack and its transition library load apart from the first screen
 * (app/provider.tsx mounts the stack lazily), so the call loads them first. A notification is a courtesy:
 * when its code cannot load (the connection dropped), it is logged and the page carries on.
 */
export function showNotification(data: NotificationData): void {
  import('@mantine/notifications')
    .then(({ notifications }) => notifications.show(data))
    .catch((error: unknown) => console.warn('notification not shown', error));
}
