import { Table, Text } from '@mantine/core';
import type { SignOffTransition } from '@ladderwright/shared/api';
import type { RevisionState } from '@ladderwright/shared/reviews';
import { formatDateTime } from '../../../lib/format-date';

/** The audit history of the Sign-off: who moved the revision, when, from which state to which, and why. */
export function SignOffHistory({
  history,
  state,
}: {
  history: readonly SignOffTransition[];
  /** The revision's state: one past draft with no step on record was stored in it (demo data or an import). */
  state: RevisionState;
}) {
  if (history.length === 0) {
    return (
      <Text size="sm" c="dimmed">
        {state === 'draft' ? 'No Sign-off step yet.' : `No Sign-off step on record: the revision was stored ${state}.`}
      </Text>
    );
  }
  return (
    <Table aria-label="Sign-off history" verticalSpacing={6}>
      <Table.Thead>
        <Table.Tr>
          <Table.Th>When</Table.Th>
          <Table.Th>Who</Table.Th>
          <Table.Th>From</Table.Th>
          <Table.Th>To</Table.Th>
          <Table.Th>Note</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {history.map((entry) => (
          <Table.Tr key={entry.id}>
            <Table.Td>{formatDateTime(entry.at)}</Table.Td>
            <Table.Td>{entry.actorName ?? 'Ladderwright'}</Table.Td>
            <Table.Td>{entry.fromState}</Table.Td>
            <Table.Td>{entry.toState}</Table.Td>
            <Table.Td>{entry.note}</Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}
