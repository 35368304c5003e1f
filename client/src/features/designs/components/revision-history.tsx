import { useState } from 'react';
import { Alert, Anchor, Group, Loader, Select, Stack, Table, Text, Title } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { RevisionSummary } from '@ladderwright/shared/api';
import { paths } from '../../../config/paths';
import { useCompareRevisions } from '../api/compare-revisions';
import { formatFieldDelta, formatFieldValue, formatPercentDelta } from '../field-quantity';
import { RevisionStateBadge } from './revision-state-badge';

export interface RevisionHistoryProps {
  projectId: string;
  designId: string;
  revisions: readonly RevisionSummary[];
  openRevisionNumber: number;
}

const dateFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** Every revision of a design, and any two side by side: inputs that differ and all headline results with deltas. */
export function RevisionHistory({ projectId, designId, revisions, openRevisionNumber }: RevisionHistoryProps) {
  const sorted = [...revisions].sort((a, b) => b.number - a.number);
  const newest = sorted[0]?.number ?? 1;
  const [a, setA] = useState<number | null>(sorted[1]?.number ?? null);
  const [b, setB] = useState<number | null>(newest);
  const comparison = useCompareRevisions(projectId, designId, a, b);
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
              <Table.Td>{dateFormat.format(new Date(revision.createdAt))}</Table.Td>
              <Table.Td>{revision.changeNote}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>

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
      {comparison.data && (
        <SimpleComparison
          aNumber={comparison.data.a.number}
          bNumber={comparison.data.b.number}
          inputs={comparison.data.inputs.map((d) => ({
            key: d.path,
            label: d.path,
            a: d.a,
            b: d.b,
            delta: d.delta ?? null,
          }))}
          results={comparison.data.results.map((d) => ({
            key: d.key,
            label: d.label ?? d.key,
            a: d.a,
            b: d.b,
            delta: d.delta,
            deltaPct: d.deltaPct,
          }))}
        />
      )}
    </Stack>
  );
}

interface ComparisonRow {
  key: string;
  label: string;
  a: unknown;
  b: unknown;
  delta: number | null;
  deltaPct?: number | null;
}

function SimpleComparison({
  aNumber,
  bNumber,
  inputs,
  results,
}: {
  aNumber: number;
  bNumber: number;
  inputs: ComparisonRow[];
  results: ComparisonRow[];
}) {
  return (
    <Stack gap="sm">
      <ComparisonTable
        title={`Inputs that differ (${inputs.length})`}
        aNumber={aNumber}
        bNumber={bNumber}
        rows={inputs}
      />
      <ComparisonTable title="Results" aNumber={aNumber} bNumber={bNumber} rows={results} hasPercent />
    </Stack>
  );
}

function ComparisonTable({
  title,
  aNumber,
  bNumber,
  rows,
  hasPercent = false,
}: {
  title: string;
  aNumber: number;
  bNumber: number;
  rows: ComparisonRow[];
  hasPercent?: boolean;
}) {
  return (
    <Table.ScrollContainer minWidth={560}>
      <Table verticalSpacing={4} striped aria-label={title}>
        <Table.Caption>{title}</Table.Caption>
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Field</Table.Th>
            <Table.Th>r{aNumber}</Table.Th>
            <Table.Th>r{bNumber}</Table.Th>
            <Table.Th>Δ (B − A)</Table.Th>
            {hasPercent && <Table.Th>Δ %</Table.Th>}
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {rows.length === 0 && (
            <Table.Tr>
              <Table.Td colSpan={hasPercent ? 5 : 4}>
                <Text size="sm" c="dimmed">
                  No differences.
                </Text>
              </Table.Td>
            </Table.Tr>
          )}
          {rows.map((row) => (
            <Table.Tr key={row.key}>
              <Table.Td>
                <Text size="xs" ff="monospace">
                  {row.label}
                </Text>
              </Table.Td>
              <Table.Td>{formatFieldValue(row.key, row.a)}</Table.Td>
              <Table.Td>{formatFieldValue(row.key, row.b)}</Table.Td>
              <Table.Td>{formatFieldDelta(row.key, row.delta)}</Table.Td>
              {hasPercent && <Table.Td>{formatPercentDelta(row.deltaPct)}</Table.Td>}
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Table.ScrollContainer>
  );
}
