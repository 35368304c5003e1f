import { useState } from 'react';
import {
  Alert,
  Badge,
  Button,
  Group,
  Pagination,
  SegmentedControl,
  Select,
  Stack,
  Table,
  Text,
  TextInput,
} from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import type { CurrentUser, UserSummary } from '@ladderwright/shared/api';
import { USER_ROLES } from '@ladderwright/shared/auth';
import { useUsers } from '../api/get-users';
import { useUpdateUser } from '../api/update-user';
import { CreateAccountForm } from './create-account-form';
import { ResetLinkModal } from './reset-link-modal';

const PAGE_SIZE = 20;
type StatusFilter = 'all' | 'active' | 'deactivated';

/** Accounts: search and pages, role changes, deactivation and one-time password-reset links. */
export function AccountsPanel({ me }: { me: CurrentUser }) {
  const [search, setSearch] = useState('');
  const [debounced] = useDebouncedValue(search.trim(), 250);
  const [status, setStatus] = useState<StatusFilter>('all');
  const [page, setPage] = useState(1);
  const [resetFor, setResetFor] = useState<UserSummary | null>(null);
  const [isCreating, setIsCreating] = useState(false);
  const users = useUsers({
    ...(debounced ? { q: debounced } : {}),
    ...(status !== 'all' ? { status } : {}),
    page,
    pageSize: PAGE_SIZE,
  });
  const update = useUpdateUser();
  const pageCount = users.data ? Math.max(1, Math.ceil(users.data.total / PAGE_SIZE)) : 1;

  return (
    <Stack gap="md">
      <Group justify="space-between" align="flex-end" wrap="wrap">
        <Group align="flex-end" wrap="wrap">
          <TextInput
            label="Search"
            placeholder="E-mail or name"
            value={search}
            onChange={(event) => {
              setSearch(event.currentTarget.value);
              setPage(1);
            }}
            w={260}
          />
          <SegmentedControl
            aria-label="Account state"
            value={status}
            onChange={(value) => {
              setStatus(value);
              setPage(1);
            }}
            data={[
              { value: 'all', label: 'All' },
              { value: 'active', label: 'Active' },
              { value: 'deactivated', label: 'Deactivated' },
            ]}
          />
        </Group>
        <Button onClick={() => setIsCreating(true)}>New account</Button>
      </Group>
      {isCreating && <CreateAccountForm onClose={() => setIsCreating(false)} />}
      {users.isError && <Alert color="red">{users.error.message}</Alert>}
      {update.error && (
        <Alert color="red" title="The account did not change" role="alert">
          {update.error.message}
        </Alert>
      )}
      <Table.ScrollContainer minWidth={900}>
        <Table striped highlightOnHover aria-label="Accounts" verticalSpacing="xs">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Name</Table.Th>
              <Table.Th>E-mail</Table.Th>
              <Table.Th w={150}>Account role</Table.Th>
              <Table.Th w={110}>State</Table.Th>
              <Table.Th>Actions</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {users.data?.items.map((user) => {
              const isMe = user.id === me.id;
              return (
                <Table.Tr key={user.id}>
                  <Table.Td>{user.displayName}</Table.Td>
                  <Table.Td>{user.email}</Table.Td>
                  <Table.Td>
                    <Select
                      aria-label={`Account role of ${user.email}`}
                      size="xs"
                      data={[...USER_ROLES]}
                      value={user.role}
                      allowDeselect={false}
                      disabled={isMe || update.isPending}
                      onChange={(role) =>
                        role && role !== user.role && update.mutate({ userId: user.id, request: { role: role } })
                      }
                    />
                  </Table.Td>
                  <Table.Td>
                    <Badge color={user.isActive ? 'verdigris' : 'gray'} variant="light" style={{ overflow: 'visible' }}>
                      {user.isActive ? 'active' : 'deactivated'}
                    </Badge>
                  </Table.Td>
                  <Table.Td>
                    <Group gap="xs" wrap="nowrap">
                      <Button
                        size="compact-sm"
                        variant="default"
                        disabled={!user.isActive}
                        onClick={() => setResetFor(user)}
                        aria-label={`Reset the password of ${user.email}`}
                      >
                        Reset password
                      </Button>
                      <Button
                        size="compact-sm"
                        variant="subtle"
                        color={user.isActive ? 'ember' : undefined}
                        disabled={isMe || update.isPending}
                        onClick={() => update.mutate({ userId: user.id, request: { isActive: !user.isActive } })}
                        aria-label={`${user.isActive ? 'Deactivate' : 'Reactivate'} ${user.email}`}
                      >
                        {user.isActive ? 'Deactivate' : 'Reactivate'}
                      </Button>
                    </Group>
                  </Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
      {users.data && users.data.items.length === 0 && (
        <Text size="sm" c="dimmed">
          No account matches.
        </Text>
      )}
      <Group justify="space-between">
        <Text size="sm" c="dimmed">
          {users.data ? `${users.data.total} account${users.data.total === 1 ? '' : 's'}` : ''}
        </Text>
        <Pagination total={pageCount} value={page} onChange={setPage} size="sm" />
      </Group>
      {resetFor && <ResetLinkModal user={resetFor} onClose={() => setResetFor(null)} />}
    </Stack>
  );
}
