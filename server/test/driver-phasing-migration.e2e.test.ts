import type { Design } from '@ladderwright/shared/designs';
import { designExamples } from '@ladderwright/shared/designs';
import { driverSecondaryPhasing } from '../src/database/migrations/0010-driver-secondary-phasing';
import { createDesign } from './factories/create-design';
import { createProject } from './factories/create-project';
import { createUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';

/** A driver design as stored before the phasing was a field (no secondaryPhasing), or with the given one. */
function driverDesign(phasing?: 'flyback' | 'forward'): Design {
  const design = structuredClone(designExamples.surfaceChargeTester) as Design;
  if (design.drive.kind !== 'driver') throw new Error('the tester has a driver stage');
  delete design.drive.driver.transformer.secondaryPhasing;
  if (phasing) design.drive.driver.transformer.secondaryPhasing = phasing;
  return design;
}

describe('migration 0009: stored driver revisions keep their forward-fed meaning', () => {
  let testApp: TestApp;

  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(async () => testApp.close());

  async function storedDocument(designId: string): Promise<Record<string, unknown>> {
    const [rows] = await testApp.sequelize.query('SELECT document FROM revisions WHERE design_id = :designId', {
      replacements: { designId },
    });
    return (rows as { document: Record<string, unknown> }[])[0]!.document;
  }

  const phasingOf = (document: Record<string, unknown>): unknown =>
    ((document.drive as { driver?: { transformer?: Record<string, unknown> } }).driver?.transformer ?? {})
      .secondaryPhasing;

  it('writes forward into driver revisions without a phasing, leaves others, and takes it out again on down', async () => {
    const engineer = await createUser(testApp, { role: 'engineer' });
    const project = await createProject([{ userId: engineer.id, role: 'engineer' }]);
    const old = await createDesign(testApp, project.id, engineer.id, {
      from: { kind: 'document', document: driverDesign() },
    });
    const flyback = await createDesign(testApp, project.id, engineer.id, {
      from: { kind: 'document', document: driverDesign('flyback') },
    });
    const sine = await createDesign(testApp, project.id, engineer.id, {
      from: { kind: 'document', document: designExamples.detectorBias },
    });
    expect(phasingOf(await storedDocument(old.id))).toBeUndefined();

    const queries = testApp.sequelize.getQueryInterface();
    await driverSecondaryPhasing.up(queries);
    expect(phasingOf(await storedDocument(old.id))).toBe('forward');
    expect(phasingOf(await storedDocument(flyback.id))).toBe('flyback');
    expect((await storedDocument(sine.id)).drive).toEqual(designExamples.detectorBias.drive);

    await driverSecondaryPhasing.down(queries);
    expect(phasingOf(await storedDocument(old.id))).toBeUndefined();
    expect(phasingOf(await storedDocument(flyback.id))).toBe('flyback');
    // The revisions stay immutable to everything else: the trigger is back on.
    await expect(
      testApp.sequelize.query(`UPDATE revisions SET change_note = 'edited' WHERE design_id = :id`, {
        replacements: { id: old.id },
      }),
    ).rejects.toThrow(/immutable/);
  });
});
