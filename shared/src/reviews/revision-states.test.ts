import { describe, expect, it } from 'vitest';
import { DomainError } from '../errors';
import { applyTransition, availableCommands, transitionRefusal } from './revision-states';

describe('revision state transitions', () => {
  it.each([
    ['submit', 'draft', 'engineer', true, 'submitted'],
    ['withdraw', 'submitted', 'engineer', true, 'draft'],
    ['approve', 'submitted', 'reviewer', false, 'approved'],
    ['return', 'submitted', 'reviewer', false, 'returned'],
    ['release', 'approved', 'lead', false, 'released'],
  ] as const)('%s from %s by a %s (author: %s) leads to %s', (command, from, actorRole, isAuthor, to) => {
    expect(applyTransition({ command, from, actorRole, isAuthor, note: 'checked the PIV margins' })).toBe(to);
  });

  it('refuses an author approving their own revision, naming the reason', () => {
    expect(() => applyTransition({ command: 'approve', from: 'submitted', actorRole: 'lead', isAuthor: true })).toThrow(
      /author cannot approve/,
    );
  });

  it('refuses a release of a revision that was never approved', () => {
    const refusal = transitionRefusal({ command: 'release', from: 'submitted', actorRole: 'lead', isAuthor: false });
    expect(refusal).toMatch(/must be approved/);
  });

  it('requires a note to return a revision', () => {
    expect(transitionRefusal({ command: 'return', from: 'submitted', actorRole: 'reviewer', isAuthor: false })).toMatch(
      /note is required/,
    );
  });

  it('throws a DomainError with code illegal_transition', () => {
    try {
      applyTransition({ command: 'submit', from: 'released', actorRole: 'engineer', isAuthor: true });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(DomainError);
      expect((error as DomainError).code).toBe('illegal_transition');
    }
  });

  it('lets only the system supersede a released revision', () => {
    expect(
      transitionRefusal({ command: 'supersede', from: 'released', actorRole: 'lead', isAuthor: false }),
    ).not.toBeNull();
    expect(applyTransition({ command: 'supersede', from: 'released', actorRole: 'system', isAuthor: false })).toBe(
      'superseded',
    );
  });

  it('offers a reviewer approve and return on a submitted revision, and nothing on a draft', () => {
    expect(availableCommands('submitted', 'reviewer', false).sort()).toEqual(['approve', 'return']);
    expect(availableCommands('draft', 'reviewer', false)).toEqual([]);
  });
});
