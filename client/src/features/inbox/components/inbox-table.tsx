import { Anchor, Badge, Table, Text } from '@mantine/core';
import type { InboxItem } from '@ladderwright/shared/api';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';

export function InboxTable({ items, emptyText, label }: { items: InboxItem[]; emptyText: string; label: string }) {
  if (items.length === 0)
    return (
      <Text c="dimmed" size="sm">
        {emptyText}
      </Text>
    );
  return (
    <Table striped aria-label={label}>
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Design</Table.Th>
          <Table.Th>Revision</Table.Th>
          <Table.Th>State</Table.Th>
          <Table.Th>Author</Table.Th>
          <Table.Th>Reviewers</Table.Th>
          <Table.Th>Project</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {items.map((item) => (
          <Table.Tr key={`${item.designId}-${item.revisionNumber}`}>
            <Table.Td>
              <Anchor component={Link} to={paths.signOff.getHref(item.projectId, item.designId, item.revisionNumber)}>
                {item.designName}
              </Anchor>
            </Table.Td>
            <Table.Td>{item.revisionNumber}</Table.Td>
            <Table.Td>
              <Badge variant="light">{item.state}</Badge>
            </Table.Td>
            <Table.Td>{item.authorName}</Table.Td>
            <Table.Td>{item.reviewerNames.join(', ')}</Table.Td>
            <Table.Td>{item.projectName}</Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}
