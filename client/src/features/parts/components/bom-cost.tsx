import { Table, Text } from '@mantine/core';
import type { Design } from '@ladderwright/shared/designs';
import { bomCost } from '@ladderwright/shared/parts';
import { useParts } from '../api/get-parts';

export interface BomCostProps {
  projectId: string;
  design: Design;
}

/** BOM cost of the ladder from the project's shelf (shared `bomCost`); unpriced positions are listed. */
export function BomCost({ projectId, design }: BomCostProps) {
  const { data: parts, isPending, error } = useParts(projectId);
  if (isPending) return <Text size="sm">Pricing from the Parts shelf…</Text>;
  if (error) return <Text c="red">{error.message}</Text>;
  const bom = bomCost(design, parts);
  return (
    <section aria-label="BOM cost">
      <Table>
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Part</Table.Th>
            <Table.Th ta="right">Qty</Table.Th>
            <Table.Th ta="right">Unit</Table.Th>
            <Table.Th ta="right">Line</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {bom.lines.map((line) => (
            <Table.Tr key={line.code}>
              <Table.Td ff="monospace">{line.code}</Table.Td>
              <Table.Td ta="right">{line.quantity}</Table.Td>
              <Table.Td ta="right">{line.unitCost.toFixed(2)}</Table.Td>
              <Table.Td ta="right">{line.lineCost.toFixed(2)}</Table.Td>
            </Table.Tr>
          ))}
          <Table.Tr>
            <Table.Td fw={600}>Ladder total</Table.Td>
            <Table.Td colSpan={3} ta="right" fw={600}>
              {bom.totalCost.toFixed(2)}
            </Table.Td>
          </Table.Tr>
        </Table.Tbody>
      </Table>
      <Text size="xs" c="dimmed" mt="xs">
        Costs in the team’s currency, from the project’s Parts shelf.
      </Text>
      {bom.unpriced.length > 0 && (
        <Text size="sm" c="dimmed" mt="xs">
          Not priced (no shelf part): {bom.unpriced.map((item) => `${item.position} × ${item.quantity}`).join(', ')}
        </Text>
      )}
    </section>
  );
}
