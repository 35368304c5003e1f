import type { SchemaMigration } from './migration.types';

/**
 * The driver's secondary phasing became a design field whose default is the flyback pulse; every design
 * stored before fed its ladder from the forward pulse, so each stored driver revision gets
 * `secondaryPhasing: 'forward'` written out and keeps its meaning. Revisions are immutable (trigger
 * revisions_keep_content), so the trigger is off for this one update.
 */
export const driverSecondaryPhasing: SchemaMigration = {
  name: '0010-driver-secondary-phasing',
  async up(context) {
    await context.sequelize.query(`
      ALTER TABLE revisions DISABLE TRIGGER revisions_keep_content;
      UPDATE revisions
        SET document = jsonb_set(document, '{drive,driver,transformer,secondaryPhasing}', '"forward"')
        WHERE document->'drive'->>'kind' = 'driver'
          AND jsonb_typeof(document->'drive'->'driver'->'transformer') = 'object'
          AND NOT (document->'drive'->'driver'->'transformer' ? 'secondaryPhasing');
      ALTER TABLE revisions ENABLE TRIGGER revisions_keep_content;
    `);
  },
  async down(context) {
    // Code before this step knew only the forward pulse: drop the field where it says so.
    await context.sequelize.query(`
      ALTER TABLE revisions DISABLE TRIGGER revisions_keep_content;
      UPDATE revisions
        SET document = document #- '{drive,driver,transformer,secondaryPhasing}'
        WHERE document->'drive'->'driver'->'transformer'->>'secondaryPhasing' = 'forward';
      ALTER TABLE revisions ENABLE TRIGGER revisions_keep_content;
    `);
  },
};
