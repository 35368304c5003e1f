import type { SchemaMigration } from './migration.types';

/**
 * Calibrations of a revision against its bench runs: the inputs (parameters with prior ranges, the runs'
 * points as fitted, the confidence) and, once done, the result. The work runs as a `simulation_jobs` row of
 * kind 'calibration' (queue, quotas, progress, heartbeat, cancel); `simulation_job_id` links the two.
 */
export const calibrations: SchemaMigration = {
  name: '0012-calibrations',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE calibrations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        project_id uuid NOT NULL REFERENCES projects (id) ON DELETE CASCADE,
        design_id uuid NOT NULL REFERENCES designs (id) ON DELETE CASCADE,
        revision_number integer NOT NULL,
        simulation_job_id uuid NOT NULL REFERENCES simulation_jobs (id) ON DELETE CASCADE,
        requested_by uuid REFERENCES users (id) ON DELETE SET NULL,
        input jsonb NOT NULL,
        result jsonb,
        draft_revision_number integer,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX calibrations_revision_idx ON calibrations (design_id, revision_number, created_at DESC);
      CREATE UNIQUE INDEX calibrations_job_idx ON calibrations (simulation_job_id);
    `);
  },
  async down(context) {
    await context.sequelize.query('DROP TABLE calibrations;');
  },
};
