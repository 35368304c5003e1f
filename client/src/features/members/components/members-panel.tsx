import { useState } from 'react';
import { Alert, Button, Group, Paper, Select, Stack, Table, Text, TextInput, Title } from '@mantine/core';
import type { ProjectDetail } from '@ladderwright/shared/api';
import { PROJECT_ROLES, type ProjectRole } from '@ladderwright/shared/auth';
import { isApiError } from '../../../lib/api-client';
import { useAddMember } from '../api/add-member';
import { useChangeMemberRole } from '../api/change-member-role';
import { useRemoveMember } from '../api/remove-member';

/** The project's members; a lead adds by e-mail, changes project roles and removes (the last lead stays). */
export function MembersPanel({ project, myUserId }: { project: ProjectDetail; myUserId: string }) {
  const canManage = project.myRole === 'lead' && !project.isArchived;
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<ProjectRole>('engineer');
  const add = useAddMember(project.id);
  const change = useChangeMemberRole(project.id);
  const remove = useRemoveMember(project.id);
  const leadCount = project.members.filter((member) => member.role === 'lead').length;
  const failure = change.error ?? remove.error;

  return (
    <Stack gap="md">
      {canManage && (
        <Paper withBorder p="md">
          <form
            onSubmit={(event) => {
              event.preventDefault();
              add.mutate({ email: email.trim(), role }, { onSuccess: () => setEmail('') });
            }}
          >
            <Stack gap="xs">
              <Title order={2} size="h5">
                Add a member
              </Title>
              <Group align="flex-start" wrap="wrap">
                <TextInput
                  label="E-mail of the account"
                  placeholder="name@northfold.test"
                  type="email"
                  required
                  w={300}
                  value={email}
                  error={isApiError(add.error) && add.error.body.field === 'email' ? add.error.message : undefined}
                  onChange={(event) => setEmail(event.currentTarget.value)}
                />
                <Select
                  label="Project role"
                  data={[...PROJECT_ROLES]}
                  value={role}
                  allowDeselect={false}
                  w={160}
                  onChange={(value) => value && setRole(value)}
                />
                <Button type="submit" mt={25} loading={add.isPending} disabled={!email.trim()}>
                  Add
                </Button>
              </Group>
              {add.error && !(isApiError(add.error) && add.error.body.field === 'email') && (
                <Alert color="red">{add.error.message}</Alert>
              )}
            </Stack>
          </form>
        </Paper>
      )}
      {failure && (
        <Alert color="red" title="The membership did not change" role="alert">
          {failure.message}
        </Alert>
      )}
      <Table striped aria-label="Members" verticalSpacing="xs">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Name</Table.Th>
            <Table.Th>E-mail</Table.Th>
            <Table.Th w={170}>Project role</Table.Th>
            {canManage && <Table.Th w={110} />}
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {project.members.map((member) => {
            const isLastLead = member.role === 'lead' && leadCount === 1;
            return (
              <Table.Tr key={member.userId}>
                <Table.Td>
                  {member.displayName}
                  {member.userId === myUserId ? ' (you)' : ''}
                </Table.Td>
                <Table.Td>{member.email}</Table.Td>
                <Table.Td>
                  {canManage ? (
                    <Select
                      aria-label={`Project role of ${member.email}`}
                      size="xs"
                      data={PROJECT_ROLES.map((value) => ({
                        value,
                        label: value,
                        disabled: isLastLead && value !== 'lead',
                      }))}
                      value={member.role}
                      allowDeselect={false}
                      disabled={change.isPending}
                      onChange={(value) =>
                        value && value !== member.role && change.mutate({ userId: member.userId, role: value })
                      }
                    />
                  ) : (
                    member.role
                  )}
                </Table.Td>
                {canManage && (
                  <Table.Td>
                    <Button
                      size="compact-sm"
                      variant="subtle"
                      color="ember"
                      disabled={isLastLead || remove.isPending}
                      title={isLastLead ? 'A project keeps at least one lead' : undefined}
                      aria-label={`Remove ${member.email}`}
                      onClick={() => remove.mutate(member.userId)}
                    >
                      Remove
                    </Button>
                  </Table.Td>
                )}
              </Table.Tr>
            );
          })}
        </Table.Tbody>
      </Table>
      {canManage && leadCount === 1 && (
        <Text size="xs" c="dimmed">
          The last lead cannot be removed or given another role: make another member lead first.
        </Text>
      )}
    </Stack>
  );
}
