export { USER_ROLES, PROJECT_ROLES, isUserRole, isProjectRole } from './roles';
export type { UserRole, ProjectRole } from './roles';
export { canActInProject, canInProject, canInApp, rolesFor } from './permissions';
export type { ProjectAction, AppAction } from './permissions';
export { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH, passwordPolicyProblem } from './password-policy';
