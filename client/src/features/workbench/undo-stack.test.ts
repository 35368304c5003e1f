import { describe, expect, it } from 'vitest';
import { canRedo, canUndo, COALESCE_WINDOW_MS, createUndoStack, pushEdit, redo, undo, UNDO_LIMIT } from './undo-stack';

describe('undo stack', () => {
  it('undoes and redoes edits in order', () => {
    let stack = createUndoStack('a');
    stack = pushEdit(stack, 'b', { atMs: 0 });
    stack = pushEdit(stack, 'c', { atMs: 10 });
    stack = undo(stack);
    expect(stack.present).toBe('b');
    stack = undo(stack);
    expect(stack.present).toBe('a');
    expect(canUndo(stack)).toBe(false);
    stack = redo(stack);
    stack = redo(stack);
    expect(stack.present).toBe('c');
    expect(canRedo(stack)).toBe(false);
  });

  it('coalesces quick edits of one field into one step', () => {
    let stack = createUndoStack('');
    for (const [i, text] of ['1', '1n', '1n5'].entries()) stack = pushEdit(stack, text, { key: 'c1', atMs: i * 200 });
    expect(stack.past).toEqual(['']);
    expect(undo(stack).present).toBe('');
  });

  it('keeps edits of different fields, or of one field far apart, as separate steps', () => {
    let stack = createUndoStack(0);
    stack = pushEdit(stack, 1, { key: 'a', atMs: 0 });
    stack = pushEdit(stack, 2, { key: 'b', atMs: 10 });
    stack = pushEdit(stack, 3, { key: 'b', atMs: 10 + COALESCE_WINDOW_MS });
    expect(stack.past).toEqual([0, 1, 2]);
  });

  it('does not coalesce an edit made after an undo with the one before it', () => {
    let stack = createUndoStack(0);
    stack = pushEdit(stack, 1, { key: 'a', atMs: 0 });
    stack = undo(stack);
    stack = pushEdit(stack, 5, { key: 'a', atMs: 10 });
    expect(stack.past).toEqual([0]);
    expect(undo(stack).present).toBe(0);
  });

  it('drops the redo branch on a new edit and ignores an edit that changes nothing', () => {
    let stack = pushEdit(createUndoStack('a'), 'b', { atMs: 0 });
    stack = undo(stack);
    expect(pushEdit(stack, 'a', { atMs: 5 })).toBe(stack);
    stack = pushEdit(stack, 'x', { atMs: 5 });
    expect(canRedo(stack)).toBe(false);
    expect(undo(stack).present).toBe('a');
  });

  it('answers undo and redo with nothing to do by returning the same stack', () => {
    const stack = createUndoStack('a');
    expect(undo(stack)).toBe(stack);
    expect(redo(stack)).toBe(stack);
  });

  it('keeps at most the step limit', () => {
    let stack = createUndoStack(0);
    for (let i = 1; i <= UNDO_LIMIT + 50; i += 1) stack = pushEdit(stack, i, { atMs: i });
    expect(stack.past).toHaveLength(UNDO_LIMIT);
    expect(stack.past[0]).toBe(50);
  });
});
