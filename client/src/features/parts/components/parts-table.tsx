import { ActionIcon, Badge, Group, Select, Table, Text, TextInput, Tooltip } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { useState } from 'react';
import type { PartKind } from '@ladderwright/shared/api';
import { useDeletePart } from '../api/delete-part';
import { useParts } from '../api/get-parts';
import { PART_KIND_OPTIONS } from './part-kinds';
import { describeRatings, describeUnitCost } from './part-ratings';

export interface PartsTableProps {
  projectId: string;
  canManage: boolean;
}

/** The shelf with kind and text filters; leads may remove a part. */
export function PartsTable({ projectId, canManage }: PartsTableProps) {
  const [kind, setKind] = useState<PartKind | null>(null);
  const [text, setText] = useState('');
  const [q] = useDebouncedValue(text, 250);
  const { data: parts, isPending, error } = useParts(projectId, { kind: kind ?? undefined, q: q || undefined });
  const remove = useDeletePart(projectId);
  return (
    <div>
      <Group mb="sm" gap="sm">
        <Select
          label="Kind"
          placeholder="All kinds"
          data={PART_KIND_OPTIONS.map(({ value, label }) => ({ value, label }))}
          value={kind}
          onChange={(value) => setKind(value)}
          clearable
          w={200}
        />
        <TextInput
          label="Search"
          placeholder="Code or description"
          value={text}
          onChange={(e) => setText(e.currentTarget.value)}
          w={260}
        />
      </Group>
      {error && <Text c="red">{error.message}</Text>}
      <Table striped highlightOnHover aria-label="Parts shelf">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Code</Table.Th>
            <Table.Th>Kind</Table.Th>
            <Table.Th>Description</Table.Th>
            <Table.Th>Ratings</Table.Th>
            <Table.Th>Size (mm)</Table.Th>
            <Table.Th ta="right">Unit cost</Table.Th>
            {canManage && <Table.Th aria-label="Actions" />}
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {isPending && (
            <Table.Tr>
              <Table.Td colSpan={7}>Loading the shelf…</Table.Td>
            </Table.Tr>
          )}
          {parts?.length === 0 && (
            <Table.Tr>
              <Table.Td colSpan={7}>
                {kind !== null || q
                  ? 'No parts match: clear the kind or the search to see the whole shelf.'
                  : canManage
                    ? 'The shelf is empty: add a part below, or import a CSV of parts.'
                    : 'The shelf is empty: the project lead adds its parts.'}
              </Table.Td>
            </Table.Tr>
          )}
          {parts?.map((part) => (
            <Table.Tr key={part.id}>
              <Table.Td ff="monospace" style={{ whiteSpace: 'nowrap' }}>
                {part.code}
              </Table.Td>
              <Table.Td>
                <Badge variant="light" style={{ width: 'max-content' }}>
                  {part.kind}
                </Badge>
              </Table.Td>
              <Table.Td>{part.description}</Table.Td>
              <Table.Td>{describeRatings(part)}</Table.Td>
              <Table.Td>{part.sizeMm}</Table.Td>
              <Table.Td ta="right" style={{ whiteSpace: 'nowrap' }}>
                {describeUnitCost(part)}
              </Table.Td>
              {canManage && (
                <Table.Td>
                  <Tooltip label={`Remove ${part.code}`}>
                    <ActionIcon
                      variant="subtle"
                      color="red"
                      aria-label={`Remove ${part.code}`}
                      onClick={() => remove.mutate(part.id)}
                      loading={remove.isPending && remove.variables === part.id}
                    >
                      ×
                    </ActionIcon>
                  </Tooltip>
                </Table.Td>
              )}
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </div>
  );
}
