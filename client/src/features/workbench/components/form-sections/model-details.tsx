import { lazy, Suspense, useState } from 'react';
import { Accordion, Loader, Text } from '@mantine/core';
import type { ModelDetail } from './model-detail-fields';

// The fields load when the group is first opened: their labels come from the field-label map, which a folded
// group does not need.
const ModelDetailFields = lazy(() =>
  import('./model-detail-fields').then((module) => ({ default: module.ModelDetailFields })),
);

/**
 * A group of optional device-model fields (SPICE parameters), folded away until opened, and opened by itself when
 * one of its fields has an issue. Labels and units come from the document's field labels; an empty field shows the
 * value the simulation takes for it.
 */
export function ModelDetails({ title, details }: { title: string; details: ModelDetail[] }) {
  const [open, setOpen] = useState<string | null>(null);
  const hasIssue = details.some((d) => d.binding.issue);
  const setCount = details.filter((d) => Number.isFinite(d.binding.value)).length;
  const isOpen = hasIssue || open === 'details';
  // Once shown, the fields stay mounted, so the group folds with its animation.
  const [hasBeenOpen, setHasBeenOpen] = useState(isOpen);
  if (isOpen && !hasBeenOpen) setHasBeenOpen(true);
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
          {(isOpen || hasBeenOpen) && (
            <Suspense fallback={<Loader size="xs" aria-label="Loading the model fields" />}>
              <ModelDetailFields details={details} />
            </Suspense>
          )}
        </Accordion.Panel>
      </Accordion.Item>
    </Accordion>
  );
}
