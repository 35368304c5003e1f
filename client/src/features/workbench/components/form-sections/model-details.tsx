import { useState } from 'react';
import { Accordion, Text } from '@mantine/core';
import { documentFieldLabel } from '@ladderwright/shared/designs';
import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import type { OptionalBinding } from '../../document-path';

/** One optional model field: its binding and what the simulation takes when it is empty (null: none). */
export interface ModelDetail {
  binding: OptionalBinding;
  fallback: number | null;
}

const QUANTITY_UNITS: ReadonlySet<string> = new Set<QuantityUnit>(['V', 'A', 'F', 'Ohm', 's']);

/**
 * A group of optional device-model fields (SPICE parameters), folded away until opened, and opened by itself when
 * one of its fields has an issue. Labels and units come from the document's field labels; an empty field shows the
 * value the simulation takes for it.
 */
export function ModelDetails({ title, details }: { title: string; details: ModelDetail[] }) {
  const [open, setOpen] = useState<string | null>(null);
  const hasIssue = details.some((d) => d.binding.issue);
  const setCount = details.filter((d) => Number.isFinite(d.binding.value)).length;
  return (
    <Accordion
      variant="contained"
      chevronPosition="left"
      value={hasIssue ? 'details' : open}
      onChange={(value) => setOpen(value)}
    >
      <Accordion.Item value="details">
        <Accordion.Control>
          <Text size="sm" fw={600} span>
            {title}
          </Text>
          <Text size="sm" c="dimmed" span>
            {setCount > 0 ? ` · ${setCount} set` : ' · defaults'}
          </Text>
        </Accordion.Control>
        <Accordion.Panel>
          <FieldGrid>
            {details.map(({ binding, fallback }) => {
              const { label, display } = documentFieldLabel(binding.path);
              const unit = QUANTITY_UNITS.has(display) ? (display as QuantityUnit) : null;
              const shown = fallback === null ? 'none' : unit ? formatQuantity(fallback, unit) : String(fallback);
              return (
                <BoundField
                  key={binding.path}
                  label={label}
                  unit={unit}
                  step={0.05}
                  decimalScale={3}
                  placeholder={`${shown} (default)`}
                  {...binding}
                />
              );
            })}
          </FieldGrid>
        </Accordion.Panel>
      </Accordion.Item>
    </Accordion>
  );
}
