import { createParamDecorator, type ExecutionContext, InternalServerErrorException } from '@nestjs/common';
import type { AppRequest, ProjectMembership as Membership } from '../request.types';

/** The signed-in user's membership in the route's `:projectId`, as checked by the project access guard. */
export const ProjectMembership = createParamDecorator((_data: unknown, context: ExecutionContext): Membership => {
  const membership = context.switchToHttp().getRequest<AppRequest>().projectMembership;
  if (!membership) throw new InternalServerErrorException('Route has no :projectId to check membership against');
  return membership;
});
