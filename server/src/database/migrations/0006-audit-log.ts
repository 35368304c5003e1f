import type { SchemaMigration } from './migration.types';

/** The audit log, and the per-user session version that "sign out everywhere" bumps. */
export const auditLog: SchemaMigration = {
  name: '0006-audit-log',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE audit_entries (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        occurred_at timestamptz NOT NULL DEFAULT now(),
        action text NOT NULL,
        actor_id uuid REFERENCES users (id) ON DELETE SET NULL,
        actor_email text,
        subject_type text,
        subject_id text,
        detail jsonb NOT NULL DEFAULT '{}'::jsonb,
        client_address text
      );
      CREATE INDEX audit_entries_occurred_at_idx ON audit_entries (occurred_at DESC);
      CREATE INDEX audit_entries_action_idx ON audit_entries (action);

      ALTER TABLE users ADD COLUMN session_version integer NOT NULL DEFAULT 0;
    `);
  },
  async down(context) {
    await context.sequelize.query('ALTER TABLE users DROP COLUMN session_version; DROP TABLE audit_entries;');
  },
};
