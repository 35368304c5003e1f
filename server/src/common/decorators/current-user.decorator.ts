import { createParamDecorator, type ExecutionContext, UnauthorizedException } from '@nestjs/common';
import type { CurrentUser as SessionUser } from '@ladderwright/shared/api';
import type { AppRequest } from '../request.types';

/** The signed-in account, as set by the JWT guard. */
export const CurrentUser = createParamDecorator((_data: unknown, context: ExecutionContext): SessionUser => {
  const user = context.switchToHttp().getRequest<AppRequest>().user;
  if (!user) throw new UnauthorizedException('Sign in first');
  return user;
});
