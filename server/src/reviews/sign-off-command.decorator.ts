import { applyDecorators, HttpCode, Post } from '@nestjs/common';
import { ApiConflictResponse } from '@nestjs/swagger';
import type { ProjectAction } from '@ladderwright/shared/auth';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { UserCommand } from './sign-off.service';

const ILLEGAL = 'illegal_transition: not allowed from this state, for this role or for the author; the body says why.';

/** A Sign-off command route: `POST <command>` answering 200 with the new Sign-off, 409 when the transition is illegal. */
export const SignOffCommand = (command: UserCommand, action: ProjectAction): MethodDecorator =>
  applyDecorators(
    Post(command),
    HttpCode(200),
    RequiresProjectAction(action),
    ApiConflictResponse({ description: ILLEGAL }),
  );
