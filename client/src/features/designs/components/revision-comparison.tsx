import { useState } from 'react';
import { Alert, Badge, Group, List, Stack, Switch, Table, Text } from '@mantine/core';
import type { ComparedRevisions as Comparison } from '../api/compare-revisions';
import { documentFieldLabel, formatFieldDelta, formatFieldValue, resultFieldLabel } from '@ladderwright/shared/designs';
import type { CapacitorPlace } from '@ladderwright/shared/multiplier';
import { describeMargin, mergeCheckRows, type CheckRow } from '@ladderwright/shared/safety';
import { formatDateTime } from '../../../lib/format-date';
import { RevisionStateBadge } from '../../../components/revision-state-badge';
import classes from './revision-comparison.module.css';

export interface RevisionComparisonProps {
  comparison: Comparison;
}

function placeText(place: CapacitorPlace): string {
  return `stage ${place.stage}, ${place.column.replace('-', ' ')}`;
}

/**
 * B against A, bounded: a signed percentage up to a doubling (`+4.38 %`, `−62.4 %`), a multiple beyond it (`3.1×`),
 * and "sign changes" when the two have opposite signs (a percentage of that says nothing).
 */
function formatRelative(a: number | null, b: number | null, deltaPct: number | null | undefined): string {
  if (deltaPct === null || deltaPct === undefined || a === null || b === null) return '—';
  if (deltaPct === 0) return '0 %';
  if (a * b < 0) return 'sign changes';
  if (deltaPct >= 100) return `${Number((1 + deltaPct / 100).toPrecision(2)).toString()}×`;
  return `${deltaPct > 0 ? '+' : '−'}${Number(Math.abs(deltaPct).toPrecision(3)).toString()} %`;
}

/**
 * Two revisions side by side (of one design or of two): who and what they are, the capacitors that sit elsewhere
 * in B's ladder, the inputs that differ, every headline result, and the Checks whose verdict differs; rows that
 * differ are marked ("changed") and tinted.
 */
