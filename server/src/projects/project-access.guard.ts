import { type CanActivate, type ExecutionContext, Injectable, UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { canInProject, type ProjectAction, rolesFor } from '@ladderwright/shared/auth';
import { DomainError } from '@ladderwright/shared/errors';
import { ALLOWED_WHEN_ARCHIVED_KEY } from '../common/decorators/allowed-when-archived.decorator';
import { PROJECT_ACTION_KEY } from '../common/decorators/requires-permission.decorator';
import type { AppRequest } from '../common/request.types';
import { isUuid } from '../common/uuid';
import { ProjectsService } from './projects.service';

/**
 * Global guard for routes with `:projectId`. Not a member (or no such project, or a malformed id) -> 404,
 * so that projects of other teams cannot be discovered; a member whose project role lacks the route's
 * action -> 403. An archived project answers reads only (409 otherwise), except the routes marked
 * `@AllowedWhenArchived()` (evaluating, unarchiving).
 */
const READING_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

@Injectable()
export class ProjectAccessGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly projects: ProjectsService,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const request = context.switchToHttp().getRequest<AppRequest>();
    const param: unknown = request.params?.projectId;
    if (param === undefined) return true;
    const projectId = typeof param === 'string' ? param : '';
    const user = request.user;
    if (!user) throw new UnauthorizedException('Sign in first');

    const standing = isUuid(projectId) ? await this.projects.findMemberStanding(projectId, user.id) : null;
    if (!standing) throw new DomainError('not_found', 'Project not found', 'projectId');
    const { role } = standing;

    const action =
      this.reflector.getAllAndOverride<ProjectAction | undefined>(PROJECT_ACTION_KEY, [
        context.getHandler(),
        context.getClass(),
      ]) ?? 'project.read';
    if (!canInProject(role, action)) {
      throw new DomainError(
        'forbidden',
        `Needs the ${rolesFor(action).join(' or ')} role in this project (you are ${role})`,
      );
    }
    const isAllowedWhenArchived = this.reflector.get<boolean | undefined>(
      ALLOWED_WHEN_ARCHIVED_KEY,
      context.getHandler(),
    );
    if (standing.isArchived && !READING_METHODS.has(request.method) && !isAllowedWhenArchived) {
      throw new DomainError('illegal_transition', 'This project is archived: it can be read but not changed');
    }
    request.projectMembership = { projectId, role, isArchived: standing.isArchived };
    return true;
  }
}
