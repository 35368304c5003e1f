import { Injectable, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { SignInRequest, SignInResponse } from '@ladderwright/shared/api';
import { AuditService } from '../audit/audit.service';
import { RetryLaterException } from '../common/filters/domain-error.filter';
import { normalizeEmail, UsersService } from '../users/users.service';
import type { SessionTokenPayload } from './jwt.strategy';
import { SessionsService } from './sessions.service';
import { SignInDelayService } from './sign-in-delay.service';

export interface SignInResult extends SignInResponse {
  token: string;
}

@Injectable()
export class AuthService {
  constructor(
    private readonly users: UsersService,
    private readonly jwt: JwtService,
    private readonly delay: SignInDelayService,
    private readonly audit: AuditService,
    private readonly sessions: SessionsService,
  ) {}

  /**
   * Checks the credentials and issues a session token. The per-address and global limits (the throttler
   * guard) come first; then the account's own delay after failures in a row refuses with 429 and Retry-After
   * before any password is hashed.
   */
  async signIn(request: SignInRequest, clientAddress: string): Promise<SignInResult> {
    const email = normalizeEmail(request.email);
    const waitS = await this.delay.waitS(email);
    if (waitS > 0) {
      throw new RetryLaterException(`Too many failed sign-ins for this e-mail; try again in ${waitS} s`, waitS);
    }
    const user = await this.users.verifyCredentials(request.email, request.password);
    if (!user) {
      const failures = await this.delay.recordFailure(email);
      await this.recordFailedSignIn(email, failures, clientAddress);
      throw new UnauthorizedException('E-mail or password is not correct');
    }
    await this.delay.clear(email);
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

  /**
   * Failed sign-ins are audited aggregated: the 1st, 2nd, 4th, 8th, ... failure in a row writes one entry
   * carrying the count, so a flood of guesses at one e-mail writes a handful of rows, not one per guess.
   */
  private async recordFailedSignIn(email: string, failuresInRow: number, clientAddress: string): Promise<void> {
    if ((failuresInRow & (failuresInRow - 1)) !== 0) return;
    await this.audit.record({
      action: 'auth.sign_in_failed',
      actorId: null,
      actorEmail: email,
      detail: { reason: 'bad_credentials', failuresInRow },
      clientAddress,
    });
  }
}
