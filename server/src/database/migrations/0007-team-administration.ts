import type { SchemaMigration } from './migration.types';

/**
 * Account deactivation, one-time password-reset links and mail preferences; project settings and archiving;
 * Sign-off overrides recorded with the transition they let through.
 */
export const teamAdministration: SchemaMigration = {
  name: '0007-team-administration',
  async up(context) {
    await context.sequelize.query(`
      ALTER TABLE users
        ADD COLUMN is_active boolean NOT NULL DEFAULT true,
        ADD COLUMN mail_opt_outs jsonb NOT NULL DEFAULT '[]'::jsonb;

      CREATE TABLE password_reset_links (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        token_hash text NOT NULL UNIQUE,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_by uuid REFERENCES users (id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX password_reset_links_user_idx ON password_reset_links (user_id);

      ALTER TABLE projects
        ADD COLUMN archived_at timestamptz,
        ADD COLUMN settings jsonb NOT NULL DEFAULT '{}'::jsonb;

      ALTER TABLE revision_transitions
        ADD COLUMN override_reason text,
        ADD COLUMN overridden jsonb;
      CREATE INDEX audit_entries_actor_idx ON audit_entries (actor_id);
    `);
  },
  async down(context) {
    await context.sequelize.query(`
      DROP INDEX audit_entries_actor_idx;
      ALTER TABLE revision_transitions DROP COLUMN override_reason, DROP COLUMN overridden;
      ALTER TABLE projects DROP COLUMN archived_at, DROP COLUMN settings;
      DROP TABLE password_reset_links;
      ALTER TABLE users DROP COLUMN is_active, DROP COLUMN mail_opt_outs;
    `);
  },
};
