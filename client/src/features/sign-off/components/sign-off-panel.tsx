import { List, Paper, Stack, Text, Title } from '@mantine/core';
import type { SignOff } from '@ladderwright/shared/api';
import { SignOffCommands } from './sign-off-commands';
import { SignOffHistory } from './sign-off-history';
import { formatDateTime } from '../../../lib/format-date';

/** The Sign-off of one revision: who it waits for, the commands open to the caller, approvals and history. */
export function SignOffPanel({ signOff }: { signOff: SignOff }) {
  return (
    <Stack gap="md">
      <Paper withBorder p="md">
        <Title order={2} size="h4" mb="xs">
          Sign-off
        </Title>
        <Text size="sm" mb="sm">
          Author: {signOff.authorName}
          {signOff.reviewers.length > 0 &&
            ` · ${signOff.state === 'submitted' ? 'waiting for' : 'submitted to'} ${signOff.reviewers
              .map((person) => person.displayName)
              .join(', ')}`}
        </Text>
        <SignOffCommands key={signOff.state} signOff={signOff} />
      </Paper>
      <Paper withBorder p="md">
        <Title order={2} size="h4" mb="xs">
          Approvals
        </Title>
        {signOff.approvals.length === 0 ? (
          <Text size="sm" c="dimmed">
            {signOff.state === 'approved' || signOff.state === 'released'
              ? `No approval on record: the revision was stored ${signOff.state}, not approved through Sign-off.`
              : 'Not approved yet.'}
          </Text>
        ) : (
          <List size="sm" aria-label="Approvals">
            {signOff.approvals.map((approval) => (
              <List.Item key={`${approval.userId}-${approval.at}`}>
                approved by {approval.displayName} on {formatDateTime(approval.at)}
                {approval.note ? ` · ${approval.note}` : ''}
              </List.Item>
            ))}
          </List>
        )}
      </Paper>
      {signOff.overrides.length > 0 && (
        <Paper withBorder p="md">
          <Title order={2} size="h4" mb="xs">
            Overrides
          </Title>
          <List size="sm" aria-label="Overrides">
            {signOff.overrides.map((override) => (
              <List.Item key={`${override.command}-${override.at}`}>
                <Text span fw={600} size="sm">
                  override on {override.command}
                </Text>{' '}
                by {override.actorName ?? 'unknown'} on {formatDateTime(override.at)}: “{override.reason}”
                <Text size="xs" c="dimmed">
                  Past: {override.overridden.map((reason) => reason.message).join('; ')}
                </Text>
              </List.Item>
            ))}
          </List>
        </Paper>
      )}
      <Paper withBorder p="md">
        <Title order={2} size="h4" mb="xs">
          History
        </Title>
        <SignOffHistory history={signOff.history} state={signOff.state} />
      </Paper>
    </Stack>
  );
}
