import { Injectable } from '@nestjs/common';
import type { ThrottlerStorage } from '@nestjs/throttler';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';

interface CounterRow {
  hits: number;
  expire_s: number;
  block_s: number | null;
}

type ThrottlerStorageRecord = Awaited<ReturnType<ThrottlerStorage['increment']>>;

const PRUNE_EVERY_MS = 3600_000;

/**
 * @nestjs/throttler's counters in PostgreSQL (`rate_limit_counters`), so that every app instance on the
 * database counts against the same limits. A fixed window per key: the first hit opens it for `ttl`; a hit
 * past `limit` blocks the key for `blockDuration`, and hits while blocked are not counted. One upsert per
 * hit, atomic under concurrency (INSERT ... ON CONFLICT DO UPDATE locks the row); times from the database
 * clock, so instances with drifting clocks agree.
 */
@Injectable()
export class PostgresThrottlerStorage implements ThrottlerStorage {
  private lastPruneMs = 0;

  constructor(private readonly sequelize: Sequelize) {}

  async increment(
    key: string,
    ttlMs: number,
    limit: number,
    blockDurationMs: number,
    throttlerName: string,
  ): Promise<ThrottlerStorageRecord> {
    const [row] = await this.sequelize.query<CounterRow>(
      `INSERT INTO rate_limit_counters AS c (key, hits, window_ends_at, blocked_until)
       VALUES (:key, 1, now() + make_interval(secs => :ttlS), NULL)
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN c.blocked_until > now() THEN c.hits
                     WHEN c.window_ends_at <= now() THEN 1
                     ELSE c.hits + 1 END,
         window_ends_at = CASE WHEN c.window_ends_at <= now() AND NOT coalesce(c.blocked_until > now(), false)
                               THEN now() + make_interval(secs => :ttlS) ELSE c.window_ends_at END,
         blocked_until = CASE WHEN c.blocked_until > now() THEN c.blocked_until
                              WHEN c.window_ends_at > now() AND c.hits + 1 > :limit
                              THEN now() + make_interval(secs => :blockS)
                              ELSE NULL END
       RETURNING hits,
                 ceil(extract(epoch FROM window_ends_at - now()))::int AS expire_s,
                 ceil(extract(epoch FROM blocked_until - now()))::int AS block_s`,
      {
        replacements: { key: `${throttlerName}:${key}`, ttlS: ttlMs / 1000, blockS: blockDurationMs / 1000, limit },
        type: QueryTypes.SELECT,
      },
    );
    await this.pruneOld();
    const blockS = row?.block_s ?? 0;
    return {
      totalHits: row?.hits ?? 1,
      timeToExpire: Math.max(0, row?.expire_s ?? 0),
      isBlocked: blockS > 0,
      timeToBlockExpire: Math.max(0, blockS),
    };
  }

  /** Deletes counters whose window and block ended an hour ago, at most once an hour per instance. */
  private async pruneOld(): Promise<void> {
    const nowMs = Date.now();
    if (nowMs - this.lastPruneMs < PRUNE_EVERY_MS) return;
    this.lastPruneMs = nowMs;
    await this.sequelize.query(
      `DELETE FROM rate_limit_counters
       WHERE window_ends_at < now() - interval '1 hour' AND coalesce(blocked_until < now(), true)`,
    );
  }
}
