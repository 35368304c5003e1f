import { Injectable } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';

/** Failures in a row an account may have before each further one adds a delay. */
export const SIGN_IN_FREE_FAILURES = 4;
/** Longest delay one failure can impose on the next attempt for the account. */
export const SIGN_IN_MAX_DELAY_S = 60;
/** A streak of failures is forgotten after this long without another. */
export const SIGN_IN_STREAK_RESET_MIN = 15;

/**
 * Seconds the next attempt must wait after the `failures`-th failure in a row: none for the first four, then
 * 1, 2, 4, ... s, at most 60 s (exponential backoff; the cap is our choice: common practice, no source).
 */
export function signInDelayS(failures: number): number {
  if (failures <= SIGN_IN_FREE_FAILURES) return 0;
  return Math.min(SIGN_IN_MAX_DELAY_S, 2 ** (failures - SIGN_IN_FREE_FAILURES - 1));
}

/**
 * The per-account part of the sign-in limits, in PostgreSQL (`sign_in_failures`) so every instance agrees:
 * failures in a row push the account's next allowed attempt back exponentially, up to a minute, instead of a
 * hard lock-out that a stranger could keep up for 15 minutes at a time. Attempts inside the delay are
 * refused before any password is checked and do not lengthen it; a success clears the streak.
 */
@Injectable()
export class SignInDelayService {
  private lastPruneMs = 0;

  constructor(private readonly sequelize: Sequelize) {}

  /** Seconds until the account may try again, or 0. */
  async waitS(email: string): Promise<number> {
    const [row] = await this.sequelize.query<{ wait_s: number }>(
      'SELECT ceil(extract(epoch FROM next_attempt_at - now()))::int AS wait_s FROM sign_in_failures WHERE email = :email',
      { replacements: { email }, type: QueryTypes.SELECT },
    );
    return Math.max(0, row?.wait_s ?? 0);
  }

  /** Counts a failure; returns how many failures in a row the account now has. */
  async recordFailure(email: string): Promise<number> {
    const [row] = await this.sequelize.query<{ failures: number }>(
      `INSERT INTO sign_in_failures AS f (email, failures, last_failed_at, next_attempt_at)
       VALUES (:email, 1, now(), now())
       ON CONFLICT (email) DO UPDATE SET
         failures = CASE WHEN f.last_failed_at < now() - make_interval(mins => :resetMin) THEN 1
                         ELSE f.failures + 1 END,
         last_failed_at = now()
       RETURNING failures`,
      { replacements: { email, resetMin: SIGN_IN_STREAK_RESET_MIN }, type: QueryTypes.SELECT },
    );
    await this.pruneOld();
    const failures = row?.failures ?? 1;
    const delayS = signInDelayS(failures);
    if (delayS > 0) {
      await this.sequelize.query(
        'UPDATE sign_in_failures SET next_attempt_at = now() + make_interval(secs => :delayS) WHERE email = :email',
        { replacements: { email, delayS } },
      );
    }
    return failures;
  }

  async clear(email: string): Promise<void> {
    await this.sequelize.query('DELETE FROM sign_in_failures WHERE email = :email', { replacements: { email } });
  }

  /** Forgets streaks that ended a day ago (unknown e-mails tried by a stranger pile up otherwise), hourly. */
  private async pruneOld(): Promise<void> {
    const nowMs = Date.now();
    if (nowMs - this.lastPruneMs < 3600_000) return;
    this.lastPruneMs = nowMs;
    await this.sequelize.query("DELETE FROM sign_in_failures WHERE last_failed_at < now() - interval '1 day'");
  }
}
