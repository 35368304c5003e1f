import type { ProjectRole, UserRole } from '../auth';
import type { ProjectSettings } from './admin.types';

/** POST /api/auth/sign-in body. The response sets an httpOnly cookie and returns `SignInResponse`. */
export interface SignInRequest {
  email: string;
  password: string;
}

export interface CurrentUser {
  id: string;
  email: string;
  displayName: string;
  role: UserRole;
}

export interface SignInResponse {
  user: CurrentUser;
}

/** Error body for every non-2xx response. `field` names the offending input when there is one. */
export interface ApiErrorBody {
  statusCode: number;
  code: string;
  message: string;
  field?: string;
  issues?: { path: string; message: string }[];
}

export interface ProjectSummary {
  id: string;
  name: string;
  productLine: string;
  description: string;
  myRole: ProjectRole;
  memberCount: number;
  /** Archived projects stay readable and take no more changes. */
  isArchived: boolean;
}

export interface ProjectMember {
  userId: string;
  email: string;
  displayName: string;
  role: ProjectRole;
}

export interface ProjectDetail extends ProjectSummary {
  members: ProjectMember[];
  settings: ProjectSettings;
}

export interface CreateProjectRequest {
  name: string;
  productLine: string;
  description?: string;
}

export interface AddMemberRequest {
  email: string;
  role: ProjectRole;
}

export interface CreateUserRequest {
  email: string;
  displayName: string;
  role: UserRole;
  password: string;
}

/** An account as the admin sees it in GET /api/users. */
export interface UserSummary extends CurrentUser {
  createdAt: string;
  isActive: boolean;
}

export interface ResetPasswordRequest {
  password: string;
}

export interface HealthResponse {
  status: 'ok' | 'degraded';
  app: { version: string; uptimeS: number };
  database: { status: 'up' | 'down'; latencyMs: number | null };
}
