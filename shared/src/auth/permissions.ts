import type { ProjectRole, UserRole } from './roles';

/** Actions inside a project, granted by the member's project role. */
export type ProjectAction =
  | 'project.read'
  | 'design.write'
  | 'revision.submit'
  | 'review.comment'
  | 'review.decide'
  | 'revision.release'
  | 'specSheet.export'
  | 'specSheet.exportDraft'
  | 'parts.manage'
  | 'bench.upload'
  | 'members.manage'
  | 'members.request';

/** Actions on the whole installation, granted by the account role. */
export type AppAction = 'users.manage' | 'projects.create' | 'outbox.read' | 'audit.read';

const PROJECT_GRANTS: Record<ProjectAction, readonly ProjectRole[]> = {
  'project.read': ['engineer', 'reviewer', 'lead'],
  'design.write': ['engineer', 'lead'],
  'revision.submit': ['engineer', 'lead'],
  'review.comment': ['engineer', 'reviewer', 'lead'],
  'review.decide': ['reviewer', 'lead'],
  'revision.release': ['lead'],
  'specSheet.export': ['lead'],
  'specSheet.exportDraft': ['engineer', 'lead'],
  'parts.manage': ['lead'],
  'bench.upload': ['engineer', 'lead'],
  'members.manage': ['lead'],
  // A lead adds members directly; the others ask the leads.
  'members.request': ['engineer', 'reviewer'],
};

const APP_GRANTS: Record<AppAction, readonly UserRole[]> = {
  'users.manage': ['admin'],
  'projects.create': ['admin', 'lead'],
  'outbox.read': ['admin'],
  'audit.read': ['admin'],
};

/** Whether a project member with `role` may perform `action`. */
export function canInProject(role: ProjectRole, action: ProjectAction): boolean {
  return PROJECT_GRANTS[action].includes(role);
}

/** Whether an account with `role` may perform the installation-wide `action`. */
export function canInApp(role: UserRole, action: AppAction): boolean {
  return APP_GRANTS[action].includes(role);
}

/** The project roles that grant `action` (for messages and for the authorization matrix test). */
export function rolesFor(action: ProjectAction): readonly ProjectRole[] {
  return PROJECT_GRANTS[action];
}

/** The actions that change nothing: all an archived project still allows. */
const READING_ACTIONS: readonly ProjectAction[] = ['project.read', 'specSheet.export', 'specSheet.exportDraft'];

/**
 * Whether a member may perform `action` in a project as it stands: granted by the role, and in an archived
 * project only if it changes nothing (the server refuses every other change with 409).
 */
export function canActInProject(project: { myRole: ProjectRole; isArchived: boolean }, action: ProjectAction): boolean {
  return canInProject(project.myRole, action) && (!project.isArchived || READING_ACTIONS.includes(action));
}
