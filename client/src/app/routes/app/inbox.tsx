import { Alert, Loader, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { getInboxQueryOptions, useInbox } from '../../../features/inbox/api/get-inbox';
import { InboxTable } from '../../../features/inbox/components/inbox-table';
import { requireUser } from './root';

export function inboxLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    await queryClient.prefetchQuery(getInboxQueryOptions());
    return null;
  };
}

export function InboxRoute() {
  useDocumentTitle('Inbox · Ladderwright');
  const inbox = useInbox();
  return (
    <Stack gap="lg">
      <Title order={1} size="h2">
        Inbox
      </Title>
      {inbox.isPending && <Loader size="sm" aria-label="Loading the Inbox" />}
      {inbox.isError && <Alert color="red">{inbox.error.message}</Alert>}
      {inbox.data && (
        <>
          <Title order={2} size="h4">
            Waiting for me
          </Title>
          <InboxTable
            label="Waiting for me"
            items={inbox.data.waitingForMe}
            emptyText="Nothing is waiting for your Sign-off."
          />
          <Title order={2} size="h4">
            Submitted by me
          </Title>
          <InboxTable
            label="Submitted by me"
            items={inbox.data.submittedByMe}
            emptyText="You have not submitted a revision yet."
          />
        </>
      )}
      <Text size="xs" c="dimmed">
        Revisions move draft, submitted, returned or approved, released, superseded.
      </Text>
    </Stack>
  );
}
