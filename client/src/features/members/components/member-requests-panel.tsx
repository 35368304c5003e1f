import { useState } from 'react';
import {
  Alert,
  Badge,
  Button,
  Group,
  Paper,
  Select,
  Stack,
  Table,
  Text,
  TextInput,
  Textarea,
  Title,
} from '@mantine/core';
import { MEMBER_REQUEST_NOTE_MAX, type MemberRequest, type ProjectDetail } from '@ladderwright/shared/api';
import { canActInProject, PROJECT_ROLES, type ProjectRole } from '@ladderwright/shared/auth';
import { isApiError } from '../../../lib/api-client';
import { formatDateTime } from '../../../lib/format-date';
import { useCreateMemberRequest } from '../api/create-member-request';
import { useDecideMemberRequest } from '../api/decide-member-request';
import { useMemberRequests } from '../api/get-member-requests';

const STATE_COLORS: Record<MemberRequest['state'], string> = {
  pending: 'indigo',
  accepted: 'verdigris',
  declined: 'gray',
};

function fieldError(error: Error | null, field: string): string | undefined {
  return isApiError(error) && error.body.field === field ? error.message : undefined;
}

/** A member who is not a lead asks the leads to add a person, with a proposed role and a short note. */
function RequestForm({ projectId }: { projectId: string }) {
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<ProjectRole>('engineer');
  const [note, setNote] = useState('');
  const create = useCreateMemberRequest(projectId);
  const isFieldError = ['email', 'role', 'note'].some((field) => fieldError(create.error, field));
  return (
    <Paper withBorder p="md">
      <form
        onSubmit={(event) => {
          event.preventDefault();
          create.mutate(
            { email: email.trim(), role, ...(note.trim() ? { note: note.trim() } : {}) },
            {
              onSuccess: () => {
                setEmail('');
                setNote('');
              },
            },
          );
        }}
      >
        <Stack gap="xs">
          <Title order={2} size="h5">
            Ask the leads to add someone
          </Title>
          <Group align="flex-start" wrap="wrap">
            <TextInput
              label="E-mail"
              placeholder="name@northfold.test"
              type="email"
              required
              w={300}
              value={email}
              error={fieldError(create.error, 'email')}
              onChange={(event) => setEmail(event.currentTarget.value)}
            />
            <Select
              label="Proposed project role"
              data={[...PROJECT_ROLES]}
              value={role}
              allowDeselect={false}
              w={180}
              onChange={(value) => value && setRole(value)}
            />
          </Group>
          <Textarea
            label="Note for the leads"
            description={`Optional, up to ${MEMBER_REQUEST_NOTE_MAX} characters`}
            maxLength={MEMBER_REQUEST_NOTE_MAX}
            autosize
            minRows={2}
            maw={640}
            value={note}
            error={fieldError(create.error, 'note')}
            onChange={(event) => setNote(event.currentTarget.value)}
          />
          <Group>
            <Button type="submit" loading={create.isPending} disabled={!email.trim()}>
              Send request
            </Button>
            {create.isSuccess && !create.isPending && (
              <Text size="sm" c="dimmed">
                Sent: the leads see it in their Inbox.
              </Text>
            )}
          </Group>
          {create.error && !isFieldError && <Alert color="red">{create.error.message}</Alert>}
        </Stack>
      </form>
    </Paper>
  );
}

