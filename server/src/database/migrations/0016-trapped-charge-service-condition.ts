import type { SchemaMigration } from './migration.types';

/**
 * The trapped-charge check (charge left on the oscillating column with the winding removed) covers a service
 * condition only, and now says so in its own field, `isServiceCondition`; reports stored before the field existed
 * lack it, so their check read "marginal by its rule" instead of "in service only". Each stored report's
 * trapped-charge check gets `isServiceCondition: true` written in, every other check and key left as stored.
 * Revisions are immutable (trigger revisions_keep_content), so the trigger is off for this one update.
 */
export const trappedChargeServiceCondition: SchemaMigration = {
  name: '0016-trapped-charge-service-condition',
  async up(context) {
    await context.sequelize.query(`
      ALTER TABLE revisions DISABLE TRIGGER revisions_keep_content;
      UPDATE revisions
        SET report = jsonb_set(report, '{checks}', (
          SELECT jsonb_agg(
                   CASE WHEN c->>'id' = 'trapped-charge' AND NOT (c ? 'isServiceCondition')
                        THEN c || '{"isServiceCondition": true}'::jsonb ELSE c END
                   ORDER BY i)
            FROM jsonb_array_elements(report->'checks') WITH ORDINALITY AS e(c, i)))
        WHERE jsonb_typeof(report->'checks') = 'array'
          AND EXISTS (
            SELECT 1 FROM jsonb_array_elements(report->'checks') AS e(c)
             WHERE c->>'id' = 'trapped-charge' AND NOT (c ? 'isServiceCondition'));
      ALTER TABLE revisions ENABLE TRIGGER revisions_keep_content;
    `);
  },
  async down() {
    // Code before this step reads no such field and ignores it: the stored reports may keep it.
  },
};
