import { type ExecutionContext, Injectable } from '@nestjs/common';
import { ThrottlerGuard, type ThrottlerLimitDetail } from '@nestjs/throttler';
import { RetryLaterException } from '../common/filters/domain-error.filter';

/** @nestjs/throttler's guard, answering over a limit with our 429 body and a plain `Retry-After`. */
@Injectable()
export class SignInThrottlerGuard extends ThrottlerGuard {
  protected override throwThrottlingException(_context: ExecutionContext, detail: ThrottlerLimitDetail): Promise<void> {
    const waitS = Math.max(1, detail.timeToBlockExpire);
    return Promise.reject(new RetryLaterException(`Too many sign-in attempts; try again in ${waitS} s`, waitS));
  }
}
