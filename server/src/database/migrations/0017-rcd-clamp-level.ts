import type { SchemaMigration } from './migration.types';

/**
 * Where each stored copy of a design document lives: table, row key and the path to the document in its column.
 * Revisions are immutable (trigger revisions_keep_content), so the trigger is off while they are rewritten.
 */
const DOCUMENT_PLACES = [
  { table: 'revisions', column: 'document', document: `document`, path: '{drive,driver,clamp,clampVoltageV}' },
  {
    table: 'simulation_jobs',
    column: 'input',
    document: `input->'document'`,
    path: '{document,drive,driver,clamp,clampVoltageV}',
  },
  {
    table: 'calibration_evaluations',
    column: 'document',
    document: `document`,
    path: '{drive,driver,clamp,clampVoltageV}',
  },
] as const;

/**
 * An RCD clamp no longer states a clamp voltage: the simulated circuit never used it (its level was always set
 * by the clamp resistor and capacitor, which stay), and the estimate now computes that level from them too. Each
 * stored document with an RCD clamp loses `clampVoltageV` and so keeps the circuit it always simulated; the value
 * taken out is kept in `retired_rcd_clamp_voltages` so that `down` puts it back where it was.
 */
export const rcdClampLevel: SchemaMigration = {
  name: '0017-rcd-clamp-level',
  async up(context) {
    const steps = DOCUMENT_PLACES.map(
      ({ table, column, document, path }) => `
      INSERT INTO retired_rcd_clamp_voltages (table_name, row_id, clamp_voltage)
        SELECT '${table}', id, ${document}->'drive'->'driver'->'clamp'->'clampVoltageV'
        FROM ${table}
        WHERE ${document}->'drive'->'driver'->'clamp'->>'kind' = 'rcd'
          AND ${document}->'drive'->'driver'->'clamp' ? 'clampVoltageV';
      UPDATE ${table} SET ${column} = ${column} #- '${path}'
        WHERE ${document}->'drive'->'driver'->'clamp'->>'kind' = 'rcd'
          AND ${document}->'drive'->'driver'->'clamp' ? 'clampVoltageV';`,
    );
    await context.sequelize.query(`
      CREATE TABLE retired_rcd_clamp_voltages (
        table_name text NOT NULL,
        row_id uuid NOT NULL,
        clamp_voltage jsonb NOT NULL,
        PRIMARY KEY (table_name, row_id)
      );
      ALTER TABLE revisions DISABLE TRIGGER revisions_keep_content;
      ${steps.join('\n')}
      ALTER TABLE revisions ENABLE TRIGGER revisions_keep_content;
    `);
  },
  async down(context) {
    const steps = DOCUMENT_PLACES.map(
      ({ table, column, path }) => `
      UPDATE ${table} t SET ${column} = jsonb_set(t.${column}, '${path}', r.clamp_voltage)
        FROM retired_rcd_clamp_voltages r
        WHERE r.table_name = '${table}' AND r.row_id = t.id;`,
    );
    await context.sequelize.query(`
      ALTER TABLE revisions DISABLE TRIGGER revisions_keep_content;
      ${steps.join('\n')}
      ALTER TABLE revisions ENABLE TRIGGER revisions_keep_content;
      DROP TABLE retired_rcd_clamp_voltages;
    `);
  },
};
