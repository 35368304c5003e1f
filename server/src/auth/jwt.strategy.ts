import { Inject, Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import type { Request } from 'express';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { CurrentUser } from '@ladderwright/shared/api';
import { APP_ENV, type AppEnv } from '../config/env';
import { UsersService } from '../users/users.service';

export const SESSION_COOKIE = 'lw_session';

/**
 * The session cookie's name: `__Host-lw_session` when served over TLS (`COOKIE_SECURE`), which browsers keep
 * only if it is Secure, has Path=/ and no Domain, so a sibling subdomain cannot set or shadow it (RFC 6265bis
 * cookie prefixes); plain `lw_session` on loopback http, where a `__Host-` cookie would be dropped.
 */
export function sessionCookieName(env: Pick<AppEnv, 'cookieSecure'>): string {
  return env.cookieSecure ? `__Host-${SESSION_COOKIE}` : SESSION_COOKIE;
}

export interface SessionTokenPayload {
  sub: string;
  /** The account's session version when the token was issued; a bump revokes the token. */
  sv: number;
}

function fromSessionCookie(cookieName: string): (request: Request) => string | null {
  return (request) => {
    const cookies = request.cookies as Record<string, unknown> | undefined;
    const token = cookies?.[cookieName];
    return typeof token === 'string' && token.length > 0 ? token : null;
  };
}

/** Reads the session JWT from the httpOnly session cookie and loads the account it names. */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
  constructor(
    @Inject(APP_ENV) env: AppEnv,
    private readonly users: UsersService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromExtractors([fromSessionCookie(sessionCookieName(env))]),
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
