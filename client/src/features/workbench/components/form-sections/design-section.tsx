import { TextInput, Textarea } from '@mantine/core';
import classes from './design-section.module.css';
import type { SectionProps } from './form-section.types';

/** Name and notes of the design. */
export function DesignSection({ document, edit, issue }: SectionProps) {
  return (
    <div className={classes.grid}>
      <TextInput
        label="Name"
        value={document.name}
        onChange={(e) => {
          const name = e.currentTarget.value;
          edit((d) => void (d.name = name), 'name');
        }}
        error={issue('name')}
      />
      <Textarea
        label="Notes"
        value={document.notes}
        autosize
        minRows={1}
        maxRows={4}
        onChange={(e) => {
          const notes = e.currentTarget.value;
          edit((d) => void (d.notes = notes), 'notes');
        }}
      />
    </div>
  );
}
