import { Button, Group, Table, Text } from '@mantine/core';
import { useBenchRuns } from '../api/get-bench-runs';
import { useDeleteBenchRun } from '../api/delete-bench-run';
import { BenchVerdictBadge } from './bench-verdict-badge';
import { formatDateTime } from '../../../lib/format-date';

export interface BenchRunListProps {
  projectId: string;
  designId: string;
  revisionNumber: number;
  selectedId: string | null;
  onSelect: (benchRunId: string) => void;
  canDelete: boolean;
  /** What to do when there is none yet (default: where they are uploaded). */
  emptyHint?: string;
}

/** The revision's bench runs with their verdicts (also what Sign-off shows). */
export function BenchRunList({
  projectId,
  designId,
  revisionNumber,
  selectedId,
  onSelect,
  canDelete,
  emptyHint,
}: BenchRunListProps) {
  const { data: runs, isPending, error } = useBenchRuns(projectId, designId, revisionNumber);
  const remove = useDeleteBenchRun(projectId, designId, revisionNumber);
  if (isPending) return <Text size="sm">Loading bench runs…</Text>;
  if (error) return <Text c="red">{error.message}</Text>;
  if (runs.length === 0)
    return (
      <Text size="sm">
        No bench runs for this revision yet. {emptyHint ?? 'They are uploaded on the revision’s Bench runs page.'}
      </Text>
    );
  return (
    <Table aria-label="Bench runs of this revision" highlightOnHover>
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Uploaded</Table.Th>
          <Table.Th>Kind</Table.Th>
          <Table.Th>Title</Table.Th>
          <Table.Th>Verdict</Table.Th>
          <Table.Th aria-label="Actions" />
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {runs.map((run) => (
          <Table.Tr key={run.id} bg={run.id === selectedId ? 'var(--mantine-color-default-hover)' : undefined}>
            <Table.Td>
              {formatDateTime(run.createdAt)} · {run.uploadedByName}
            </Table.Td>
            <Table.Td>{run.kind === 'load-sweep' ? 'load sweep' : 'scope capture'}</Table.Td>
            <Table.Td>{run.title}</Table.Td>
            <Table.Td>
              <BenchVerdictBadge verdict={run.verdict} marginPct={run.marginPct} />
            </Table.Td>
            <Table.Td>
              <Group gap="xs" justify="end">
                <Button size="xs" variant="default" onClick={() => onSelect(run.id)}>
                  Show
                </Button>
                {canDelete && (
                  <Button size="xs" variant="subtle" color="red" onClick={() => remove.mutate(run.id)}>
                    Delete
                  </Button>
                )}
              </Group>
            </Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}
