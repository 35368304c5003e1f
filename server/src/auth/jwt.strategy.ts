import { Inject, Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import type { Request } from 'express';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { CurrentUser } from '@ladderwright/shared/api';
import { APP_ENV, type AppEnv } from '../config/env';
import { UsersService } from '../users/users.service';

export const SESSION_COOKIE = 'lw_session';

export interface SessionTokenPayload {
  sub: string;
  /** The account's session version when the token was issued; a bump revokes the token. */
  sv: number;
}

function fromSessionCookie(request: Request): string | null {
  const cookies = request.cookies as Record<string, unknown> | undefined;
  const token = cookies?.[SESSION_COOKIE];
  return typeof token === 'string' && token.length > 0 ? token : null;
}

/** Reads the session JWT from the httpOnly `lw_session` cookie and loads the account it names. */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
  constructor(
    @Inject(APP_ENV) env: AppEnv,
    private readonly users: UsersService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromExtractors([fromSessionCookie]),
      secretOrKey: env.jwtSecret,
      algorithms: ['HS256'],
      ignoreExpiration: false,
    });
  }

  /**
   * Returning null makes passport answer 401: the account was deleted, or its sessions were revoked since
   * the token was issued (sign out everywhere, password reset). Expiry (`exp`) is checked before this.
   */
  async validate(payload: Partial<SessionTokenPayload>): Promise<CurrentUser | null> {
    if (typeof payload.sub !== 'string' || typeof payload.sv !== 'number') return null;
    return this.users.findSessionUser(payload.sub, payload.sv);
  }
}
