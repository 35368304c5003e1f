import { Injectable, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { SignInRequest, SignInResponse } from '@ladderwright/shared/api';
import { RetryLaterException } from '../common/filters/domain-error.filter';
import { normalizeEmail, UsersService } from '../users/users.service';
import type { SessionTokenPayload } from './jwt.strategy';
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
  ) {}

  /** Checks the credentials and issues a session token; refuses with 429 after repeated failures. */
  async signIn(request: SignInRequest, clientAddress: string): Promise<SignInResult> {
    const key = `${normalizeEmail(request.email)}|${clientAddress}`;
    const waitS = this.throttle.retryAfterS(key);
    if (waitS > 0) {
      throw new RetryLaterException(`Too many failed sign-ins for this e-mail; try again in ${waitS} s`, waitS);
    }
    const user = await this.users.verifyCredentials(request.email, request.password);
    if (!user) {
      this.throttle.recordFailure(key);
      throw new UnauthorizedException('E-mail or password is not correct');
    }
    this.throttle.clear(key);
    const payload: SessionTokenPayload = { sub: user.id };
    return { user, token: await this.jwt.signAsync(payload) };
  }
}
