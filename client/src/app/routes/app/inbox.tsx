import { Alert, Badge, Group, Loader, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { getInboxQueryOptions, useInbox } from '../../../features/inbox/api/get-inbox';
import { InboxComments } from '../../../features/inbox/components/inbox-comments';
import { InboxMemberRequests } from '../../../features/inbox/components/inbox-member-requests';
import { InboxTable } from '../../../features/inbox/components/inbox-table';
import { requireUser } from './root';

export function inboxLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    await queryClient.prefetchQuery(getInboxQueryOptions());
    return null;
  };
}

function Section({ title, count, children }: { title: string; count: number; children: ReactNode }) {
  return (
    <Stack gap="xs">
      <Group gap="xs">
        <Title order={2} size="h4">
          {title}
        </Title>
        {count > 0 && (
          <Badge color="ember" variant="light">
            {count}
          </Badge>
        )}
      </Group>
      {children}
    </Stack>
  );
}

export function InboxRoute() {
  useDocumentTitle('Inbox · Ladderwright');
  const inbox = useInbox();
  const data = inbox.data;
  return (
    <Stack gap="lg">
      <Title order={1} size="h2">
        Inbox
      </Title>
      {inbox.isPending && <Loader size="sm" aria-label="Loading the Inbox" />}
      {inbox.isError && <Alert color="red">{inbox.error.message}</Alert>}
      {data && (
        <>
          <Section title="Waiting for me" count={data.waitingForMe.length}>
            <InboxTable
              label="Waiting for me"
              items={data.waitingForMe}
              emptyText="Nothing is waiting for your Sign-off."
            />
          </Section>
          {data.awaitingRelease.length > 0 && (
            <Section title="Approved, waiting for release" count={data.awaitingRelease.length}>
              <InboxTable label="Waiting for release" items={data.awaitingRelease} emptyText="" />
            </Section>
          )}
          {data.memberRequests.length > 0 && (
            <Section title="Member requests" count={data.memberRequests.length}>
              <InboxMemberRequests requests={data.memberRequests} />
            </Section>
          )}
          <Section title="Returned to me" count={data.returnedToMe.length}>
            <InboxTable
              label="Returned to me"
              items={data.returnedToMe}
              target="workbench"
              emptyText="None of your revisions is waiting for changes."
            />
          </Section>
          <Section title="New comments on my designs" count={data.newComments.length}>
            <InboxComments comments={data.newComments} />
          </Section>
          <Section title="Submitted by me" count={0}>
            <InboxTable
              label="Submitted by me"
              items={data.submittedByMe}
              emptyText="You have not submitted a revision yet."
            />
          </Section>
        </>
      )}
      <Text size="xs" c="dimmed">
        Revisions move draft, submitted, returned or approved, released, superseded.
      </Text>
    </Stack>
  );
}
