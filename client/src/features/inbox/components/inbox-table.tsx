import { Anchor, Table, Text } from '@mantine/core';
import type { InboxItem } from '@ladderwright/shared/api';
import { Link } from 'react-router-dom';
import { RevisionStateBadge } from '../../../components/revision-state-badge';
import { paths } from '../../../config/paths';

/** Where an item's link goes: the Sign-off to decide or release, or the Workbench to answer a return. */
export type InboxTarget = 'sign-off' | 'workbench';

export function InboxTable({
  items,
  emptyText,
  label,
  target = 'sign-off',
}: {
  items: InboxItem[];
  emptyText: string;
  label: string;
  target?: InboxTarget;
}) {
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
              <Anchor
                component={Link}
                to={
                  target === 'workbench'
                    ? paths.design.getHref(item.projectId, item.designId, item.revisionNumber)
                    : paths.signOff.getHref(item.projectId, item.designId, item.revisionNumber)
                }
              >
                {item.designName}
              </Anchor>
            </Table.Td>
            <Table.Td>r{item.revisionNumber}</Table.Td>
            <Table.Td>
              <RevisionStateBadge state={item.state} />
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
