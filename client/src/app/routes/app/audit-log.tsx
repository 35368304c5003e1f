import { Alert, Stack, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { AdminTabs } from '../../../features/admin/components/admin-tabs';
import { AuditLogPanel } from '../../../features/admin/components/audit-log-panel';
import { requireUser } from './root';

export function auditLogLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };
}

export function AuditLogRoute() {
  useDocumentTitle('Audit log · Ladderwright');
  const { data: me } = useMe();
  return (
    <Stack gap="lg">
      <Title order={1} size="h2">
        Audit log
      </Title>
      <AdminTabs active="audit-log" />
      {me?.role === 'admin' ? <AuditLogPanel /> : <Alert color="gray">The audit log is for admins.</Alert>}
    </Stack>
  );
}
