import { Alert, Button, Group, Select, SimpleGrid, TextInput } from '@mantine/core';
import { useState } from 'react';
import { isApiError } from '../../../lib/api-client';
import { type PartDraft, useCreatePart } from '../api/create-part';

const FIELDS: { name: string; label: string; placeholder: string }[] = [
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

/** A lead adds one part; the server checks the ratings the kind needs and names each bad field. */
export function AddPartForm({ projectId }: { projectId: string }) {
  const [draft, setDraft] = useState<PartDraft>({ kind: 'capacitor' });
  const create = useCreatePart(projectId);
  const issues = isApiError(create.error) ? (create.error.body.issues ?? []) : [];
  const errorOf = (name: string) => issues.find((issue) => issue.path === name)?.message;
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
          data={['capacitor', 'diode', 'resistor', 'transistor', 'core']}
          value={draft.kind ?? 'capacitor'}
          onChange={(value) => setDraft({ ...draft, kind: value ?? 'capacitor' })}
          allowDeselect={false}
        />
        {FIELDS.map((field) => (
          <TextInput
            key={field.name}
            label={field.label}
            placeholder={field.placeholder}
            value={draft[field.name] ?? ''}
            error={errorOf(field.name)}
            onChange={(event) => setDraft({ ...draft, [field.name]: event.currentTarget.value })}
          />
        ))}
      </SimpleGrid>
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