export function RevisionComparison({ comparison }: RevisionComparisonProps) {
  const { a, b, designs } = comparison;
  const sideName = (side: 'a' | 'b') => {
    const design = designs[side];
    const revision = side === 'a' ? a : b;
    return designs.a.id === designs.b.id ? `r${revision.number}` : `${design.name} r${revision.number}`;
  };
  return (
    <Stack gap="md">
      <Group gap="lg" align="flex-start" wrap="wrap">
        {(['a', 'b'] as const).map((side) => {
          const revision = side === 'a' ? a : b;
          return (
            <div key={side} aria-label={`Side ${side.toUpperCase()}`}>
              <Group gap="xs">
                <Badge variant="outline" radius="sm" tt="none" style={{ maxWidth: 'none' }}>
                  {side.toUpperCase()}
                </Badge>
                <Text fw={600}>{sideName(side)}</Text>
                <RevisionStateBadge state={revision.state} />
              </Group>
              <Text size="xs" c="dimmed">
                {revision.changeNote || 'no change note'} · {revision.authorName} · {formatDateTime(revision.createdAt)}
              </Text>
            </div>
          );
        })}
      </Group>

      {comparison.roleChanges.length > 0 && (
        <Alert color="ember" title={`Capacitors that sit elsewhere in the ladder of ${sideName('b')}`}>
          <List size="sm">
            {comparison.roleChanges.map((change) => (
              <List.Item key={change.index}>
                C{change.index + 1}: {placeText(change.from)} → {placeText(change.to)}
              </List.Item>
            ))}
          </List>
        </Alert>
      )}

      <Table.ScrollContainer minWidth={520}>
        <Table verticalSpacing={4} striped aria-label={`Inputs that differ (${comparison.inputs.length})`}>
          <Table.Caption>Inputs that differ ({comparison.inputs.length})</Table.Caption>
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Field</Table.Th>
              <Table.Th>{sideName('a')}</Table.Th>
              <Table.Th>{sideName('b')}</Table.Th>
              <Table.Th>Δ (B − A)</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {comparison.inputs.length === 0 && (
              <Table.Tr>
                <Table.Td colSpan={4}>
                  <Text size="sm" c="dimmed">
                    No differences.
                  </Text>
                </Table.Td>
              </Table.Tr>
            )}
            {comparison.inputs.map((input) => {
              const { label, display } = documentFieldLabel(input.path);
              return (
                <Table.Tr key={input.path} title={input.path}>
                  <Table.Td>{label}</Table.Td>
                  <Table.Td>{formatFieldValue(input.a, display)}</Table.Td>
                  <Table.Td>{formatFieldValue(input.b, display)}</Table.Td>
                  <Table.Td>{formatFieldDelta(input.delta, display)}</Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>

      <Table.ScrollContainer minWidth={560}>
        <Table verticalSpacing={4} aria-label="Results">
          <Table.Caption>Headline results (changed ones tinted)</Table.Caption>
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Result</Table.Th>
              <Table.Th>{sideName('a')}</Table.Th>
              <Table.Th>{sideName('b')}</Table.Th>
              <Table.Th>Δ (B − A)</Table.Th>
              <Table.Th>B against A</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {comparison.results.map((result) => {
              const { label, display } = resultFieldLabel(result.key);
              const isChanged = result.a !== result.b;
              return (
                <Table.Tr key={result.key} className={isChanged ? classes.changed : undefined} data-changed={isChanged}>
                  <Table.Td>
                    {result.label ?? label}
                    {isChanged && <span className={classes.mark}> changed</span>}
                  </Table.Td>
                  <Table.Td>{formatFieldValue(result.a, display)}</Table.Td>
                  <Table.Td>{formatFieldValue(result.b, display)}</Table.Td>
                  <Table.Td>{formatFieldDelta(result.delta, display)}</Table.Td>
                  <Table.Td>{formatRelative(result.a, result.b, result.deltaPct)}</Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>

      <ChecksComparison comparison={comparison} sideName={sideName} />
    </Stack>
  );
}

interface CheckPair {
  key: string;
  subject: string;
  a: CheckRow | null;
  b: CheckRow | null;
}

/** Both sides' Checks matched by check id (merged rows), those whose verdict differs first. */
function ChecksComparison({ comparison, sideName }: { comparison: Comparison; sideName: (side: 'a' | 'b') => string }) {
  const [isShowingAll, setIsShowingAll] = useState(false);
  const rowsA = mergeCheckRows(comparison.checks.a);
  const rowsB = mergeCheckRows(comparison.checks.b);
  const pairs: CheckPair[] = rowsA.map((row) => {
    const other = rowsB.find((candidate) => candidate.ids[0] === row.ids[0]) ?? null;
    return { key: row.ids[0] ?? row.subject, subject: row.subject, a: row, b: other };
  });
  for (const row of rowsB)
    if (!rowsA.some((candidate) => candidate.ids[0] === row.ids[0]))
      pairs.push({ key: row.ids[0] ?? row.subject, subject: row.subject, a: null, b: row });
  const isDifferent = (pair: CheckPair) => pair.a?.verdict !== pair.b?.verdict;
  const different = pairs.filter(isDifferent);
  const shown = isShowingAll ? [...different, ...pairs.filter((pair) => !isDifferent(pair))] : different;
  return (
    <Stack gap={4}>
      <Group justify="space-between">
        <Text size="sm" fw={600}>
          Checks: {different.length} with another verdict, {pairs.length - different.length} alike
        </Text>
        <Switch
          label="Show the alike ones too"
          checked={isShowingAll}
          onChange={(e) => setIsShowingAll(e.currentTarget.checked)}
        />
      </Group>
      <Table.ScrollContainer minWidth={560}>
        <Table verticalSpacing={4} aria-label="Checks compared">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Check</Table.Th>
              <Table.Th>{sideName('a')}</Table.Th>
              <Table.Th>{sideName('b')}</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {shown.length === 0 && (
              <Table.Tr>
                <Table.Td colSpan={3}>
                  <Text size="sm" c="dimmed">
                    Every check has the same verdict on both sides.
                  </Text>
                </Table.Td>
              </Table.Tr>
            )}
            {shown.map((pair) => (
              <Table.Tr
                key={pair.key}
                className={isDifferent(pair) ? classes.changed : undefined}
                data-changed={isDifferent(pair)}
              >
                <Table.Td>
                  {pair.subject}
                  <Text size="xs" c="dimmed">
                    {(pair.a ?? pair.b)?.standards.join(' · ')}
                  </Text>
                </Table.Td>
                <Table.Td>{verdictText(pair.a)}</Table.Td>
                <Table.Td>{verdictText(pair.b)}</Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
    </Stack>
  );
}

function verdictText(row: CheckRow | null): string {
  return row ? `${row.verdict} · ${describeMargin(row)}` : 'not checked';
}
