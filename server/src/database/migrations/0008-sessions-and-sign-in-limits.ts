import type { SchemaMigration } from './migration.types';

/**
 * Sessions by id (a token's `jti`), so that signing out revokes that token; the counters of the sign-in
 * rate limits, shared by every app instance on the database; the per-account failure streak behind the
 * exponential sign-in delay.
 */
export const sessionsAndSignInLimits: SchemaMigration = {
  name: '0008-sessions-and-sign-in-limits',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE sessions (
        id uuid PRIMARY KEY,
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        revoked_at timestamptz,
        client_address text
      );
      CREATE INDEX sessions_user_id_idx ON sessions (user_id);
      CREATE INDEX sessions_expires_at_idx ON sessions (expires_at);

      CREATE TABLE rate_limit_counters (
        key text PRIMARY KEY,
        hits integer NOT NULL,
        window_ends_at timestamptz NOT NULL,
        blocked_until timestamptz
      );
      CREATE INDEX rate_limit_counters_window_ends_at_idx ON rate_limit_counters (window_ends_at);

      CREATE TABLE sign_in_failures (
        email text PRIMARY KEY,
        failures integer NOT NULL,
        last_failed_at timestamptz NOT NULL,
        next_attempt_at timestamptz NOT NULL
      );
    `);
  },
  async down(context) {
    await context.sequelize.query('DROP TABLE sign_in_failures; DROP TABLE rate_limit_counters; DROP TABLE sessions;');
  },
};
