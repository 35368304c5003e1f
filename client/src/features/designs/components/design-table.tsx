import { useState } from 'react';
import {
  Anchor,
  Group,
  Pagination,
  Select,
  Table,
  Text,
  TextInput,
  UnstyledButton,
  VisuallyHidden,
} from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { Link } from 'react-router-dom';
import type { DesignListQuery, DesignSortKey, ProjectMember } from '@ladderwright/shared/api';
import { REVISION_STATES, type RevisionState } from '@ladderwright/shared/reviews';
import { paths } from '../../../config/paths';
import { useDesigns } from '../api/get-designs';
import { DesignsEmpty } from './designs-empty';
import { RevisionStateBadge } from '../../../components/revision-state-badge';
import { formatDateTime } from '../../../lib/format-date';

export interface DesignTableProps {
  projectId: string;
  members: readonly ProjectMember[];
  pageSize?: number;
}

const columns: ReadonlyArray<{ key: DesignSortKey | null; label: string }> = [
  { key: 'name', label: 'Design' },
  { key: null, label: 'Owner' },
  { key: null, label: 'Revision' },
  { key: 'state', label: 'State' },
  { key: 'updatedAt', label: 'Updated' },
];

/** The project's Designs: search, state and owner filters, sortable columns and pages, all answered by the server. */
export function DesignTable({ projectId, members, pageSize = 20 }: DesignTableProps) {
  const [search, setSearch] = useState('');
  const [debouncedSearch] = useDebouncedValue(search.trim(), 250);
  const [state, setState] = useState<RevisionState | null>(null);
  const [ownerId, setOwnerId] = useState<string | null>(null);
  const [sort, setSort] = useState<DesignSortKey>('updatedAt');
  const [order, setOrder] = useState<'asc' | 'desc'>('desc');
  const [page, setPage] = useState(1);

  const query: DesignListQuery = {
    q: debouncedSearch || undefined,
    state: state ?? undefined,
    ownerId: ownerId ?? undefined,
    sort,
    order,
    page,
    pageSize,
  };
  const designs = useDesigns(projectId, query);
  const pageCount = designs.data ? Math.max(1, Math.ceil(designs.data.total / designs.data.pageSize)) : 1;

  const toggleSort = (key: DesignSortKey) => {
    if (key === sort) setOrder(order === 'asc' ? 'desc' : 'asc');
    else {
      setSort(key);
      setOrder(key === 'updatedAt' ? 'desc' : 'asc');
    }
    setPage(1);
  };

  const hasFilters = Boolean(debouncedSearch || state || ownerId);
  if (designs.data && designs.data.total === 0 && !hasFilters && !search) return <DesignsEmpty />;

  return (
    <div>
      <Group gap="sm" mb="sm" align="flex-end" wrap="wrap">
        <TextInput
          label="Search designs"
          placeholder="Name contains…"
          value={search}
          onChange={(event) => {
            setSearch(event.currentTarget.value);
            setPage(1);
          }}
          w={260}
        />
        <Select
          label="State"
          placeholder="Any state"
          data={REVISION_STATES.map((value) => ({ value, label: value }))}
          value={state}
          onChange={(value) => {
            setState(value);
            setPage(1);
          }}
          clearable
          w={170}
        />
        <Select
          label="Owner"
          placeholder="Anyone"
          data={members.map((member) => ({ value: member.userId, label: member.displayName }))}
          value={ownerId}
          onChange={(value) => {
            setOwnerId(value);
            setPage(1);
          }}
          clearable
          w={200}
        />
      </Group>
      <Table.ScrollContainer minWidth={640}>
        <Table striped highlightOnHover verticalSpacing="xs" aria-label="Designs" aria-busy={designs.isFetching}>
          <Table.Thead>
            <Table.Tr>
              {columns.map((column) => (
                <Table.Th
                  key={column.label}
                  aria-sort={
                    column.key === sort
                      ? order === 'asc'
                        ? 'ascending'
                        : 'descending'
                      : column.key
                        ? 'none'
                        : undefined
                  }
                >
                  {column.key ? (
                    <UnstyledButton onClick={() => toggleSort(column.key as DesignSortKey)} fw={600} fz="sm">
                      {column.label}
                      {column.key === sort ? (order === 'asc' ? ' ↑' : ' ↓') : ''}
                      <VisuallyHidden>, sort</VisuallyHidden>
                    </UnstyledButton>
                  ) : (
                    column.label
                  )}
                </Table.Th>
              ))}
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {designs.data?.items.map((design) => (
              <Table.Tr key={design.id}>
                <Table.Td>
                  <Anchor component={Link} to={paths.design.getHref(projectId, design.id)} fw={500}>
                    {design.name}
                  </Anchor>
                </Table.Td>
                <Table.Td>{design.ownerName}</Table.Td>
                <Table.Td>r{design.latestRevisionNumber}</Table.Td>
                <Table.Td>
                  <RevisionStateBadge state={design.latestState} />
                </Table.Td>
                <Table.Td>{formatDateTime(design.updatedAt)}</Table.Td>
              </Table.Tr>
            ))}
            {designs.data && designs.data.items.length === 0 && (
              <Table.Tr>
                <Table.Td colSpan={columns.length}>
                  <Text c="dimmed" size="sm" ta="center" py="md">
                    No design matches these filters.
                  </Text>
                </Table.Td>
              </Table.Tr>
            )}
            {designs.isError && (
              <Table.Tr>
                <Table.Td colSpan={columns.length}>
                  <Text c="red" size="sm" ta="center" py="md" role="alert">
                    The designs could not be loaded: {designs.error.message}
                  </Text>
                </Table.Td>
              </Table.Tr>
            )}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
      <Group justify="space-between" mt="sm">
        <Text size="sm" c="dimmed">
          {designs.data ? `${designs.data.total} design${designs.data.total === 1 ? '' : 's'}` : 'Loading designs…'}
        </Text>
        {pageCount > 1 && (
          <Pagination total={pageCount} value={page} onChange={setPage} size="sm" aria-label="Designs pages" />
        )}
      </Group>
    </div>
  );
}
