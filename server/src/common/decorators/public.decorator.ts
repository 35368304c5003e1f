import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC_KEY = 'lw:isPublic';

/** Marks a route as reachable without a session (sign-in, health, docs). Every other route needs one. */
export const Public = (): MethodDecorator & ClassDecorator => SetMetadata(IS_PUBLIC_KEY, true);
