import { SetMetadata } from '@nestjs/common';
import type { AppAction, ProjectAction } from '@ladderwright/shared/auth';

export const PROJECT_ACTION_KEY = 'lw:projectAction';
export const APP_ACTION_KEY = 'lw:appAction';

/** The project action a `:projectId` route performs; without it the guard requires `project.read`. */
export const RequiresProjectAction = (action: ProjectAction): MethodDecorator & ClassDecorator =>
  SetMetadata(PROJECT_ACTION_KEY, action);

/** The installation-wide action a route performs, checked against the account role. */
export const RequiresAppAction = (action: AppAction): MethodDecorator & ClassDecorator =>
  SetMetadata(APP_ACTION_KEY, action);
