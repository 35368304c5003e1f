import { useState } from 'react';
import { Alert, Anchor, Group, Loader, Select, Stack, Table, Text, Title } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { RevisionSummary } from '@ladderwright/shared/api';
import { paths } from '../../../config/paths';
import { formatDateTime } from '../../../lib/format-date';
import { useCompareRevisions } from '../api/compare-revisions';
import { RevisionComparison } from './revision-comparison';
import { RevisionStateBadge } from '../../../components/revision-state-badge';

export interface RevisionHistoryProps {
  projectId: string;
  designId: string;
  revisions: readonly RevisionSummary[];
  openRevisionNumber: number;
}

/** Every revision of a design, and any two side by side: inputs that differ and all headline results with deltas. */
export function RevisionHistory({ projectId, designId, revisions, openRevisionNumber }: RevisionHistoryProps) {
  const sorted = [...revisions].sort((a, b) => b.number - a.number);
  const newest = sorted[0]?.number ?? 1;
  const [a, setA] = useState<number | null>(sorted[1]?.number ?? null);
  const [b, setB] = useState<number | null>(newest);
  const comparison = useCompareRevisions(
    projectId,
    a === null ? null : { designId, revisionNumber: a },
    b === null ? null : { designId, revisionNumber: b },
  );
  const options = sorted.map((r) => ({
    value: String(r.number),
    label: `r${r.number} · ${r.changeNote || 'no note'}`,
  }));

  return (
    <Stack gap="md">
      <Table verticalSpacing={4} aria-label="Revisions">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Revision</Table.Th>
            <Table.Th>State</Table.Th>
            <Table.Th>Author</Table.Th>
            <Table.Th>Saved</Table.Th>
            <Table.Th>Change note</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {sorted.map((revision) => (
            <Table.Tr key={revision.number} aria-current={revision.number === openRevisionNumber ? 'true' : undefined}>
              <Table.Td>
                <Anchor
                  component={Link}
                  to={paths.design.getHref(projectId, designId, revision.number)}
                  fw={revision.number === openRevisionNumber ? 700 : 400}
                >
                  r{revision.number}
                </Anchor>
              </Table.Td>
              <Table.Td>
                <RevisionStateBadge state={revision.state} />
              </Table.Td>
              <Table.Td>{revision.authorName}</Table.Td>
              <Table.Td>{formatDateTime(revision.createdAt)}</Table.Td>
              <Table.Td>{revision.changeNote}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>

      {sorted.length < 2 ? (
        <Text size="sm" c="dimmed">
          One revision so far: save another to compare the two here, or compare this one with another design.
        </Text>
      ) : (
        <>
          <Title order={3} size="h5">
            Compare two revisions
          </Title>
          <Group gap="sm">
            <Select
              label="Revision A"
              data={options}
              value={a === null ? null : String(a)}
              onChange={(v) => setA(v ? Number(v) : null)}
              w={260}
            />
            <Select
              label="Revision B"
              data={options}
              value={b === null ? null : String(b)}
              onChange={(v) => setB(v ? Number(v) : null)}
              w={260}
            />
          </Group>
          {a !== null && a === b && (
            <Text size="sm" c="dimmed">
              Pick two different revisions.
            </Text>
          )}
          {comparison.isFetching && <Loader size="sm" aria-label="Comparing" />}
          {comparison.isError && <Alert color="red">{comparison.error.message}</Alert>}
          {comparison.data && <RevisionComparison comparison={comparison.data} />}
        </>
      )}
      <Anchor
        component={Link}
        size="sm"
        to={paths.compareDesigns.getHref(projectId, { designId, revisionNumber: openRevisionNumber })}
      >
        Compare with a revision of another design…
      </Anchor>
    </Stack>
  );
}
