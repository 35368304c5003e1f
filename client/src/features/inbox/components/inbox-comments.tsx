import { Anchor, Table, Text } from '@mantine/core';
import type { InboxComment } from '@ladderwright/shared/api';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';

/** Open comment threads on my designs where someone else spoke last; each opens the revision's Sign-off. */
export function InboxComments({ comments }: { comments: InboxComment[] }) {
  if (comments.length === 0)
    return (
      <Text c="dimmed" size="sm">
        No open comment waits for your answer.
      </Text>
    );
  return (
    <Table striped aria-label="New comments">
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Design</Table.Th>
          <Table.Th>Revision</Table.Th>
          <Table.Th>From</Table.Th>
          <Table.Th>Comment</Table.Th>
          <Table.Th>Project</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {comments.map((comment) => (
          <Table.Tr key={comment.commentId}>
            <Table.Td>
              <Anchor
                component={Link}
                to={paths.signOff.getHref(comment.projectId, comment.designId, comment.revisionNumber)}
              >
                {comment.designName}
              </Anchor>
            </Table.Td>
            <Table.Td>{comment.revisionNumber}</Table.Td>
            <Table.Td>{comment.authorName}</Table.Td>
            <Table.Td>
              <Text size="sm" lineClamp={2}>
                {comment.excerpt}
              </Text>
            </Table.Td>
            <Table.Td>{comment.projectName}</Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}
