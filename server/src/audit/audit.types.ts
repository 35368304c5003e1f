import type { AuditAction } from '@ladderwright/shared/api';

export { AUDIT_ACTIONS } from '@ladderwright/shared/api';
export type { AuditAction, AuditEntry } from '@ladderwright/shared/api';

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
