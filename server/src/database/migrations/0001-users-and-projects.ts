import type { SchemaMigration } from './migration.types';

export const usersAndProjects: SchemaMigration = {
  name: '0001-users-and-projects',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email text NOT NULL,
        display_name text NOT NULL,
        role text NOT NULL CHECK (role IN ('engineer', 'reviewer', 'lead', 'admin')),
        password_hash text NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT users_email_lower CHECK (email = lower(email))
      );
      CREATE UNIQUE INDEX users_email_key ON users (email);

      CREATE TABLE projects (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL,
        product_line text NOT NULL,
        description text NOT NULL DEFAULT '',
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );

      CREATE TABLE project_members (
        project_id uuid NOT NULL REFERENCES projects (id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        role text NOT NULL CHECK (role IN ('engineer', 'reviewer', 'lead')),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (project_id, user_id)
      );
      CREATE INDEX project_members_user_id_idx ON project_members (user_id);
    `);
  },
  async down(context) {
    await context.sequelize.query('DROP TABLE project_members; DROP TABLE projects; DROP TABLE users;');
  },
};
