import { Alert, Loader, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { getOutboxQueryOptions, useOutbox } from '../../../features/outbox/api/get-outbox';
import { OutboxList } from '../../../features/outbox/components/outbox-list';
import { requireUser } from './root';

export function outboxLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    await queryClient.prefetchQuery(getOutboxQueryOptions());
    return null;
  };
}

export function OutboxRoute() {
  useDocumentTitle('Outbox · Ladderwright');
  const outbox = useOutbox();
  return (
    <Stack gap="lg">
      <Title order={1} size="h2">
        Outbox
      </Title>
      <Text c="dimmed" size="sm">
        Mail captured by the local fake SMTP server (admins only).
      </Text>
      {outbox.isPending && <Loader size="sm" aria-label="Loading the Outbox" />}
      {outbox.isError && <Alert color="red">{outbox.error.message}</Alert>}
      {outbox.data && <OutboxList outbox={outbox.data} />}
    </Stack>
  );
}
