import { useState } from 'react';
import { Alert, Button, Group, Modal, SegmentedControl, Select, Stack, Text, TextInput } from '@mantine/core';
import type { DesignDetail, DesignSource } from '@ladderwright/shared/api';
import { useCreateDesign } from '../api/create-design';
import { useDesignTemplates } from '../api/get-design-templates';
import { useDesigns } from '../api/get-designs';

export interface CreateDesignModalProps {
  projectId: string;
  isOpen: boolean;
  onClose: () => void;
  onCreated: (design: DesignDetail) => void;
}

type SourceKind = 'template' | 'blank' | 'duplicate';

/** New design from a demo template, from scratch or as a copy of a design of this project. */
export function CreateDesignModal({ projectId, isOpen, onClose, onCreated }: CreateDesignModalProps) {
  const [name, setName] = useState('');
  const [kind, setKind] = useState<SourceKind>('template');
  const [templateId, setTemplateId] = useState<string | null>(null);
  const [designId, setDesignId] = useState<string | null>(null);
  const templates = useDesignTemplates(isOpen);
  const designs = useDesigns(projectId, { sort: 'name', order: 'asc', pageSize: 100 });
  const createDesign = useCreateDesign(projectId);

  const source: DesignSource | null =
    kind === 'blank'
      ? { kind: 'blank' }
      : kind === 'template'
        ? templateId
          ? { kind: 'template', templateId }
          : null
        : designId
          ? { kind: 'duplicate', designId }
          : null;
  const canCreate = name.trim() !== '' && source !== null && !createDesign.isPending;

  const pickTemplate = (value: string | null) => {
    setTemplateId(value);
    const template = templates.data?.find((t) => t.id === value);
    if (template && name.trim() === '') setName(template.name);
  };

  const submit = () => {
    if (!source) return;
    createDesign.mutate(
      { name: name.trim(), from: source },
      {
        onSuccess: (design) => {
          setName('');
          onCreated(design);
        },
      },
    );
  };

  return (
    <Modal opened={isOpen} onClose={onClose} title="New design" size="lg">
      <form
        onSubmit={(event) => {
          event.preventDefault();
          submit();
        }}
      >
        <Stack gap="md">
          <SegmentedControl
            aria-label="Start from"
            value={kind}
            onChange={(value) => setKind(value)}
            data={[
              { value: 'template', label: 'Demo template' },
              { value: 'blank', label: 'Scratch' },
              { value: 'duplicate', label: 'Copy of a design' },
            ]}
          />
          {kind === 'template' && (
            <Select
              label="Template"
              placeholder={templates.isPending ? 'Loading templates…' : 'Pick a template'}
              data={(templates.data ?? []).map((t) => ({ value: t.id, label: t.name }))}
              value={templateId}
              onChange={pickTemplate}
              description={templates.data?.find((t) => t.id === templateId)?.summary}
              required
            />
          )}
          {kind === 'duplicate' && (
            <Select
              label="Design to copy"
              placeholder="Pick a design"
              data={(designs.data?.items ?? []).map((d) => ({
                value: d.id,
                label: `${d.name} (r${d.latestRevisionNumber})`,
              }))}
              value={designId}
              onChange={setDesignId}
              searchable
              required
            />
          )}
          {kind === 'blank' && (
            <Text size="sm" c="dimmed">
              Starts from the engine’s default document; every field can be changed on the Workbench.
            </Text>
          )}
          <TextInput label="Design name" value={name} onChange={(e) => setName(e.currentTarget.value)} required />
          {createDesign.isError && (
            <Alert color="red" title="The design was not created">
              {createDesign.error.message}
            </Alert>
          )}
          <Group justify="flex-end">
            <Button variant="default" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit" disabled={!canCreate} loading={createDesign.isPending}>
              Create design
            </Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
