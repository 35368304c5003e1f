import type { Request } from 'express';
import type { CurrentUser } from '@ladderwright/shared/api';
import type { ProjectRole } from '@ladderwright/shared/auth';

/** The signed-in member's standing in the project named by the route's `:projectId`. */
export interface ProjectMembership {
  projectId: string;
  role: ProjectRole;
  /** An archived project answers reads only. */
  isArchived: boolean;
}

/** An Express request after the guards: `user` set by the JWT guard, `projectMembership` by the project guard. */
export interface AppRequest extends Request {
  user?: CurrentUser;
  projectMembership?: ProjectMembership;
}
