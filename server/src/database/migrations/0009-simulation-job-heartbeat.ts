import type { SchemaMigration } from './migration.types';

/** A running job's heartbeat, so that a job whose instance died is found and ended; indexes for the quotas. */
export const simulationJobHeartbeat: SchemaMigration = {
  name: '0009-simulation-job-heartbeat',
  async up(context) {
    await context.sequelize.query(`
      ALTER TABLE simulation_jobs ADD COLUMN heartbeat_at timestamptz;
      CREATE INDEX simulation_jobs_active_idx ON simulation_jobs (project_id, requested_by)
        WHERE status IN ('queued', 'running');
    `);
  },
  async down(context) {
    await context.sequelize.query(
      'DROP INDEX simulation_jobs_active_idx; ALTER TABLE simulation_jobs DROP COLUMN heartbeat_at;',
    );
  },
};
