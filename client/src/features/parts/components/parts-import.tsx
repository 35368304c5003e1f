import { Alert, Button, FileInput, Group, List, Stack, Table, Text } from '@mantine/core';
import { useEffect, useState } from 'react';
import type { PartImportResult } from '@ladderwright/shared/api';
import { isApiError } from '../../../lib/api-client';
import { useImportParts } from '../api/import-parts';

export interface PartsImportProps {
  projectId: string;
  /** Rows pasted into the Add-a-part form, as a shelf CSV: previewed at once like a chosen file (give a new key). */
  pasted?: File | null;
}

/** CSV import in two steps: a preview with row errors, then the write (refused unless every row is valid). */
export function PartsImport({ projectId, pasted = null }: PartsImportProps) {
  const [file, setFile] = useState<File | null>(pasted);
  const [preview, setPreview] = useState<PartImportResult | null>(null);
  const importParts = useImportParts(projectId);
  const { mutate } = importParts;
  useEffect(() => {
    if (pasted) mutate({ file: pasted, dryRun: true }, { onSuccess: (result) => setPreview(result) });
  }, [pasted, mutate]);
  const issues = isApiError(importParts.error) ? (importParts.error.body.issues ?? []) : [];
  const run = (dryRun: boolean) => {
    if (!file) return;
    importParts.mutate({ file, dryRun }, { onSuccess: (result) => setPreview(result) });
  };
  return (
    <Stack gap="sm">
      <Group align="end">
        <FileInput
          label="Shelf CSV"
          placeholder="Choose a .csv file"
          accept=".csv,text/csv"
          value={file}
          onChange={(next) => {
            setFile(next);
            setPreview(null);
            importParts.reset();
          }}
          w={320}
        />
        <Button variant="default" onClick={() => run(true)} disabled={!file} loading={importParts.isPending}>
          Preview
        </Button>
        <Button
          onClick={() => run(false)}
          disabled={!preview || preview.written || preview.errors.length > 0}
          loading={importParts.isPending}
        >
          Import {preview && !preview.written ? `${preview.rows.length} parts` : ''}
        </Button>
      </Group>
      {importParts.error && (
        <Alert color="red" title="The file was not accepted">
          <Text size="sm">{importParts.error.message}</Text>
          {issues.length > 1 && (
            <List size="sm">
              {issues.map((issue) => (
                <List.Item key={issue.path + issue.message}>{issue.message}</List.Item>
              ))}
            </List>
          )}
        </Alert>
      )}
      {preview?.written && <Alert color="teal">Imported {preview.rows.length} parts.</Alert>}
      {preview && !preview.written && (
        <Table aria-label="Import preview">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Line</Table.Th>
              <Table.Th>Code</Table.Th>
              <Table.Th>Result</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {preview.rows.map((row) => (
              <Table.Tr key={row.line}>
                <Table.Td>{row.line}</Table.Td>
                <Table.Td ff="monospace">{row.part.code}</Table.Td>
                <Table.Td>{row.action === 'create' ? 'new part' : 'updates the shelf part'}</Table.Td>
              </Table.Tr>
            ))}
            {preview.errors.map((error) => (
              <Table.Tr key={error.path + error.message}>
                <Table.Td>{error.line}</Table.Td>
                <Table.Td>{error.column}</Table.Td>
                <Table.Td c="red">{error.message}</Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
    </Stack>
  );
}
