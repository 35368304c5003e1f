import { useCallback, useEffect, useState } from 'react';
import type { Design } from '@ladderwright/shared/designs';
import { canRedo, canUndo, createUndoStack, pushEdit, redo, undo, type UndoStack } from '../undo-stack';

export interface DesignDraft {
  draft: Design;
  /** True when the draft differs from the saved document it started from. */
  isDirty: boolean;
  /** Replaces the draft; `key` (the field's document path) lets quick edits of one field coalesce. */
  setDraft: (next: Design, key?: string) => void;
  /** Goes back to the saved document, as one step that can itself be undone. */
  discard: () => void;
  undo: () => void;
  redo: () => void;
  canUndo: boolean;
  canRedo: boolean;
}

/** Marks an element whose text editing keeps the browser's own undo (e.g. the change note). */
export const NATIVE_UNDO_ATTRIBUTE = 'data-native-undo';

/**
 * The document being edited on the Workbench, with undo and redo over every design edit for the session
 * (Ctrl+Z or ⌘Z; Ctrl+Shift+Z, ⌘⇧Z or Ctrl+Y to redo). With `isReadOnly` the keys do nothing.
 */
export function useDesignDraft(saved: Design, { isReadOnly = false }: { isReadOnly?: boolean } = {}): DesignDraft {
  const [stack, setStack] = useState<UndoStack<Design>>(() => createUndoStack(saved));
  const setDraft = useCallback(
    (next: Design, key?: string) =>
      setStack((current) => pushEdit(current, next, { atMs: performance.now(), ...(key ? { key } : {}) })),
    [],
  );
  const undoStep = useCallback(() => setStack(undo), []);
  const discard = useCallback(() => setDraft(saved), [setDraft, saved]);
  const redoStep = useCallback(() => setStack(redo), []);

  useEffect(() => {
    if (isReadOnly) return undefined;
    const onKeyDown = (event: KeyboardEvent) => {
      if (!(event.ctrlKey || event.metaKey) || event.altKey) return;
      const key = event.key.toLowerCase();
      const isUndo = key === 'z' && !event.shiftKey;
      const isRedo = (key === 'z' && event.shiftKey) || (key === 'y' && !event.shiftKey);
      if (!isUndo && !isRedo) return;
      const target = event.target instanceof Element ? event.target : null;
      if (target?.closest(`[${NATIVE_UNDO_ATTRIBUTE}]`)) return;
      event.preventDefault();
      if (isUndo) undoStep();
      else redoStep();
    };
    window.addEventListener('keydown', onKeyDown);
    return () => window.removeEventListener('keydown', onKeyDown);
  }, [isReadOnly, undoStep, redoStep]);

  return {
    draft: stack.present,
    isDirty: stack.present !== saved,
    setDraft,
    discard,
    undo: undoStep,
    redo: redoStep,
    canUndo: canUndo(stack),
    canRedo: canRedo(stack),
  };
}
