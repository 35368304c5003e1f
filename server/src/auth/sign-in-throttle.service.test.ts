import { SIGN_IN_MAX_FAILURES, SIGN_IN_WINDOW_MS, SignInThrottleService } from './sign-in-throttle.service';

// Limit and window from issue 2 (5 failures per 15 min): common practice, no source.
describe('SignInThrottleService', () => {
  let nowMs = 1_000_000;
  const throttle = () => new SignInThrottleService(() => nowMs);

  beforeEach(() => {
    nowMs = 1_000_000;
  });

  it('allows attempts until the fifth failure, then asks to wait out the window', () => {
    const service = throttle();
    for (let failure = 1; failure < SIGN_IN_MAX_FAILURES; failure += 1) {
      service.recordFailure('a|ip');
      expect(service.retryAfterS('a|ip')).toBe(0);
    }
    service.recordFailure('a|ip');
    expect(service.retryAfterS('a|ip')).toBe(SIGN_IN_WINDOW_MS / 1000);
  });

  it('lets attempts through again once the oldest counted failure leaves the window', () => {
    const service = throttle();
    for (let failure = 0; failure < SIGN_IN_MAX_FAILURES; failure += 1) {
      service.recordFailure('a|ip');
      nowMs += 60_000;
    }
    // failures at t0 .. t0+4 min; now = t0+5 min; the first expires at t0+15 min -> 10 min to wait.
    expect(service.retryAfterS('a|ip')).toBe(600);
    nowMs = 1_000_000 + SIGN_IN_WINDOW_MS + 1;
    expect(service.retryAfterS('a|ip')).toBe(0);
  });

  it('keeps keys apart and forgets a key on clear', () => {
    const service = throttle();
    for (let failure = 0; failure < SIGN_IN_MAX_FAILURES; failure += 1) service.recordFailure('a|ip');
    expect(service.retryAfterS('b|ip')).toBe(0);
    service.clear('a|ip');
    expect(service.retryAfterS('a|ip')).toBe(0);
  });
});
