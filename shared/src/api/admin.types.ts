import type { ProjectRole, UserRole } from '../auth';
import type { DischargeRule } from '../designs';
import type { AcceptanceSettings } from '../reviews';
import type { UserSummary } from './auth.types';

/** GET /api/users: one page of accounts, filtered by `q` (e-mail or name) and optionally by state. */
export interface UserListQuery {
  q?: string;
  status?: 'active' | 'deactivated';
  page?: number;
  pageSize?: number;
}

export interface UserPage {
  items: UserSummary[];
  total: number;
  page: number;
  pageSize: number;
}

/** PATCH /api/users/:userId: change the account role, deactivate or reactivate. */
export interface UpdateUserRequest {
  role?: UserRole;
  isActive?: boolean;
}

/** POST /api/users/:userId/password-reset: a one-time link, shown to the admin once or mailed to the user. */
export interface CreatePasswordResetRequest {
  delivery: 'show' | 'mail';
}

export interface PasswordResetLink {
  /** The link itself when `delivery` was `show` (never stored, never shown again); null when it was mailed. */
  url: string | null;
  expiresAt: string;
  mailedTo: string | null;
}

/** POST /api/auth/password-reset (public): sets a new password with the token from a one-time link. */
export interface CompletePasswordResetRequest {
  token: string;
  password: string;
}

/** The audit log's actions (see the server's audit module for who records each). */
export const AUDIT_ACTIONS = [
  'auth.sign_in',
  'auth.sign_in_failed',
  'auth.sign_out_everywhere',
  'auth.password_reset_completed',
  'user.created',
  'user.password_reset',
  'user.role_changed',
  'user.deactivated',
  'user.reactivated',
  'project.member_added',
  'project.member_role_changed',
  'project.member_removed',
  'project.settings_changed',
  'project.archived',
  'project.unarchived',
  'project.member_requested',
  'project.member_request_accepted',
  'project.member_request_declined',
  'revision.released',
  'revision.gates_overridden',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

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

/** GET /api/audit and /api/audit/export.csv filters; `from`/`to` are ISO 8601 instants, `to` exclusive. */
export interface AuditQuery {
  actor?: string;
  action?: AuditAction;
  from?: string;
  to?: string;
  page?: number;
  pageSize?: number;
}

export interface AuditPage {
  items: AuditEntry[];
  total: number;
  page: number;
  pageSize: number;
}

/** Targets a new blank design in the project starts from (any left out keep the built-in blank's). */
export interface DefaultTargets {
  outputV?: number;
  rippleMaxV?: number;
  loadCurrentA?: number;
  safeVoltageV?: number;
  dischargeRule?: DischargeRule;
}

/** A project's settings as its lead sets them. */
export interface ProjectSettings {
  defaultTargets: DefaultTargets;
  acceptance: AcceptanceSettings;
}

/** PATCH /api/projects/:projectId (lead). */
export interface UpdateProjectRequest {
  name?: string;
  description?: string;
  defaultTargets?: DefaultTargets;
  acceptance?: AcceptanceSettings;
}

/** PATCH /api/projects/:projectId/members/:userId (lead). */
export interface ChangeMemberRoleRequest {
  role: ProjectRole;
}

/** The mails a user can choose to receive, one per event type. */
export const MAIL_KINDS = [
  'sign-off.submit',
  'sign-off.withdraw',
  'sign-off.approve',
  'sign-off.return',
  'sign-off.release',
  'sign-off.comment',
  'members.request-decided',
] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

/** GET/PUT /api/me/notifications: for each mail kind, whether the user receives it. */
export type NotificationSettings = Record<MailKind, boolean>;

/** Longest note on a member request or reason for declining one (characters). */
export const MEMBER_REQUEST_NOTE_MAX = 500;

export type MemberRequestState = 'pending' | 'accepted' | 'declined';

/** POST /api/projects/:projectId/member-requests (engineer or reviewer): ask the leads to add a person. */
export interface CreateMemberRequestRequest {
  email: string;
  role: ProjectRole;
  note?: string;
}

/** POST /api/projects/:projectId/member-requests/:requestId/decline (lead). */
export interface DeclineMemberRequestRequest {
  reason?: string;
}

/** A request that a person be added to a project, and its outcome. */
export interface MemberRequest {
  id: string;
  projectId: string;
  email: string;
  role: ProjectRole;
  note: string;
  state: MemberRequestState;
  requesterId: string;
  requesterName: string;
  createdAt: string;
  decidedByName: string | null;
  decidedAt: string | null;
  declineReason: string | null;
}
