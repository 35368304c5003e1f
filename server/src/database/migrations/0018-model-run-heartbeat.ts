import type { SchemaMigration } from './migration.types';

/**
 * A model run's heartbeat and how often it was given back: the instance running a model run writes
 * `heartbeat_at` while it runs; the instance running the fit gives a run whose heartbeat stopped (its instance
 * died) back to the queue (`status` queued again, `attempts` + 1) and ends the calibration when one run was
 * lost too often.
 */
export const modelRunHeartbeat: SchemaMigration = {
  name: '0018-model-run-heartbeat',
  async up(context) {
    await context.sequelize.query(`
      ALTER TABLE calibration_evaluations
        ADD COLUMN heartbeat_at timestamptz,
        ADD COLUMN attempts integer NOT NULL DEFAULT 0;
    `);
  },
  async down(context) {
    await context.sequelize.query(
      'ALTER TABLE calibration_evaluations DROP COLUMN heartbeat_at, DROP COLUMN attempts;',
    );
  },
};
