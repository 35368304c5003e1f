/** A user's account role. `admin` manages users; the other three are also the roles a project member can hold. */
export const USER_ROLES = ['engineer', 'reviewer', 'lead', 'admin'] as const;
export type UserRole = (typeof USER_ROLES)[number];

/** The role a member holds inside one project. */
export const PROJECT_ROLES = ['engineer', 'reviewer', 'lead'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export function isUserRole(value: unknown): value is UserRole {
  return typeof value === 'string' && (USER_ROLES as readonly string[]).includes(value);
}

export function isProjectRole(value: unknown): value is ProjectRole {
  return typeof value === 'string' && (PROJECT_ROLES as readonly string[]).includes(value);
}
