import type { SchemaMigration } from './migration.types';

/**
 * Member requests: a project member who is not a lead asks the leads to add a person (by e-mail, with a proposed
 * project role and a note); a lead accepts or declines with an optional reason. One pending request per project
 * and e-mail.
 */
export const memberRequests: SchemaMigration = {
  name: '0013-member-requests',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE member_requests (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        project_id uuid NOT NULL REFERENCES projects(id) ON DELETE CASCADE,
        requester_id uuid REFERENCES users(id) ON DELETE SET NULL,
        email text NOT NULL CHECK (char_length(email) BETWEEN 3 AND 254),
        role text NOT NULL CHECK (role IN ('engineer', 'reviewer', 'lead')),
        note text NOT NULL DEFAULT '' CHECK (char_length(note) <= 500),
        state text NOT NULL DEFAULT 'pending' CHECK (state IN ('pending', 'accepted', 'declined')),
        decided_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        decided_at timestamptz,
        decline_reason text CHECK (char_length(decline_reason) <= 500),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE UNIQUE INDEX member_requests_one_pending ON member_requests (project_id, email) WHERE state = 'pending';
      CREATE INDEX member_requests_project ON member_requests (project_id, created_at DESC);
    `);
  },
  async down(context) {
    await context.sequelize.query('DROP TABLE member_requests;');
  },
};
