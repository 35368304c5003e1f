import { memo, useCallback, useLayoutEffect, useRef, useState } from 'react';
import { Accordion, Badge, Group, Stack, Text } from '@mantine/core';
import type { Part } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { withSharedBranches, type Edit } from '../document-path';
import { withShelfPart, type PartSlot } from '../shelf-picks';
import { DesignSection } from './form-sections/design-section';
import { DriveSection } from './form-sections/drive-section';
import { driverEdit } from './form-sections/driver-edit';
import { FORM_SECTIONS, sectionOfPath, type FormSectionId } from './form-sections/form-section.types';
import { LadderSection } from './form-sections/ladder-section';
import { OutputSection } from './form-sections/output-section';
import { TargetsSection } from './form-sections/targets-section';
import { TransformerSection } from './form-sections/transformer-section';
import { TransistorSection } from './form-sections/transistor-section';
import { FormIndex } from './form-index';
import classes from './ladder-form.module.css';

export interface LadderFormProps {
  document: Design;
  /** The edited document; `key` is the document path of the one field changed, when there is one. */
  onChange: (document: Design, key?: string) => void;
  /** validateDesign's messages by document path. */
  issues: Readonly<Record<string, string>>;
  /** The project's Parts shelf: the part-code fields offer its parts; picking one fills value and ratings. */
  parts?: readonly Part[];
  /** Every control disabled (a reviewer's view); sections still open and close. */
  isReadOnly?: boolean;
}

/**
 * The design document as a form in collapsible sections (design, drive, transformer and transistor of a
 * blocking-oscillator drive, ladder, output network, targets) under the Form index; each field checked in place.
 */
export const LadderForm = memo(function LadderForm({
  document,
  onChange,
  issues,
  parts = [],
  isReadOnly = false,
}: LadderFormProps) {
  // Edits read the latest document through a ref, so the edit functions stay the same from render to render and
  // a section whose part of the document did not change can skip rendering (its props are all the same).
  const documentRef = useRef(document);
  useLayoutEffect(() => {
    documentRef.current = document;
  });
  const onChangeRef = useRef(onChange);
  useLayoutEffect(() => {
    onChangeRef.current = onChange;
  });
  const edit: Edit<Design> = useCallback((mutate, key) => {
    const current = documentRef.current;
    const draft = structuredClone(current);
    mutate(draft);
    const next = withSharedBranches(current, draft);
    documentRef.current = next;
    onChangeRef.current(next, key);
  }, []);
  const partsRef = useRef(parts);
  partsRef.current = parts;
  const onPickPart = useCallback((slot: PartSlot, part: Part) => {
    const next = withShelfPart(documentRef.current, slot, part, partsRef.current);
    documentRef.current = next;
    onChangeRef.current(next);
  }, []);
  const issue = useCallback((path: string) => issues[path] ?? null, [issues]);
  const driver = document.drive.kind === 'driver' ? document.drive.driver : null;
  const sections = FORM_SECTIONS.filter(({ id }) => driver !== null || (id !== 'transformer' && id !== 'transistor'));
  const [open, setOpen] = useState<string[]>(() => sections.map(({ id }) => id));
  const issueCounts = new Map<FormSectionId, number>();
  for (const path of Object.keys(issues)) {
    const id = sectionOfPath(path);
    issueCounts.set(id, (issueCounts.get(id) ?? 0) + 1);
  }
  const jump = (id: string) => {
    setOpen((current) => (current.includes(id) ? current : [...current, id]));
    requestAnimationFrame(() => {
      const item = window.document.getElementById(`form-section-${id}`);
      item?.scrollIntoView({ block: 'start' });
      item?.querySelector<HTMLButtonElement>('button')?.focus({ preventScroll: true });
    });
  };

  return (
    <Stack gap="xs">
      <FormIndex
        entries={sections.map(({ id, title }) => ({ id, title, issueCount: issueCounts.get(id) ?? 0 }))}
        onJump={jump}
      />
      <Accordion multiple value={open} onChange={setOpen} variant="separated" chevronPosition="left">
        {sections.map(({ id, title }) => (
          <Accordion.Item key={id} value={id} id={`form-section-${id}`} className={classes.section}>
            <Accordion.Control>
              <Group gap="xs">
                <Text fw={600} size="sm">
                  {title}
                </Text>
                {(issueCounts.get(id) ?? 0) > 0 && (
                  <Badge color="red" variant="light" size="sm" radius="sm" tt="none">
                    {issueCounts.get(id)} to correct
                  </Badge>
                )}
              </Group>
            </Accordion.Control>
            <Accordion.Panel>
              <fieldset className={classes.fields} disabled={isReadOnly} aria-label={title}>
                <SectionBody
                  id={id}
                  document={document}
                  edit={edit}
                  issue={issue}
                  issues={issues}
                  parts={parts}
                  onPickPart={onPickPart}
                />
              </fieldset>
            </Accordion.Panel>
          </Accordion.Item>
        ))}
      </Accordion>
    </Stack>
  );
});

/** The parts of the document each section shows; a section renders again only when one of them changes. */
const sectionSlices: Record<FormSectionId, (document: Design) => readonly unknown[]> = {
  design: (d) => [d.name, d.notes],
  drive: (d) => [d.drive],
  transformer: (d) => [d.drive],
  transistor: (d) => [d.drive],
  ladder: (d) => [d.multiplier],
  output: (d) => [d.outputNetwork, d.load],
  targets: (d) => [d.targets],
};

interface SectionBodyProps {
  id: FormSectionId;
  document: Design;
  edit: Edit<Design>;
  issue: (path: string) => string | null;
  issues: Readonly<Record<string, string>>;
  parts: readonly Part[];
  onPickPart: (slot: PartSlot, part: Part) => void;
}

const SectionBody = memo(
  function SectionBody({ id, document, edit, issue, issues, parts, onPickPart }: SectionBodyProps) {
    const props = { document, edit, issue };
    const driver = document.drive.kind === 'driver' ? document.drive.driver : null;
    switch (id) {
      case 'design':
        return <DesignSection {...props} />;
      case 'drive':
        return <DriveSection {...props} />;
      case 'transformer':
        return (
          driver && (
            <TransformerSection
              driver={driver}
              edit={driverEdit(edit)}
              editDesign={edit}
              issue={issue}
              parts={parts}
              spacing={document.targets.spacing}
            />
          )
        );
      case 'transistor':
        return driver && <TransistorSection driver={driver} edit={driverEdit(edit)} issue={issue} />;
      case 'ladder':
        return <LadderSection {...props} parts={parts} onPickPart={onPickPart} issues={issues} />;
      case 'output':
        return <OutputSection {...props} parts={parts} onPickPart={onPickPart} />;
      case 'targets':
        return <TargetsSection {...props} />;
    }
  },
  (previous, next) =>
    previous.id === next.id &&
    previous.edit === next.edit &&
    previous.issue === next.issue &&
    previous.parts === next.parts &&
    previous.onPickPart === next.onPickPart &&
    sectionSlices[next.id](previous.document).every((slice, i) => slice === sectionSlices[next.id](next.document)[i]),
);
