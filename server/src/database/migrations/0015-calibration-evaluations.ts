import type { SchemaMigration } from './migration.types';

/**
 * The model runs of a calibration as rows, so that every app instance's worker pool can take them: the
 * instance running a calibration's fit writes one row per run of a batch (the design with one set of
 * parameter values) and queues it; any instance claims it (`queued` → `running`, naming itself in
 * `instance_id`), runs it and writes the predictions (`done`, null when the models have no answer) or the
 * failure (`failed`). A cancelled calibration marks its open rows `cancelled`.
 */
export const calibrationEvaluations: SchemaMigration = {
  name: '0015-calibration-evaluations',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE calibration_evaluations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        calibration_id uuid NOT NULL REFERENCES calibrations (id) ON DELETE CASCADE,
        document jsonb NOT NULL,
        status text NOT NULL DEFAULT 'queued'
          CHECK (status IN ('queued', 'running', 'done', 'failed', 'cancelled')),
        predictions jsonb,
        error_message text,
        instance_id text,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX calibration_evaluations_calibration_idx ON calibration_evaluations (calibration_id, status);
    `);
  },
  async down(context) {
    await context.sequelize.query('DROP TABLE calibration_evaluations;');
  },
};
