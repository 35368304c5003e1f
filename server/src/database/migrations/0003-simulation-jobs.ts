import type { SchemaMigration } from './migration.types';

/**
 * Simulation jobs as users see them (status, progress, result). The queue itself lives in the `pgboss`
 * schema, which pg-boss creates and migrates on its own; `queue_job_id` links a row to its pg-boss job.
 * `design_id` is provenance only (no foreign key), so a job outlives an edited or removed design.
 */
export const simulationJobs: SchemaMigration = {
  name: '0003-simulation-jobs',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE simulation_jobs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        project_id uuid NOT NULL REFERENCES projects (id) ON DELETE CASCADE,
        requested_by uuid REFERENCES users (id) ON DELETE SET NULL,
        kind text NOT NULL,
        status text NOT NULL DEFAULT 'queued'
          CHECK (status IN ('queued', 'running', 'succeeded', 'failed', 'cancelled')),
        progress_pct smallint NOT NULL DEFAULT 0 CHECK (progress_pct BETWEEN 0 AND 100),
        input jsonb NOT NULL,
        design_id uuid,
        revision_number integer,
        result jsonb,
        error_code text,
        error_message text,
        queue_job_id text,
        started_at timestamptz,
        finished_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX simulation_jobs_project_id_idx ON simulation_jobs (project_id, created_at DESC);
    `);
  },
  async down(context) {
    await context.sequelize.query('DROP TABLE simulation_jobs;');
  },
};
