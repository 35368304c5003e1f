import type { SchemaMigration } from './migration.types';

/**
 * Designs and their numbered revisions. A revision's document, report and provenance never change once
 * written (the trigger refuses such an UPDATE); only its Sign-off state and updated_at may move.
 */
export const designsAndRevisions: SchemaMigration = {
  name: '0002-designs-and-revisions',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE designs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        project_id uuid NOT NULL REFERENCES projects (id) ON DELETE CASCADE,
        name text NOT NULL,
        owner_id uuid NOT NULL REFERENCES users (id),
        latest_revision_number integer NOT NULL DEFAULT 0 CHECK (latest_revision_number >= 0),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX designs_project_id_idx ON designs (project_id);

      CREATE TABLE revisions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        design_id uuid NOT NULL REFERENCES designs (id) ON DELETE CASCADE,
        number integer NOT NULL CHECK (number >= 1),
        state text NOT NULL DEFAULT 'draft'
          CHECK (state IN ('draft', 'submitted', 'returned', 'approved', 'released', 'superseded')),
        document jsonb NOT NULL,
        report jsonb NOT NULL,
        engine_version text NOT NULL,
        author_id uuid NOT NULL REFERENCES users (id),
        change_note text NOT NULL DEFAULT '',
        base_revision_number integer,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT revisions_design_id_number_key UNIQUE (design_id, number)
      );

      CREATE FUNCTION revisions_keep_content() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.document IS DISTINCT FROM OLD.document OR NEW.report IS DISTINCT FROM OLD.report
          OR NEW.engine_version IS DISTINCT FROM OLD.engine_version OR NEW.number IS DISTINCT FROM OLD.number
          OR NEW.design_id IS DISTINCT FROM OLD.design_id OR NEW.author_id IS DISTINCT FROM OLD.author_id
          OR NEW.change_note IS DISTINCT FROM OLD.change_note OR NEW.created_at IS DISTINCT FROM OLD.created_at
          OR NEW.base_revision_number IS DISTINCT FROM OLD.base_revision_number THEN
          RAISE EXCEPTION 'a saved revision is immutable; save a new revision instead';
        END IF;
        RETURN NEW;
      END;
      $$;
      CREATE TRIGGER revisions_keep_content BEFORE UPDATE ON revisions
        FOR EACH ROW EXECUTE FUNCTION revisions_keep_content();
    `);
  },
  async down(context) {
    await context.sequelize.query('DROP TABLE revisions; DROP FUNCTION revisions_keep_content(); DROP TABLE designs;');
  },
};
