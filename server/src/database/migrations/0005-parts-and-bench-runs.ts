import type { SchemaMigration } from './migration.types';

/**
 * The Parts shelf (per project, unique code per project) and Bench runs: measured data uploaded for a
 * revision. Uploaded bytes live in the blob store under their SHA-256; these tables hold the metadata.
 * A bench run is never deleted or rewritten: deleting sets deleted_at/deleted_by and writes an event.
 */
export const partsAndBenchRuns: SchemaMigration = {
  name: '0005-parts-and-bench-runs',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE parts (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        project_id uuid NOT NULL REFERENCES projects (id) ON DELETE CASCADE,
        code text NOT NULL,
        kind text NOT NULL CHECK (kind IN ('capacitor', 'diode', 'resistor', 'transistor', 'core')),
        description text NOT NULL DEFAULT '',
        value_si double precision CHECK (value_si > 0),
        tolerance double precision CHECK (tolerance > 0 AND tolerance < 1),
        rated_voltage_v double precision CHECK (rated_voltage_v > 0),
        rated_current_a double precision CHECK (rated_current_a > 0),
        rated_surge_current_a double precision CHECK (rated_surge_current_a > 0),
        rated_power_w double precision CHECK (rated_power_w > 0),
        unit_cost double precision NOT NULL CHECK (unit_cost >= 0),
        size_mm text NOT NULL DEFAULT '',
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT parts_project_id_code_key UNIQUE (project_id, code)
      );

      CREATE TABLE bench_runs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        project_id uuid NOT NULL REFERENCES projects (id) ON DELETE CASCADE,
        design_id uuid NOT NULL REFERENCES designs (id) ON DELETE CASCADE,
        revision_number integer NOT NULL CHECK (revision_number >= 1),
        kind text NOT NULL CHECK (kind IN ('load-sweep', 'scope-capture')),
        title text NOT NULL DEFAULT '',
        tolerance double precision NOT NULL CHECK (tolerance > 0 AND tolerance < 1),
        points jsonb NOT NULL,
        metadata jsonb NOT NULL DEFAULT '[]',
        comparison jsonb NOT NULL,
        verdict text NOT NULL CHECK (verdict IN ('pass', 'marginal', 'fail')),
        margin_pct double precision NOT NULL,
        worst_deviation double precision NOT NULL,
        uploaded_by uuid NOT NULL REFERENCES users (id),
        deleted_at timestamptz,
        deleted_by uuid REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        FOREIGN KEY (design_id, revision_number) REFERENCES revisions (design_id, number) ON DELETE CASCADE
      );
      CREATE INDEX bench_runs_revision_idx ON bench_runs (design_id, revision_number) WHERE deleted_at IS NULL;

      CREATE TABLE bench_run_files (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        bench_run_id uuid NOT NULL REFERENCES bench_runs (id) ON DELETE CASCADE,
        role text NOT NULL CHECK (role IN ('data', 'photo')),
        original_name text NOT NULL,
        content_type text NOT NULL,
        size_bytes integer NOT NULL CHECK (size_bytes >= 0),
        sha256 text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
        storage_key text NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX bench_run_files_bench_run_id_idx ON bench_run_files (bench_run_id);

      CREATE TABLE bench_run_events (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        bench_run_id uuid NOT NULL REFERENCES bench_runs (id) ON DELETE CASCADE,
        action text NOT NULL CHECK (action IN ('uploaded', 'deleted')),
        actor_id uuid NOT NULL REFERENCES users (id),
        detail jsonb NOT NULL DEFAULT '{}',
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX bench_run_events_bench_run_id_idx ON bench_run_events (bench_run_id);
    `);
  },
  async down(context) {
    await context.sequelize.query(
      'DROP TABLE bench_run_events; DROP TABLE bench_run_files; DROP TABLE bench_runs; DROP TABLE parts;',
    );
  },
};
