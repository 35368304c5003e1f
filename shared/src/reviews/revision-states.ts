import { DomainError } from '../errors';
import type { ProjectRole } from '../auth';

/** The Sign-off states of one revision. A revision's design document never changes; only its state does. */
export const REVISION_STATES = ['draft', 'submitted', 'returned', 'approved', 'released', 'superseded'] as const;
export type RevisionState = (typeof REVISION_STATES)[number];

/** The commands that move a revision between states. */
export type RevisionCommand = 'submit' | 'withdraw' | 'return' | 'approve' | 'release' | 'supersede';

interface TransitionRule {
  from: readonly RevisionState[];
  to: RevisionState;
  roles: readonly ProjectRole[];
  /** 'author-only': only the revision's author; 'not-author': anyone but the author; 'system': never a user. */
  actor: 'any' | 'author-only' | 'not-author' | 'system';
  needsNote: boolean;
}

const TRANSITIONS: Record<RevisionCommand, TransitionRule> = {
  submit: { from: ['draft'], to: 'submitted', roles: ['engineer', 'lead'], actor: 'author-only', needsNote: false },
  withdraw: { from: ['submitted'], to: 'draft', roles: ['engineer', 'lead'], actor: 'author-only', needsNote: false },
  return: { from: ['submitted'], to: 'returned', roles: ['reviewer', 'lead'], actor: 'not-author', needsNote: true },
  approve: { from: ['submitted'], to: 'approved', roles: ['reviewer', 'lead'], actor: 'not-author', needsNote: false },
  release: { from: ['approved'], to: 'released', roles: ['lead'], actor: 'any', needsNote: false },
  supersede: { from: ['released'], to: 'superseded', roles: [], actor: 'system', needsNote: false },
};

export interface TransitionRequest {
  command: RevisionCommand;
  from: RevisionState;
  actorRole: ProjectRole | 'system';
  isAuthor: boolean;
  note?: string;
}

/** The reason a transition is refused, or null when it is allowed. */
export function transitionRefusal(request: TransitionRequest): string | null {
  const rule = TRANSITIONS[request.command];
  if (!rule.from.includes(request.from)) {
    return `A ${request.from} revision cannot be ${pastTense(request.command)}; it must be ${rule.from.join(' or ')}.`;
  }
  if (rule.actor === 'system') {
    return request.actorRole === 'system' ? null : 'Revisions are superseded only by releasing a newer revision.';
  }
  if (request.actorRole === 'system') return null;
  if (!rule.roles.includes(request.actorRole)) {
    return `Only a ${rule.roles.join(' or ')} may ${request.command} a revision.`;
  }
  if (rule.actor === 'author-only' && !request.isAuthor) return `Only the revision's author may ${request.command} it.`;
  if (rule.actor === 'not-author' && request.isAuthor)
    return `The author cannot ${request.command} their own revision.`;
  if (rule.needsNote && !request.note?.trim()) return `A note is required to ${request.command} a revision.`;
  return null;
}

/**
 * The state a command leads to. Throws DomainError('illegal_transition') with the reason when the
 * command is not allowed from the current state, for this role, or for this actor.
 */
export function applyTransition(request: TransitionRequest): RevisionState {
  const refusal = transitionRefusal(request);
  if (refusal) throw new DomainError('illegal_transition', refusal, 'command');
  return TRANSITIONS[request.command].to;
}

/** The commands a given actor could issue from a state (for showing only the buttons that apply). */
export function availableCommands(from: RevisionState, actorRole: ProjectRole, isAuthor: boolean): RevisionCommand[] {
  return (Object.keys(TRANSITIONS) as RevisionCommand[]).filter(
    (command) => transitionRefusal({ command, from, actorRole, isAuthor, note: 'x' }) === null,
  );
}

export function isRevisionState(value: unknown): value is RevisionState {
  return typeof value === 'string' && (REVISION_STATES as readonly string[]).includes(value);
}

function pastTense(command: RevisionCommand): string {
  const forms: Record<RevisionCommand, string> = {
    submit: 'submitted',
    withdraw: 'withdrawn',
    return: 'returned',
    approve: 'approved',
    release: 'released',
    supersede: 'superseded',
  };
  return forms[command];
}
