import type { SchemaMigration } from './migration.types';

/**
 * Batches of simulations (parameter sweeps, Monte Carlo): a batch is a `simulation_jobs` row of kind 'batch' that
 * is never queued itself; its members are ordinary jobs on the shared queue, each pointing at it, so every app
 * instance's workers take members. `run_by` names the instance that ran a job.
 */
export const simulationBatches: SchemaMigration = {
  name: '0014-simulation-batches',
  async up(context) {
    await context.sequelize.query(`
      ALTER TABLE simulation_jobs
        ADD COLUMN parent_job_id uuid REFERENCES simulation_jobs(id) ON DELETE CASCADE,
        ADD COLUMN member_index integer CHECK (member_index >= 0),
        ADD COLUMN run_by text CHECK (char_length(run_by) <= 200);
      CREATE INDEX simulation_jobs_parent ON simulation_jobs (parent_job_id, member_index) WHERE parent_job_id IS NOT NULL;
    `);
  },
  async down(context) {
    await context.sequelize.query(`
      DROP INDEX simulation_jobs_parent;
      ALTER TABLE simulation_jobs DROP COLUMN parent_job_id, DROP COLUMN member_index, DROP COLUMN run_by;
    `);
  },
};
