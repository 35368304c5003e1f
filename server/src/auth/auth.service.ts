import { Injectable, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { SignInRequest, SignInResponse } from '@ladderwright/shared/api';
import { AuditService } from '../audit/audit.service';
import { RetryLaterException } from '../common/filters/domain-error.filter';
import { normalizeEmail, UsersService } from '../users/users.service';
import type { SessionTokenPayload } from './jwt.strategy';
import { SessionsService } from './sessions.service';
import { SignInThrottleService } from './sign-in-throttle.service';

export interface SignInResult extends SignInResponse {
  token: string;
}

@Injectable()
export class AuthService {
  constructor(
    private readonly users: UsersService,
    private readonly jwt: JwtService,
    private readonly throttle: SignInThrottleService,
    private readonly audit: AuditService,
    private readonly sessions: SessionsService,
  ) {}

  /** Checks the credentials and issues a session token; refuses with 429 after repeated failures. */
  async signIn(request: SignInRequest, clientAddress: string): Promise<SignInResult> {
    const email = normalizeEmail(request.email);
    const key = `${email}|${clientAddress}`;
    const waitS = this.throttle.retryAfterS(key);
    if (waitS > 0) {
      await this.recordFailedSignIn(email, 'throttled', clientAddress);
      throw new RetryLaterException(`Too many failed sign-ins for this e-mail; try again in ${waitS} s`, waitS);
    }
    const user = await this.users.verifyCredentials(request.email, request.password);
    if (!user) {
      this.throttle.recordFailure(key);
      await this.recordFailedSignIn(email, 'bad_credentials', clientAddress);
      throw new UnauthorizedException('E-mail or password is not correct');
    }
    this.throttle.clear(key);
    const payload: Omit<SessionTokenPayload, 'exp'> = {
      sub: user.id,
      jti: await this.sessions.open(user.id, clientAddress),
      sv: await this.users.sessionVersionOf(user.id),
    };
    await this.audit.record({ action: 'auth.sign_in', actorId: user.id, actorEmail: user.email, clientAddress });
    return { user, token: await this.jwt.signAsync(payload) };
  }

  /** Revokes the session a token names, so that the token, replayed, is refused. Expired tokens are ignored. */
  async signOut(token: string | null): Promise<void> {
    if (token === null) return;
    const payload = await this.jwt
      .verifyAsync<Partial<SessionTokenPayload>>(token, { ignoreExpiration: true })
      .catch(() => null);
    if (typeof payload?.jti === 'string') await this.sessions.revoke(payload.jti);
  }

  /** Revokes every session of the account, the caller's own included. */
  async signOutEverywhere(userId: string, email: string, clientAddress: string): Promise<void> {
    await this.users.revokeSessions(userId);
    await this.sessions.revokeAllOf(userId);
    await this.audit.record({ action: 'auth.sign_out_everywhere', actorId: userId, actorEmail: email, clientAddress });
  }

  private async recordFailedSignIn(email: string, reason: string, clientAddress: string): Promise<void> {
    await this.audit.record({
      action: 'auth.sign_in_failed',
      actorId: null,
      actorEmail: email,
      detail: { reason },
      clientAddress,
    });
  }
}
