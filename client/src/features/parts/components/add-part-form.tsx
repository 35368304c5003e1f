import { Alert, Button, Group, Select, SimpleGrid, Text, TextInput } from '@mantine/core';
import { useState } from 'react';
import type { PartKind } from '@ladderwright/shared/api';
import { MAGNETICS_FIELD_SPECS, partFieldsFor, type MagneticsField } from '@ladderwright/shared/parts';
import { isApiError } from '../../../lib/api-client';
import { isCellBlock } from '../../../lib/spreadsheet-cells';
import { type PartDraft, useCreatePart } from '../api/create-part';
import { pasteIntoPartForm } from '../paste-part-cells';
import { PART_KIND_OPTIONS } from './part-kinds';

const BASE_FIELDS: { name: string; label: string; placeholder: string }[] = [
  { name: 'code', label: 'Code', placeholder: 'NF-C103-3K' },
  { name: 'description', label: 'Description', placeholder: 'HV ceramic disc' },
  { name: 'valueSi', label: 'Value (F, Ω or AL in H)', placeholder: '10n' },
  { name: 'tolerance', label: 'Tolerance', placeholder: '10%' },
  { name: 'ratedVoltageV', label: 'Rated voltage', placeholder: '3 kV' },
  { name: 'ratedCurrentA', label: 'Rated current', placeholder: '50 mA' },
  { name: 'ratedSurgeCurrentA', label: 'Surge current', placeholder: '10 A' },
  { name: 'ratedPowerW', label: 'Rated power', placeholder: '0.5 W' },
  { name: 'unitCost', label: 'Unit cost', placeholder: '0.35' },
  { name: 'sizeMm', label: 'Size (mm)', placeholder: '10x5x7' },
];

const VALUE_LABELS: Partial<Record<PartKind, string>> = {
  capacitor: 'Capacitance',
  resistor: 'Resistance',
  core: 'AL ungapped (H per turn²)',
};

/** The fields a part of this kind carries, with the labels and examples it shows. */
function fieldsFor(kind: PartKind): { name: string; label: string; placeholder: string }[] {
  const names: readonly string[] = partFieldsFor(kind);
  const base = BASE_FIELDS.filter((field) => names.includes(field.name)).map((field) =>
    field.name === 'valueSi' ? { ...field, label: VALUE_LABELS[kind] ?? field.label } : field,
  );
  const magnetics = names
    .filter((name): name is MagneticsField => name in MAGNETICS_FIELD_SPECS)
    .map((name) => ({
      name,
      label: MAGNETICS_FIELD_SPECS[name].label,
      placeholder: MAGNETICS_FIELD_SPECS[name].example,
    }));
  if (kind === 'wire' || kind === 'tape') {
    return [
      ...base.map((field) => (field.name === 'unitCost' ? { ...field, label: 'Cost per metre' } : field)),
      ...magnetics,
    ];
  }
  return [...base, ...magnetics];
}

export interface AddPartFormProps {
  projectId: string;
  /** Several rows pasted from a spreadsheet, as a shelf CSV for the import preview. */
  onPasteRows?: (file: File, rowCount: number) => void;
}

/**
 * A lead adds one part; the server checks the ratings the kind needs and names each bad field. Cells pasted from a
 * spreadsheet fill the fields from the one pasted into, left to right; several rows go to the import preview.
 */
export function AddPartForm({ projectId, onPasteRows }: AddPartFormProps) {
  const [draft, setDraft] = useState<PartDraft>({ kind: 'capacitor' });
  const [pasteNote, setPasteNote] = useState<{ isError: boolean; text: string } | null>(null);
  const kind = (draft.kind ?? 'capacitor') as PartKind;
  const create = useCreatePart(projectId);
  const issues = isApiError(create.error) ? (create.error.body.issues ?? []) : [];
  const errorOf = (name: string) => issues.find((issue) => issue.path === name)?.message;
  const fields = fieldsFor(kind);
  const onPaste = (name: string, event: React.ClipboardEvent<HTMLInputElement>) => {
    const text = event.clipboardData.getData('text/plain');
    if (!isCellBlock(text)) return;
    event.preventDefault();
    const pasted = pasteIntoPartForm(draft, fields, name, text);
    if (pasted.kind === 'refused') setPasteNote({ isError: true, text: `Nothing pasted: ${pasted.message}` });
    else if (pasted.kind === 'fill') {
      setDraft(pasted.draft);
      setPasteNote(null);
    } else if (onPasteRows) {
      onPasteRows(new File([pasted.csv], 'pasted-parts.csv', { type: 'text/csv' }), pasted.rowCount);
      setPasteNote({
        isError: false,
        text: `${pasted.rowCount} rows pasted as ${pasted.rowCount} parts: check them in the import preview below, then import.`,
      });
    }
  };
  return (
    <form
      aria-label="Add a part"
      onSubmit={(event) => {
        event.preventDefault();
        create.mutate(draft, { onSuccess: () => setDraft({ kind: draft.kind ?? 'capacitor' }) });
      }}
    >
      <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
        <Select
          label="Kind"
          data={PART_KIND_OPTIONS.map(({ value, single }) => ({ value, label: single }))}
          value={kind}
          onChange={(value) => {
            // Keep only what the new kind carries, so a hidden field is never sent.
            const next = value ?? 'capacitor';
            const names: readonly string[] = partFieldsFor(next);
            setDraft({
              ...Object.fromEntries(Object.entries(draft).filter(([name]) => names.includes(name))),
              kind: next,
            });
          }}
          allowDeselect={false}
        />
        {fields.map((field) => (
          <TextInput
            key={`${kind}-${field.name}`}
            label={field.label}
            placeholder={field.placeholder}
            value={draft[field.name] ?? ''}
            error={errorOf(field.name)}
            onChange={(event) => setDraft({ ...draft, [field.name]: event.currentTarget.value })}
            onPaste={(event) => onPaste(field.name, event)}
          />
        ))}
      </SimpleGrid>
      {pasteNote && (
        <Text size="sm" mt="sm" c={pasteNote.isError ? 'red' : undefined} role="status">
          {pasteNote.text}
        </Text>
      )}
      {create.error && issues.length === 0 && (
        <Alert color="red" mt="sm">
          {create.error.message}
        </Alert>
      )}
      <Group mt="sm">
        <Button type="submit" loading={create.isPending}>
          Add to shelf
        </Button>
      </Group>
    </form>
  );
}
