import { Injectable } from '@nestjs/common';

export const SIGN_IN_MAX_FAILURES = 5;
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
const PRUNE_ABOVE_KEYS = 10_000;

/**
 * Counts failed sign-ins per e-mail + client address in a sliding window (5 failures per 15 min, common
 * practice, no source). Kept in memory: one server process serves an installation.
 */
@Injectable()
export class SignInThrottleService {
  private readonly failures = new Map<string, number[]>();

  constructor(private readonly nowMs: () => number = Date.now) {}

  /** Seconds until the next attempt is allowed for `key`, or 0 when it is allowed now. */
  retryAfterS(key: string): number {
    const recent = this.recent(key);
    if (recent.length < SIGN_IN_MAX_FAILURES) return 0;
    const oldest = recent[recent.length - SIGN_IN_MAX_FAILURES] ?? this.nowMs();
    return Math.max(1, Math.ceil((oldest + SIGN_IN_WINDOW_MS - this.nowMs()) / 1000));
  }

  recordFailure(key: string): void {
    if (this.failures.size > PRUNE_ABOVE_KEYS) this.pruneAll();
    this.failures.set(key, [...this.recent(key), this.nowMs()]);
  }

  clear(key: string): void {
    this.failures.delete(key);
  }

  private recent(key: string): number[] {
    const since = this.nowMs() - SIGN_IN_WINDOW_MS;
    return (this.failures.get(key) ?? []).filter((atMs) => atMs > since);
  }

  private pruneAll(): void {
    for (const key of [...this.failures.keys()]) {
      const recent = this.recent(key);
      if (recent.length === 0) this.failures.delete(key);
      else this.failures.set(key, recent);
    }
  }
}
