import { type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { type AppAction, canInApp } from '@ladderwright/shared/auth';
import { DomainError } from '@ladderwright/shared/errors';
import { APP_ACTION_KEY } from '../decorators/requires-permission.decorator';
import type { AppRequest } from '../request.types';

/** Global guard for `@RequiresAppAction(...)`: the account role must grant the action (else 403). */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const action = this.reflector.getAllAndOverride<AppAction | undefined>(APP_ACTION_KEY, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (!action) return true;
    const user = context.switchToHttp().getRequest<AppRequest>().user;
    if (!user || !canInApp(user.role, action)) {
      throw new DomainError('forbidden', `Your account role may not perform ${action}`);
    }
    return true;
  }
}
