import { Alert, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { AccountsPanel } from '../../../features/admin/components/accounts-panel';
import { AdminTabs } from '../../../features/admin/components/admin-tabs';
import { requireUser } from './root';

export function accountsLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };
}

export function AccountsRoute() {
  useDocumentTitle('Accounts · Ladderwright');
  const { data: me } = useMe();
  return (
    <Stack gap="lg">
      <Title order={1} size="h2">
        Accounts
      </Title>
      <AdminTabs active="accounts" />
      {me?.role === 'admin' ? (
        <>
          <Text c="dimmed" size="sm">
            Deactivating an account ends its sessions at once; its designs, comments and audit entries stay.
          </Text>
          <AccountsPanel me={me} />
        </>
      ) : (
        <Alert color="gray">Accounts are managed by an admin.</Alert>
      )}
    </Stack>
  );
}
