import { Alert, Center, Paper, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import { useSearchParams } from 'react-router-dom';
import { HvCaution } from '../../../components/hv-caution';
import { NewPasswordForm } from '../../../features/auth/components/new-password-form';

/** The page a one-time password-reset link opens (no session needed). */
export function ResetPasswordRoute() {
  useDocumentTitle('Set a new password · Ladderwright');
  const [searchParams] = useSearchParams();
  const token = searchParams.get('token') ?? '';
  return (
    <Stack gap={0} mih="100vh">
      <HvCaution />
      <Center style={{ flexGrow: 1 }} p="md">
        <Paper withBorder shadow="sm" radius="md" p="xl" w="100%" maw={420}>
          <Stack gap="lg">
            <div>
              <Title order={1} size="h2">
                Set a new password
              </Title>
              <Text c="dimmed" size="sm">
                This link works once.
              </Text>
            </div>
            {token ? (
              <NewPasswordForm token={token} />
            ) : (
              <Alert color="red">This page needs the link an admin gave you.</Alert>
            )}
          </Stack>
        </Paper>
      </Center>
    </Stack>
  );
}
