import type { FieldIssue } from './domain-error';

const IDENTIFIER = /^[A-Za-z_$][\w$]*$/;

/**
 * The field-path notation of every FieldIssue: `multiplier.capacitors[3].valueF`; a key that is not an
 * identifier is quoted (`parts["odd key"]`). An empty parent gives the bare key.
 */
export function fieldPath(parent: string, key: string | number): string {
  if (typeof key === 'number') return `${parent}[${key}]`;
  if (!IDENTIFIER.test(key)) return `${parent}[${JSON.stringify(key)}]`;
  return parent ? `${parent}.${key}` : key;
}

/**
 * A field path under `prefix`, the place its document sits in (`document` and `multiplier.cellCount` give
 * `document.multiplier.cellCount`); the whole document ('(document)' or an empty path) is the prefix itself,
 * and an empty prefix leaves the path as it is.
 */
export function prefixedFieldPath(prefix: string, path: string): string {
  if (!prefix) return path;
  return path === '(document)' || path === '' ? prefix : `${prefix}.${path}`;
}

/** Most issues one error reports; the rest are counted in a last issue at `at`. */
export const MAX_FIELD_ISSUES = 100;

/** The first `max` issues and, past them, one more saying how many were left out. */
export function capIssues(issues: FieldIssue[], at: string, max = MAX_FIELD_ISSUES): FieldIssue[] {
  if (issues.length <= max) return issues;
  const rest = issues.length - max;
  return [
    ...issues.slice(0, max),
    { path: at, message: `and ${rest} more problem${rest === 1 ? '' : 's'} not listed` },
  ];
}
