/**
 * What the audit log records. Add an action here when a module starts recording it:
 * sign-ins (both outcomes), account and project role changes, password resets, session revocations, releases.
 */
export const AUDIT_ACTIONS = [
  'auth.sign_in',
  'auth.sign_in_failed',
  'auth.sign_out_everywhere',
  'user.created',
  'user.password_reset',
  'project.member_added',
  'project.member_role_changed',
  'project.member_removed',
  'revision.released',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** One call to `AuditService.record`. `actorId` null: nobody signed in (e.g. a failed sign-in). */
export interface AuditRecord {
  action: AuditAction;
  actorId: string | null;
  actorEmail?: string | null;
  subjectType?: string | null;
  subjectId?: string | null;
  detail?: Record<string, unknown>;
  clientAddress?: string | null;
}

/** One entry as GET /api/audit returns it. */
export interface AuditEntry {
  id: string;
  occurredAt: string;
  action: AuditAction;
  actorId: string | null;
  actorEmail: string | null;
  subjectType: string | null;
  subjectId: string | null;
  detail: Record<string, unknown>;
  clientAddress: string | null;
}
