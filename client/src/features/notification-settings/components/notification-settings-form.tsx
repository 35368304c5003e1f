import { Alert, Paper, Stack, Switch, Text } from '@mantine/core';
import { MAIL_KINDS, type MailKind, type NotificationSettings } from '@ladderwright/shared/api';
import { useUpdateNotificationSettings } from '../api/update-notification-settings';

const MAIL_LABELS: Record<MailKind, { label: string; description: string }> = {
  'sign-off.submit': { label: 'Review requested', description: 'A revision is submitted to you.' },
  'sign-off.withdraw': { label: 'Withdrawn from review', description: 'A revision submitted to you is withdrawn.' },
  'sign-off.approve': { label: 'Approved', description: 'Your revision, or one in a project you lead, is approved.' },
  'sign-off.return': { label: 'Returned for changes', description: 'Your revision is returned with a note.' },
  'sign-off.release': { label: 'Released', description: 'A revision you wrote or reviewed is released.' },
  'sign-off.comment': {
    label: 'Comments and replies',
    description: 'Someone comments on a revision you take part in.',
  },
  'members.request-decided': {
    label: 'Member requests decided',
    description: 'A lead accepts or declines a person you asked to add to a project.',
  },
};

/** One switch per mail kind; each change is saved at once. Password-reset links are always sent. */
export function NotificationSettingsForm({ settings }: { settings: NotificationSettings }) {
  const update = useUpdateNotificationSettings();
  const current = update.variables && update.isPending ? update.variables : settings;
  return (
    <Paper withBorder p="md" maw={640}>
      <Stack gap="md">
        {MAIL_KINDS.map((kind) => (
          <Switch
            key={kind}
            label={MAIL_LABELS[kind].label}
            description={MAIL_LABELS[kind].description}
            checked={current[kind]}
            onChange={(event) => update.mutate({ ...current, [kind]: event.currentTarget.checked })}
          />
        ))}
        <Text size="xs" c="dimmed">
          Password-reset links an admin mails you are always sent.
        </Text>
        {update.error && <Alert color="red">{update.error.message}</Alert>}
      </Stack>
    </Paper>
  );
}
