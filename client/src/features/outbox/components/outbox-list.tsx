import { Card, Code, Group, Stack, Text } from '@mantine/core';
import type { Outbox } from '@ladderwright/shared/api';
import { formatDateTime } from '../../../lib/format-date';

export function OutboxList({ outbox }: { outbox: Outbox }) {
  return (
    <Stack gap="sm">
      <Text size="sm" c="dimmed">
        Queue: {outbox.queue.pending} pending, {outbox.queue.failed} failed
      </Text>
      {outbox.mails.length === 0 && <Text c="dimmed">No mail captured yet.</Text>}
      {outbox.mails.map((mail) => (
        <Card key={mail.id} withBorder padding="sm">
          <Group justify="space-between">
            <Text fw={600}>{mail.subject}</Text>
            <Text size="xs" c="dimmed">
              {formatDateTime(mail.receivedAt)}
            </Text>
          </Group>
          <Text size="sm">To: {mail.to.join(', ')}</Text>
          <Code block mt="xs">
            {mail.text}
          </Code>
        </Card>
      ))}
    </Stack>
  );
}
