import { Group, Table, Text } from '@mantine/core';
import { describeMargin, mergeCheckRows, type CheckVerdict } from '@ladderwright/shared/safety';
import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';
import { worstFirst } from '../verdict-strip-figures';
import { VerdictBadge } from './verdict-badge';
import classes from './checks-table.module.css';

const quantityUnits = new Set<string>(['V', 'A', 'F', 'Ohm', 'Hz', 'W', 'J', 'C', 's', 'H', 'm']);

function formatValue(value: number | null, unit: string): string {
  if (value === null) return 'unbounded';
  if (quantityUnits.has(unit)) return formatQuantity(value, unit as QuantityUnit);
  return `${Number(value.toPrecision(3))} ${unit}`.trim();
}

/**
 * "0 fail · 1 marginal · 35 pass", counted over the table's rows (a limit that several standards set counts once), so
 * that every screen that sums the Checks says what the table shows.
 */
export function checkRowCounts(checks: readonly CheckVerdict[]): string {
  const counts = { pass: 0, marginal: 0, fail: 0 };
  for (const check of mergeCheckRows(checks)) counts[check.verdict] += 1;
  return `${counts.fail} fail · ${counts.marginal} marginal · ${counts.pass} pass`;
}

export interface ChecksTableProps {
  checks: readonly CheckVerdict[];
}

/**
 * The Checks: every stress, safety and spacing verdict with value, limit and margin, worst first. A limit that
 * several standards set is one row naming each of them.
 */
export function ChecksTable({ checks }: ChecksTableProps) {
  const sorted = worstFirst(mergeCheckRows(checks));
  return (
    <div>
      <Group gap="md" mb="xs">
        <Text size="sm" fw={600}>
          {checkRowCounts(checks)}
        </Text>
      </Group>
      <Table.ScrollContainer minWidth={520}>
        <Table verticalSpacing={6} aria-label="Checks" striped>
          <Table.Thead>
            <Table.Tr>
              <Table.Th miw={140}>Verdict</Table.Th>
              <Table.Th>Subject</Table.Th>
              <Table.Th>Value</Table.Th>
              <Table.Th>Limit</Table.Th>
              <Table.Th>Rule (every standard that sets this limit)</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {sorted.map((check) => (
              <Table.Tr key={check.ids.join(' ')} data-verdict={check.verdict}>
                <Table.Td>
                  <VerdictBadge verdict={check.verdict} margin={describeMargin(check)} />
                </Table.Td>
                <Table.Td>{check.subject}</Table.Td>
                <Table.Td className={classes.quantity}>{formatValue(check.value, check.unit)}</Table.Td>
                <Table.Td className={classes.quantity}>{formatValue(check.limit, check.unit)}</Table.Td>
                <Table.Td>
                  {check.rules.map((rule) => (
                    <Text size="xs" key={rule}>
                      {rule}
                    </Text>
                  ))}
                </Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
    </div>
  );
}
