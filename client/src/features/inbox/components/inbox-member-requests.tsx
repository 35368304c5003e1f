import { Anchor, Table, Text } from '@mantine/core';
import type { InboxMemberRequest } from '@ladderwright/shared/api';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { formatDateTime } from '../../../lib/format-date';

/** Pending requests to add a person to a project I lead; each opens the project's Members page to decide. */
export function InboxMemberRequests({ requests }: { requests: InboxMemberRequest[] }) {
  return (
    <Table striped aria-label="Member requests">
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Person</Table.Th>
          <Table.Th>Proposed role</Table.Th>
          <Table.Th>Asked by</Table.Th>
          <Table.Th>Project</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {requests.map((request) => (
          <Table.Tr key={request.requestId}>
            <Table.Td>
              <Anchor component={Link} to={paths.projectMembers.getHref(request.projectId)}>
                {request.email}
              </Anchor>
            </Table.Td>
            <Table.Td>{request.role}</Table.Td>
            <Table.Td>
              <Text size="sm">{request.requesterName}</Text>
              <Text size="xs" c="dimmed">
                {formatDateTime(request.createdAt)}
              </Text>
            </Table.Td>
            <Table.Td>{request.projectName}</Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}
