import { Alert, Loader, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import {
  getNotificationSettingsQueryOptions,
  useNotificationSettings,
} from '../../../features/notification-settings/api/get-notification-settings';
import { NotificationSettingsForm } from '../../../features/notification-settings/components/notification-settings-form';
import { requireUser } from './root';

export function notificationSettingsLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    await queryClient.prefetchQuery(getNotificationSettingsQueryOptions());
    return null;
  };
}

export function NotificationSettingsRoute() {
  useDocumentTitle('Mail settings · Ladderwright');
  const settings = useNotificationSettings();
  return (
    <Stack gap="lg">
      <Title order={1} size="h2">
        Mail settings
      </Title>
      <Text c="dimmed" size="sm">
        Choose which Sign-off mails you receive. The Inbox shows everything either way.
      </Text>
      {settings.isPending && <Loader size="sm" aria-label="Loading mail settings" />}
      {settings.isError && <Alert color="red">{settings.error.message}</Alert>}
      {settings.data && <NotificationSettingsForm settings={settings.data} />}
    </Stack>
  );
}
