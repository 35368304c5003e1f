import { Group, Table, Text } from '@mantine/core';
import type { CheckVerdict } from '@ladderwright/shared/safety';
import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';
import { VerdictBadge } from './verdict-badge';

const quantityUnits = new Set<string>(['V', 'A', 'F', 'Ohm', 'Hz', 'W', 'J', 'C', 's', 'H', 'm']);

function formatValue(value: number | null, unit: string): string {
  if (value === null) return 'unbounded';
  if (quantityUnits.has(unit)) return formatQuantity(value, unit as QuantityUnit);
  return `${Number(value.toPrecision(3))} ${unit}`.trim();
}

const verdictOrder: Record<CheckVerdict['verdict'], number> = { fail: 0, marginal: 1, pass: 2 };

export interface ChecksTableProps {
  checks: readonly CheckVerdict[];
}

/** The Checks: every stress, safety and spacing verdict with value, limit and margin, worst first. */
export function ChecksTable({ checks }: ChecksTableProps) {
  const sorted = [...checks].sort(
    (a, b) => verdictOrder[a.verdict] - verdictOrder[b.verdict] || a.marginPct - b.marginPct,
  );
  const counts = { pass: 0, marginal: 0, fail: 0 };
  for (const check of checks) counts[check.verdict] += 1;
  return (
    <div>
      <Group gap="md" mb="xs">
        <Text size="sm" fw={600}>
          {counts.fail} fail · {counts.marginal} marginal · {counts.pass} pass
        </Text>
      </Group>
      <Table.ScrollContainer minWidth={640}>
        <Table verticalSpacing={6} aria-label="Checks" striped>
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Verdict</Table.Th>
              <Table.Th>Subject</Table.Th>
              <Table.Th>Value</Table.Th>
              <Table.Th>Limit</Table.Th>
              <Table.Th>Rule</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {sorted.map((check) => (
              <Table.Tr key={check.id} data-verdict={check.verdict}>
                <Table.Td>
                  <VerdictBadge verdict={check.verdict} marginPct={check.marginPct} />
                </Table.Td>
                <Table.Td>{check.subject}</Table.Td>
                <Table.Td>{formatValue(check.value, check.unit)}</Table.Td>
                <Table.Td>{formatValue(check.limit, check.unit)}</Table.Td>
                <Table.Td>
                  <Text size="xs">{check.rule}</Text>
                </Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
    </div>
  );
}
