/**
 * The edit history of one document for a session: past states, the present one and the undone ones. Plain data;
 * every operation returns a new stack. Edits of the same field in quick succession (typing "4n7" one key at a
 * time) coalesce into one step, so one undo takes back the whole value.
 */
export interface UndoStack<T> {
  past: readonly T[];
  present: T;
  future: readonly T[];
  /** The field of the last edit and when it was made, for coalescing; null after undo, redo or an unkeyed edit. */
  last: { key: string; atMs: number } | null;
}

export interface EditOptions {
  /** The field edited (a document path); edits without one never coalesce. */
  key?: string;
  /** When the edit was made (ms, any monotonic clock). */
  atMs: number;
}

/** Edits of one field closer together than this are one step. */
export const COALESCE_WINDOW_MS = 1000;
/** Steps kept; the oldest are dropped beyond it. */
export const UNDO_LIMIT = 200;

export function createUndoStack<T>(present: T): UndoStack<T> {
  return { past: [], present, future: [], last: null };
}

/** Records `next` as the present; a redo branch is dropped. An edit that changes nothing is no step. */
export function pushEdit<T>(stack: UndoStack<T>, next: T, { key, atMs }: EditOptions): UndoStack<T> {
  if (Object.is(next, stack.present)) return stack;
  const last = key === undefined ? null : { key, atMs };
  const isCoalescing =
    key !== undefined && stack.last !== null && stack.last.key === key && atMs - stack.last.atMs < COALESCE_WINDOW_MS;
  if (isCoalescing) return { ...stack, present: next, future: [], last };
  const past = [...stack.past, stack.present].slice(-UNDO_LIMIT);
  return { past, present: next, future: [], last };
}

export function canUndo<T>(stack: UndoStack<T>): boolean {
  return stack.past.length > 0;
}

export function canRedo<T>(stack: UndoStack<T>): boolean {
  return stack.future.length > 0;
}

/** The state before the last step; the stack itself when there is none. */
export function undo<T>(stack: UndoStack<T>): UndoStack<T> {
  const previous = stack.past[stack.past.length - 1];
  if (stack.past.length === 0) return stack;
  return {
    past: stack.past.slice(0, -1),
    present: previous as T,
    future: [stack.present, ...stack.future],
    last: null,
  };
}

/** The step last undone, again; the stack itself when there is none. */
export function redo<T>(stack: UndoStack<T>): UndoStack<T> {
  if (stack.future.length === 0) return stack;
  const [next, ...future] = stack.future;
  return { past: [...stack.past, stack.present], present: next as T, future, last: null };
}
