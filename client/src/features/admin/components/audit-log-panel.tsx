import { useState } from 'react';
import { Alert, Button, Code, Group, Pagination, Select, Stack, Table, Text, TextInput } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { AUDIT_ACTIONS, type AuditAction, type AuditQuery } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { searchString } from '../../../lib/search-string';
import { useAuditEntries } from '../api/get-audit-entries';
import { formatDateTime } from '../../../lib/format-date';

const PAGE_SIZE = 50;

/** A date field (YYYY-MM-DD, local) as the instant it starts, or undefined when empty or not a date. */
function startOfDay(value: string, plusDays = 0): string | undefined {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) return undefined;
  const date = new Date(`${value}T00:00:00`);
  if (Number.isNaN(date.getTime())) return undefined;
  date.setDate(date.getDate() + plusDays);
  return date.toISOString();
}

/** The audit log filtered by who, what and when, newest first, with a CSV export of the same selection. */
export function AuditLogPanel() {
  const [actor, setActor] = useState('');
  const [debouncedActor] = useDebouncedValue(actor.trim(), 250);
  const [action, setAction] = useState<AuditAction | null>(null);
  const [fromDay, setFromDay] = useState('');
  const [toDay, setToDay] = useState('');
  const [page, setPage] = useState(1);
  const from = startOfDay(fromDay);
  const to = startOfDay(toDay, 1);
  const filter: AuditQuery = {
    ...(debouncedActor ? { actor: debouncedActor } : {}),
    ...(action ? { action } : {}),
    ...(from ? { from } : {}),
    ...(to ? { to } : {}),
  };
  const entries = useAuditEntries({ ...filter, page, pageSize: PAGE_SIZE });
  const pageCount = entries.data ? Math.max(1, Math.ceil(entries.data.total / PAGE_SIZE)) : 1;
  const resetPage = () => setPage(1);

  return (
    <Stack gap="md">
      <Group align="flex-end" wrap="wrap">
        <TextInput
          label="Who"
          placeholder="Part of an e-mail"
          value={actor}
          onChange={(event) => {
            setActor(event.currentTarget.value);
            resetPage();
          }}
          w={220}
        />
        <Select
          label="Action"
          placeholder="Any action"
          clearable
          searchable
          data={[...AUDIT_ACTIONS]}
          value={action}
          onChange={(value) => {
            setAction(value);
            resetPage();
          }}
          w={260}
        />
        <TextInput
          label="From (day)"
          type="date"
          value={fromDay}
          onChange={(event) => {
            setFromDay(event.currentTarget.value);
            resetPage();
          }}
        />
        <TextInput
          label="To (day, inclusive)"
          type="date"
          value={toDay}
          onChange={(event) => {
            setToDay(event.currentTarget.value);
            resetPage();
          }}
        />
        <Button component="a" href={`${apiPaths.auditCsv}${searchString(filter)}`} variant="default" download>
          Export CSV
        </Button>
      </Group>
      {entries.isError && <Alert color="red">{entries.error.message}</Alert>}
      <Table.ScrollContainer minWidth={960}>
        <Table striped aria-label="Audit log" verticalSpacing={6} fz="sm">
          <Table.Thead>
            <Table.Tr>
              <Table.Th w={170}>When</Table.Th>
              <Table.Th w={210}>Action</Table.Th>
              <Table.Th>Who</Table.Th>
              <Table.Th>Details</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {entries.data?.items.map((entry) => (
              <Table.Tr key={entry.id}>
                <Table.Td>{formatDateTime(entry.occurredAt)}</Table.Td>
                <Table.Td>
                  <Code>{entry.action}</Code>
                </Table.Td>
                <Table.Td>
                  {entry.actorEmail ?? '—'}
                  {entry.clientAddress && (
                    <Text size="xs" c="dimmed">
                      from {entry.clientAddress}
                    </Text>
                  )}
                </Table.Td>
                <Table.Td>
                  <Text size="xs" style={{ wordBreak: 'break-word' }}>
                    {Object.entries(entry.detail)
                      .map(([key, value]) => `${key}: ${typeof value === 'string' ? value : JSON.stringify(value)}`)
                      .join(' · ')}
                  </Text>
                </Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      </Table.ScrollContainer>
      {entries.data && entries.data.items.length === 0 && (
        <Text size="sm" c="dimmed">
          No entry matches these filters.
        </Text>
      )}
      <Group justify="space-between">
        <Text size="sm" c="dimmed">
          {entries.data ? `${entries.data.total} entr${entries.data.total === 1 ? 'y' : 'ies'}` : ''}
        </Text>
        <Pagination total={pageCount} value={page} onChange={setPage} size="sm" />
      </Group>
    </Stack>
  );
}