/** A lead's Accept and Decline (with an optional reason) on one pending request. */
function Decision({ projectId, request }: { projectId: string; request: MemberRequest }) {
  const decide = useDecideMemberRequest(projectId);
  const [isDeclining, setIsDeclining] = useState(false);
  const [reason, setReason] = useState('');
  return (
    <Stack gap={4}>
      {isDeclining ? (
        <Group gap="xs" align="flex-end" wrap="nowrap">
          <TextInput
            size="xs"
            label="Reason (optional)"
            maxLength={MEMBER_REQUEST_NOTE_MAX}
            value={reason}
            onChange={(event) => setReason(event.currentTarget.value)}
          />
          <Button
            size="xs"
            color="ember"
            loading={decide.isPending}
            onClick={() => decide.mutate({ requestId: request.id, decision: 'decline', reason: reason.trim() })}
          >
            Decline
          </Button>
          <Button size="xs" variant="default" onClick={() => setIsDeclining(false)}>
            Back
          </Button>
        </Group>
      ) : (
        <Group gap="xs" wrap="nowrap">
          <Button
            size="xs"
            loading={decide.isPending}
            onClick={() => decide.mutate({ requestId: request.id, decision: 'accept' })}
          >
            Accept
          </Button>
          <Button size="xs" variant="default" onClick={() => setIsDeclining(true)}>
            Decline…
          </Button>
        </Group>
      )}
      {decide.error && (
        <Text size="xs" c="red" role="alert">
          {decide.error.message}
        </Text>
      )}
    </Stack>
  );
}

function Outcome({ request }: { request: MemberRequest }) {
  if (request.state === 'pending') return <Text size="sm">waiting for a lead</Text>;
  return (
    <Text size="sm">
      {request.state} by {request.decidedByName ?? 'a lead'}
      {request.decidedAt ? `, ${formatDateTime(request.decidedAt)}` : ''}
      {request.declineReason ? `: ${request.declineReason}` : ''}
    </Text>
  );
}

/**
 * Member requests on the Members page: the request form for engineers and reviewers with their own requests and
 * outcomes; for a lead, every pending request with Accept and Decline, then the latest decided.
 */
export function MemberRequestsPanel({ project }: { project: ProjectDetail }) {
  const requests = useMemberRequests(project.id);
  const isLead = project.myRole === 'lead';
  const canDecide = canActInProject(project, 'members.manage');
  const canAsk = canActInProject(project, 'members.request');
  const rows = requests.data ?? [];
  const pendingCount = rows.filter((request) => request.state === 'pending').length;
  return (
    <Stack gap="md" component="section" aria-labelledby="member-requests-heading">
      <Group gap="xs">
        <Title order={2} size="h4" id="member-requests-heading">
          Member requests
        </Title>
        {pendingCount > 0 && (
          <Badge color="ember" variant="light">
            {pendingCount} pending
          </Badge>
        )}
      </Group>
      {canAsk && <RequestForm projectId={project.id} />}
      {requests.isError && <Alert color="red">{requests.error.message}</Alert>}
      {requests.isSuccess && rows.length === 0 && (
        <Text size="sm" c="dimmed">
          {isLead ? 'No member request waits for you.' : 'You have not asked for anyone yet.'}
        </Text>
      )}
      {rows.length > 0 && (
        <Table striped aria-label="Member requests" verticalSpacing="xs">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>E-mail</Table.Th>
              <Table.Th w={110}>Role</Table.Th>
              <Table.Th>Asked by</Table.Th>
              <Table.Th>Note</Table.Th>
              <Table.Th w={110}>State</Table.Th>
              <Table.Th>{canDecide ? 'Decision' : 'Outcome'}</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {rows.map((request) => (
              <Table.Tr key={request.id} data-member-request={request.email}>
                <Table.Td>{request.email}</Table.Td>
                <Table.Td>{request.role}</Table.Td>
                <Table.Td>
                  <Text size="sm">{request.requesterName}</Text>
                  <Text size="xs" c="dimmed">
                    {formatDateTime(request.createdAt)}
                  </Text>
                </Table.Td>
                <Table.Td>
                  <Text size="sm" lineClamp={3}>
                    {request.note || '—'}
                  </Text>
                </Table.Td>
                <Table.Td>
                  <Badge variant="light" radius="sm" tt="none" color={STATE_COLORS[request.state]}>
                    {request.state}
                  </Badge>
                </Table.Td>
                <Table.Td>
                  {canDecide && request.state === 'pending' ? (
                    <Decision projectId={project.id} request={request} />
                  ) : (
                    <Outcome request={request} />
                  )}
                </Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
    </Stack>
  );
}
