import { Inject, Injectable } from '@nestjs/common';
import type { CurrentUser } from '@ladderwright/shared/api';
import { APP_ENV, type AppEnv } from '../config/env';

/** A session as last read from the database: its account (null: revoked, expired or account gone). */
export interface CachedSession {
  user: CurrentUser | null;
  sessionVersion: number;
  readAtMs: number;
}

const MAX_ENTRIES = 20_000;

/**
 * Sessions read in the last `SESSION_CACHE_MS`, by session id, so that a request costs a map lookup rather
 * than a query. A change made on this instance (sign-out, sign out everywhere, password reset, role or
 * account change) forgets the entries at once; other instances see it when their entry ages out.
 */
@Injectable()
export class SessionCacheService {
  private readonly entries = new Map<string, CachedSession>();

  constructor(@Inject(APP_ENV) private readonly env: AppEnv) {}

  get(sessionId: string, nowMs: number): CachedSession | null {
    const entry = this.entries.get(sessionId);
    if (!entry) return null;
    if (nowMs - entry.readAtMs < this.env.sessionCacheMs) return entry;
    this.entries.delete(sessionId);
    return null;
  }

  set(sessionId: string, entry: CachedSession): void {
    if (this.env.sessionCacheMs === 0) return;
    if (this.entries.size >= MAX_ENTRIES) {
      // Map keeps insertion order: drop the oldest tenth.
      let drop = MAX_ENTRIES / 10;
      for (const key of this.entries.keys()) {
        this.entries.delete(key);
        if (--drop === 0) break;
      }
    }
    this.entries.set(sessionId, entry);
  }

  forget(sessionId: string): void {
    this.entries.delete(sessionId);
  }

  /** Forgets every cached session of the account (its role, name, version or standing changed). */
  forgetUser(userId: string): void {
    for (const [sessionId, entry] of this.entries) {
      if (entry.user?.id === userId) this.entries.delete(sessionId);
    }
  }
}
