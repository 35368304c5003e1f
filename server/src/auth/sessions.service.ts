import { randomUUID } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { CurrentUser } from '@ladderwright/shared/api';
import type { UserRole } from '@ladderwright/shared/auth';
import { isUuid } from '../common/uuid';
import { APP_ENV, type AppEnv } from '../config/env';
import { SessionCacheService } from './session-cache.service';

interface SessionRow {
  id: string;
  email: string;
  display_name: string;
  role: UserRole;
  session_version: number;
  is_open: boolean;
}

const PRUNE_EVERY_MS = 3600_000;

/**
 * Server-side sessions: each session token names its row in `sessions` by its `jti`. Signing out revokes the
 * row, so a replayed token is refused; "sign out everywhere", a password reset and a deactivation bump the
 * account's session version, which every token carries as `sv`, and a deactivated account has no open session. Lookups go through `SessionCacheService`.
 */
@Injectable()
export class SessionsService {
  private lastPruneMs = 0;

  constructor(
    private readonly sequelize: Sequelize,
    private readonly cache: SessionCacheService,
    @Inject(APP_ENV) private readonly env: AppEnv,
  ) {}

  /** Opens a session for the account; returns its id, the token's `jti`. */
  async open(userId: string, clientAddress: string): Promise<string> {
    const id = randomUUID();
    await this.sequelize.query(
      `INSERT INTO sessions (id, user_id, expires_at, client_address)
       VALUES (:id, :userId, now() + make_interval(secs => :ttlS), :clientAddress)`,
      { replacements: { id, userId, ttlS: this.env.jwtTtlS, clientAddress } },
    );
    await this.pruneExpired();
    return id;
  }

  /**
   * The account of an open session, or null when the session is revoked or expired, the account is gone,
   * or its session version moved on since the token was issued.
   */
  async resolve(sessionId: string, userId: string, sessionVersion: number): Promise<CurrentUser | null> {
    if (!isUuid(sessionId) || !isUuid(userId)) return null;
    const nowMs = Date.now();
    const cached = this.cache.get(sessionId, nowMs);
    const entry = cached ?? (await this.read(sessionId, nowMs));
    if (!entry.user || entry.user.id !== userId || entry.sessionVersion !== sessionVersion) return null;
    return entry.user;
  }

  /** Ends one session (sign-out). */
  async revoke(sessionId: string): Promise<void> {
    this.cache.forget(sessionId);
    if (!isUuid(sessionId)) return;
    await this.sequelize.query('UPDATE sessions SET revoked_at = now() WHERE id = :sessionId AND revoked_at IS NULL', {
      replacements: { sessionId },
    });
  }

  /** Ends every session of the account. */
  async revokeAllOf(userId: string): Promise<void> {
    this.cache.forgetUser(userId);
    await this.sequelize.query(
      'UPDATE sessions SET revoked_at = now() WHERE user_id = :userId AND revoked_at IS NULL',
      {
        replacements: { userId },
      },
    );
  }

  private async read(sessionId: string, nowMs: number) {
    const [row] = await this.sequelize.query<SessionRow>(
      `SELECT u.id, u.email, u.display_name, u.role, u.session_version,
              (s.revoked_at IS NULL AND s.expires_at > now() AND u.is_active) AS is_open
       FROM sessions s JOIN users u ON u.id = s.user_id
       WHERE s.id = :sessionId`,
      { replacements: { sessionId }, type: QueryTypes.SELECT },
    );
    const user: CurrentUser | null =
      row && row.is_open ? { id: row.id, email: row.email, displayName: row.display_name, role: row.role } : null;
    const entry = { user, sessionVersion: row?.session_version ?? -1, readAtMs: nowMs };
    this.cache.set(sessionId, entry);
    return entry;
  }

  /** Deletes sessions that expired a day ago or more, at most once an hour per instance. */
  private async pruneExpired(): Promise<void> {
    const nowMs = Date.now();
    if (nowMs - this.lastPruneMs < PRUNE_EVERY_MS) return;
    this.lastPruneMs = nowMs;
    await this.sequelize.query("DELETE FROM sessions WHERE expires_at < now() - interval '1 day'");
  }
}
