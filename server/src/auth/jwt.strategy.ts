import { createSecretKey, type KeyObject } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import type { Request } from 'express';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { CurrentUser } from '@ladderwright/shared/api';
import { APP_ENV, type AppEnv } from '../config/env';
import { SessionsService } from './sessions.service';

export const SESSION_COOKIE = 'lw_session';

/**
 * The session cookie's name: `__Host-lw_session` when served over TLS (`COOKIE_SECURE`), which browsers keep
 * only if it is Secure, has Path=/ and no Domain, so a sibling subdomain cannot set or shadow it (RFC 6265bis
 * cookie prefixes); plain `lw_session` on loopback http, where a `__Host-` cookie would be dropped.
 */
export function sessionCookieName(env: Pick<AppEnv, 'cookieSecure'>): string {
  return env.cookieSecure ? `__Host-${SESSION_COOKIE}` : SESSION_COOKIE;
}

/**
 * The HS256 secret as a secret KeyObject. Handed a string, jsonwebtoken first tries to read it as a public
 * key on every verification; a KeyObject of type 'secret' goes straight to HMAC.
 */
export function sessionSigningKey(env: Pick<AppEnv, 'jwtSecret'>): KeyObject {
  return createSecretKey(Buffer.from(env.jwtSecret, 'utf8'));
}

export interface SessionTokenPayload {
  sub: string;
  /** The session's id (its row in `sessions`); signing out revokes it. */
  jti: string;
  /** The account's session version when the token was issued; a bump revokes every token of the account. */
  sv: number;
  exp: number;
}

export function fromSessionCookie(cookieName: string): (request: Request) => string | null {
  return (request) => {
    const cookies = request.cookies as Record<string, unknown> | undefined;
    const token = cookies?.[cookieName];
    return typeof token === 'string' && token.length > 0 ? token : null;
  };
}

/** Reads the session JWT from the httpOnly session cookie and resolves the session it names. */
@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy, 'jwt') {
  constructor(
    @Inject(APP_ENV) env: AppEnv,
    private readonly sessions: SessionsService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromExtractors([fromSessionCookie(sessionCookieName(env))]),
      secretOrKey: sessionSigningKey(env) as unknown as string,
      algorithms: ['HS256'],
      ignoreExpiration: false,
    });
  }

  /**
   * Returning null makes passport answer 401: a token without an expiry, session id or version; a revoked
   * or expired session; an account that is gone or whose sessions were revoked since the token was issued.
   * A present `exp` is checked by the library before this.
   */
  async validate(payload: Partial<SessionTokenPayload>): Promise<CurrentUser | null> {
    if (typeof payload.exp !== 'number' || typeof payload.sub !== 'string') return null;
    if (typeof payload.jti !== 'string' || typeof payload.sv !== 'number') return null;
    return this.sessions.resolve(payload.jti, payload.sub, payload.sv);
  }
}
