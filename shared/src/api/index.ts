export type {
  SignInRequest,
  SignInResponse,
  CurrentUser,
  ApiErrorBody,
  ProjectSummary,
  ProjectMember,
  ProjectDetail,
  AddMemberRequest,
  CreateUserRequest,
  ResetPasswordRequest,
  HealthResponse,
} from './auth.types';
