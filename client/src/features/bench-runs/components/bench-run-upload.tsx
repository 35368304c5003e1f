import { Alert, Button, FileInput, Group, List, SegmentedControl, Stack, TextInput } from '@mantine/core';
import { useState } from 'react';
import type { BenchRunDetail } from '@ladderwright/shared/api';
import type { BenchKind } from '@ladderwright/shared/bench';
import { isApiError } from '../../../lib/api-client';
import { useUploadBenchRun } from '../api/upload-bench-run';

export interface BenchRunUploadProps {
  projectId: string;
  designId: string;
  revisionNumber: number;
  onUploaded: (run: BenchRunDetail) => void;
}

/** Upload form: the kind, a data CSV, optional photos and the tolerance the verdict is taken against. */
export function BenchRunUpload({ projectId, designId, revisionNumber, onUploaded }: BenchRunUploadProps) {
  const [kind, setKind] = useState<BenchKind>('load-sweep');
  const [title, setTitle] = useState('');
  const [tolerance, setTolerance] = useState('5%');
  const [data, setData] = useState<File | null>(null);
  const [photos, setPhotos] = useState<File[]>([]);
  const upload = useUploadBenchRun(projectId, designId, revisionNumber);
  const issues = isApiError(upload.error) ? (upload.error.body.issues ?? []) : [];
  return (
    <form
      aria-label="Upload a bench run"
      onSubmit={(event) => {
        event.preventDefault();
        if (!data) return;
        upload.mutate({ kind, title, tolerance, data, photos }, { onSuccess: onUploaded });
      }}
    >
      <Stack gap="sm">
        <SegmentedControl
          value={kind}
          onChange={(value) => setKind(value)}
          data={[
            { value: 'load-sweep', label: 'Load sweep (current, voltage)' },
            { value: 'scope-capture', label: 'Scope capture (time, voltage)' },
          ]}
        />
        <Group grow align="start">
          <FileInput
            label="Data file (CSV)"
            placeholder="Choose a .csv file"
            accept=".csv,text/csv"
            value={data}
            onChange={setData}
            required
          />
          <FileInput
            label="Photos (PNG or JPEG)"
            placeholder="Optional"
            accept="image/png,image/jpeg"
            multiple
            value={photos}
            onChange={setPhotos}
            clearable
          />
        </Group>
        <Group grow>
          <TextInput
            label="Title"
            placeholder="Prototype 2, 12.0 V bench supply"
            value={title}
            onChange={(e) => setTitle(e.currentTarget.value)}
          />
          <TextInput
            label="Tolerance (fraction or %)"
            value={tolerance}
            onChange={(e) => setTolerance(e.currentTarget.value)}
          />
        </Group>
        {upload.error && (
          <Alert color="red" title="The upload was not accepted">
            {upload.error.message}
            {issues.length > 1 && (
              <List size="sm">
                {issues.map((issue) => (
                  <List.Item key={issue.path + issue.message}>{issue.message}</List.Item>
                ))}
              </List>
            )}
          </Alert>
        )}
        <Group>
          <Button type="submit" disabled={!data} loading={upload.isPending}>
            Upload and compare
          </Button>
        </Group>
      </Stack>
    </form>
  );
}
