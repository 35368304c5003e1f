import type { ReactNode } from 'react';
import classes from './field-grid.module.css';

/**
 * Form fields in as many columns as fit, each at least wide enough for a select's longest option, so a narrow
 * form column gives fewer, whole columns instead of clipped fields.
 */
export function FieldGrid({ children }: { children: ReactNode }) {
  return <div className={classes.grid}>{children}</div>;
}
