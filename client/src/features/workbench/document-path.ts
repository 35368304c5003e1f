import { prefixedFieldPath } from '@ladderwright/shared/errors';

/** A function-free object type: the values a document path can step into. */
type Branch<V> = V extends (...args: never[]) => unknown ? never : V extends object ? V : never;

/**
 * Every dotted path to a number in T, through each member of a union (drive kinds, load kinds) and past
 * null or undefined branches (the bleeder, the clamp). Arrays are not stepped into.
 */
export type NumberPath<T> = T extends readonly unknown[]
  ? never
  : T extends object
    ? {
        [K in keyof T & string]-?: NonNullable<T[K]> extends number
          ? K
          : Branch<NonNullable<T[K]>> extends never
            ? never
            : `${K}.${NumberPath<Branch<NonNullable<T[K]>>>}`;
      }[keyof T & string]
    : never;

type Node = Record<string, unknown>;

function isNode(value: unknown): value is Node {
  return typeof value === 'object' && value !== null;
}

/** The number at `path`; NaN when the path runs into a missing branch or field (an empty field). */
export function getAt<T extends object>(document: T, path: NumberPath<T>): number {
  let node: unknown = document;
  for (const key of path.split('.')) node = isNode(node) ? node[key] : undefined;
  return typeof node === 'number' ? node : Number.NaN;
}

/** Writes `value` at `path` in place; does nothing when a branch on the way is missing. */
export function setAt<T extends object>(document: T, path: NumberPath<T>, value: number): void {
  const keys = path.split('.');
  const last = keys.pop();
  let node: unknown = document;
  for (const key of keys) node = isNode(node) ? node[key] : undefined;
  if (isNode(node) && last !== undefined) node[last] = value;
}

/** Removes the field at `path` in place (an optional field back to its default); a missing branch is left alone. */
export function deleteAt<T extends object>(document: T, path: NumberPath<T>): void {
  const keys = path.split('.');
  const last = keys.pop();
  let node: unknown = document;
  for (const key of keys) node = isNode(node) ? node[key] : undefined;
  if (isNode(node) && last !== undefined) delete node[last];
}

/** Applies one change to a copy of a document; `key` names the field changed (its full document path). */
export type Edit<T> = (mutate: (draft: T) => void, key?: string) => void;

/** One numeric field's binding to a document: its full path, value, validation message and the edit that writes it. */
export interface Binding {
  path: string;
  value: number;
  issue: string | null;
  onValue: (value: number) => void;
}

/**
 * `bind(path)` for a document (or a part of one at `prefix`, e.g. `drive.driver`), its edit function and the
 * validation messages by full document path.
 */
export function binder<T extends object>(
  document: T,
  edit: Edit<T>,
  issueOf: (path: string) => string | null,
  prefix = '',
) {
  return (path: NumberPath<T>): Binding => {
    const fullPath = prefixedFieldPath(prefix, path);
    return {
      path: fullPath,
      value: getAt(document, path),
      issue: issueOf(fullPath),
      onValue: (value) => edit((draft) => setAt(draft, path, value), fullPath),
    };
  };
}

/**
 * `next` with every branch that equals the one in `previous` replaced by that very branch, so an edit keeps the
 * identity of all it did not touch and memoized parts of the form can skip rendering.
 */
export function withSharedBranches<T>(previous: T, next: T): T {
  if (Object.is(previous, next)) return previous;
  if (!isNode(previous) || !isNode(next) || Array.isArray(previous) !== Array.isArray(next)) return next;
  const previousKeys = Object.keys(previous);
  const nextKeys = Object.keys(next);
  let isSame = previousKeys.length === nextKeys.length;
  const shared: Node = Array.isArray(next) ? ([] as unknown as Node) : {};
  for (const key of nextKeys) {
    const branch = withSharedBranches(previous[key], next[key]);
    shared[key] = branch;
    if (branch !== previous[key] || !(key in previous)) isSame = false;
  }
  return (isSame ? previous : shared) as T;
}

/** The binding of an optional field: also `onClear`, which removes the field so that its default applies. */
export interface OptionalBinding extends Binding {
  onClear: () => void;
}

/** `bind(path)` for optional fields (see binder): an emptied field is removed from the document, not NaN. */
export function optionalBinder<T extends object>(
  document: T,
  edit: Edit<T>,
  issueOf: (path: string) => string | null,
  prefix = '',
) {
  const bind = binder(document, edit, issueOf, prefix);
  return (path: NumberPath<T>): OptionalBinding => {
    const binding = bind(path);
    return { ...binding, onClear: () => edit((draft) => deleteAt(draft, path), binding.path) };
  };
}
