import { designExamples } from '@ladderwright/shared/designs';
import { describeMargin, type CheckVerdict } from '@ladderwright/shared/safety';
import { trappedChargeServiceCondition } from '../src/database/migrations/0016-trapped-charge-service-condition';
import { createDesign } from './factories/create-design';
import { createProject } from './factories/create-project';
import { createUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('migration 0016: stored trapped-charge checks say they cover a service condition', () => {
  let testApp: TestApp;

  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(async () => testApp.close());

  async function storedChecks(designId: string): Promise<CheckVerdict[]> {
    const [rows] = await testApp.sequelize.query('SELECT report FROM revisions WHERE design_id = :designId', {
      replacements: { designId },
    });
    return (rows as { report: { checks: CheckVerdict[] } }[])[0]!.report.checks;
  }

  /** Takes the field out of a stored report, as a report saved before the field existed was stored. */
  async function storeWithoutField(designId: string): Promise<void> {
    await testApp.sequelize.query(`
      ALTER TABLE revisions DISABLE TRIGGER revisions_keep_content;
      UPDATE revisions
        SET report = jsonb_set(report, '{checks}', (
          SELECT jsonb_agg(c - 'isServiceCondition' ORDER BY i)
            FROM jsonb_array_elements(report->'checks') WITH ORDINALITY AS e(c, i)))
        WHERE design_id = '${designId}';
      ALTER TABLE revisions ENABLE TRIGGER revisions_keep_content;
    `);
  }

  it('writes the field into old reports, reads "in service only" after it, and leaves every other check as stored', async () => {
    const engineer = await createUser(testApp, { role: 'engineer' });
    const project = await createProject([{ userId: engineer.id, role: 'engineer' }]);
    const old = await createDesign(testApp, project.id, engineer.id, {
      from: { kind: 'document', document: designExamples.detectorBias },
    });
    const current = await createDesign(testApp, project.id, engineer.id, {
      from: { kind: 'document', document: designExamples.ionizerBar },
    });
    await storeWithoutField(old.id);
    const before = await storedChecks(old.id);
    const trappedBefore = before.find((check) => check.id === 'trapped-charge')!;
    // The detector-bias demo keeps about 636 V on its winding-end capacitor against a 50 V safe level.
    expect(trappedBefore.verdict).toBe('marginal');
    expect(trappedBefore.isServiceCondition).toBeUndefined();
    expect(describeMargin(trappedBefore)).toBe('over the limit, marginal by its rule');
    const currentBefore = await storedChecks(current.id);

    await trappedChargeServiceCondition.up(testApp.sequelize.getQueryInterface());

    const after = await storedChecks(old.id);
    const trappedAfter = after.find((check) => check.id === 'trapped-charge')!;
    expect(trappedAfter).toEqual({ ...trappedBefore, isServiceCondition: true });
    expect(describeMargin(trappedAfter)).toBe('over the limit, in service only');
    expect(after.filter((check) => check.id !== 'trapped-charge')).toEqual(
      before.filter((check) => check.id !== 'trapped-charge'),
    );
    expect(after.map((check) => check.id)).toEqual(before.map((check) => check.id));
    expect(await storedChecks(current.id)).toEqual(currentBefore);
    // The revisions stay immutable to everything else: the trigger is back on.
    await expect(
      testApp.sequelize.query(`UPDATE revisions SET change_note = 'edited' WHERE design_id = :id`, {
        replacements: { id: old.id },
      }),
    ).rejects.toThrow(/immutable/);
  });
});
