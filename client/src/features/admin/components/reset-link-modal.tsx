import { Alert, Button, Code, CopyButton, Group, Modal, Stack, Text } from '@mantine/core';
import type { UserSummary } from '@ladderwright/shared/api';
import { useCreateResetLink } from '../api/create-reset-link';
import { formatDateTime } from '../../../lib/format-date';

/**
 * Issues a one-time password-reset link for an account: shown here once (copy it and pass it on) or mailed to
 * the account's address. Issuing a new link voids older ones.
 */
export function ResetLinkModal({ user, onClose }: { user: UserSummary; onClose: () => void }) {
  const issue = useCreateResetLink();
  const link = issue.data;
  return (
    <Modal opened onClose={onClose} title={`Reset the password of ${user.displayName}`} size="lg">
      <Stack gap="sm">
        {!link && (
          <>
            <Text size="sm">
              A one-time link lets {user.email} set a new password. It works once, for 24 hours, and ends the
              account&apos;s open sessions when used.
            </Text>
            <Group>
              <Button
                loading={issue.isPending && issue.variables.request.delivery === 'show'}
                disabled={issue.isPending}
                onClick={() => issue.mutate({ userId: user.id, request: { delivery: 'show' } })}
              >
                Show the link once
              </Button>
              <Button
                variant="default"
                loading={issue.isPending && issue.variables.request.delivery === 'mail'}
                disabled={issue.isPending}
                onClick={() => issue.mutate({ userId: user.id, request: { delivery: 'mail' } })}
              >
                Mail it to {user.email}
              </Button>
            </Group>
          </>
        )}
        {issue.error && <Alert color="red">{issue.error.message}</Alert>}
        {link?.url && (
          <Stack gap="xs">
            <Text size="sm" fw={600}>
              One-time link (shown only now; valid until {formatDateTime(link.expiresAt)}):
            </Text>
            <Code block aria-label="One-time link">
              {link.url}
            </Code>
            <CopyButton value={link.url}>
              {({ copied, copy }) => (
                <Button size="compact-sm" variant="light" onClick={copy}>
                  {copied ? 'Copied' : 'Copy link'}
                </Button>
              )}
            </CopyButton>
          </Stack>
        )}
        {link?.mailedTo && (
          <Alert color="verdigris">
            Mailed to {link.mailedTo}; valid until {formatDateTime(link.expiresAt)}.
          </Alert>
        )}
        <Group justify="flex-end">
          <Button variant="default" onClick={onClose}>
            Close
          </Button>
        </Group>
      </Stack>
    </Modal>
  );
}
