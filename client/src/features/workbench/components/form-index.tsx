import { Button, Group } from '@mantine/core';
import classes from './ladder-form.module.css';

export interface FormIndexEntry {
  id: string;
  title: string;
  /** Fields of the section with a validation message. */
  issueCount: number;
}

export interface FormIndexProps {
  entries: readonly FormIndexEntry[];
  onJump: (id: string) => void;
}

/**
 * The Form index: one button per form section, kept at the top of the inputs column; a section with fields to
 * correct shows how many. Pressing one opens the section and moves focus and view to it.
 */
export function FormIndex({ entries, onJump }: FormIndexProps) {
  return (
    <nav aria-label="Form index" className={classes.index}>
      <Group gap={4} wrap="wrap">
        {entries.map((entry) => (
          <Button
            key={entry.id}
            size="compact-sm"
            variant={entry.issueCount > 0 ? 'light' : 'subtle'}
            color={entry.issueCount > 0 ? 'red' : undefined}
            onClick={() => onJump(entry.id)}
            aria-label={entry.issueCount > 0 ? `${entry.title}, ${entry.issueCount} to correct` : entry.title}
          >
            {entry.title}
            {entry.issueCount > 0 ? ` (${entry.issueCount})` : ''}
          </Button>
        ))}
      </Group>
    </nav>
  );
}
