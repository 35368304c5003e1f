import { useState } from 'react';
import { Alert, Button, Group, Paper, PasswordInput, Select, SimpleGrid, Stack, TextInput, Title } from '@mantine/core';
import { passwordPolicyProblem, USER_ROLES, type UserRole } from '@ladderwright/shared/auth';
import { isApiError } from '../../../lib/api-client';
import { useCreateUser } from '../api/create-user';

/** A new account with its first password (the admin passes it on, or issues a reset link afterwards). */
export function CreateAccountForm({ onClose }: { onClose: () => void }) {
  const [email, setEmail] = useState('');
  const [displayName, setDisplayName] = useState('');
  const [role, setRole] = useState<UserRole>('engineer');
  const [password, setPassword] = useState('');
  const create = useCreateUser();
  const passwordProblem = password ? passwordPolicyProblem(password) : null;
  const fieldError = (field: string) =>
    isApiError(create.error) && create.error.body.field === field ? create.error.message : undefined;

  return (
    <Paper withBorder p="md">
      <form
        onSubmit={(event) => {
          event.preventDefault();
          create.mutate(
            { email: email.trim(), displayName: displayName.trim(), role, password },
            { onSuccess: onClose },
          );
        }}
      >
        <Stack gap="sm">
          <Title order={2} size="h5">
            New account
          </Title>
          <SimpleGrid cols={{ base: 1, md: 2 }}>
            <TextInput
              label="E-mail"
              required
              type="email"
              value={email}
              error={fieldError('email')}
              onChange={(event) => setEmail(event.currentTarget.value)}
            />
            <TextInput
              label="Name"
              required
              value={displayName}
              error={fieldError('displayName')}
              onChange={(event) => setDisplayName(event.currentTarget.value)}
            />
            <Select
              label="Account role"
              data={[...USER_ROLES]}
              value={role}
              allowDeselect={false}
              onChange={(value) => value && setRole(value)}
            />
            <PasswordInput
              label="First password"
              description="At least 10 characters with a letter and a digit"
              required
              value={password}
              error={passwordProblem ? `Password ${passwordProblem}` : fieldError('password')}
              onChange={(event) => setPassword(event.currentTarget.value)}
            />
          </SimpleGrid>
          {create.error && !fieldError('email') && !fieldError('password') && !fieldError('displayName') && (
            <Alert color="red">{create.error.message}</Alert>
          )}
          <Group justify="flex-end">
            <Button variant="default" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit" loading={create.isPending} disabled={!email || !displayName || !!passwordProblem}>
              Create account
            </Button>
          </Group>
        </Stack>
      </form>
    </Paper>
  );
}
