import type { Design } from '@ladderwright/shared/designs';
import { designExamples } from '@ladderwright/shared/designs';
import { rcdClampLevel } from '../src/database/migrations/0017-rcd-clamp-level';
import { DesignsService } from '../src/designs/designs.service';
import { createDesign } from './factories/create-design';
import { createProject } from './factories/create-project';
import { createUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';

/** The demo tester with an RCD clamp of the given resistor, or with its zener. */
function driverDesign(clamp: 'rcd' | 'zener'): Design {
  const design = structuredClone(designExamples.surfaceChargeTester) as Design;
  if (design.drive.kind !== 'driver') throw new Error('the tester has a driver stage');
  if (clamp === 'rcd') design.drive.driver.clamp = { kind: 'rcd', resistorOhm: 4.7e3, capacitorF: 10e-9 };
  return design;
}

type Stored = { drive: { driver?: { clamp?: Record<string, unknown> } } };

describe('migration 0017: RCD clamps lose the stated voltage the circuit never used', () => {
  let testApp: TestApp;

  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(async () => testApp.close());

  async function storedClamp(designId: string): Promise<Record<string, unknown> | undefined> {
    const [rows] = await testApp.sequelize.query('SELECT document FROM revisions WHERE design_id = :designId', {
      replacements: { designId },
    });
    return (rows as { document: Stored }[])[0]!.document.drive.driver?.clamp;
  }

  async function jobClamp(jobId: string): Promise<Record<string, unknown> | undefined> {
    const [rows] = await testApp.sequelize.query('SELECT input FROM simulation_jobs WHERE id = :jobId', {
      replacements: { jobId },
    });
    return (rows as { input: { document: Stored } }[])[0]!.input.document.drive.driver?.clamp;
  }

  it('takes clampVoltageV out of stored RCD clamps only, keeps R and C, and puts it back on down', async () => {
    const engineer = await createUser(testApp, { role: 'engineer' });
    const project = await createProject([{ userId: engineer.id, role: 'engineer' }]);
    const rcd = await createDesign(testApp, project.id, engineer.id, {
      from: { kind: 'document', document: driverDesign('rcd') },
    });
    const zener = await createDesign(testApp, project.id, engineer.id, {
      from: { kind: 'document', document: driverDesign('zener') },
    });
    const queries = testApp.sequelize.getQueryInterface();
    // Back to the schema before this step, then write the revision as it was stored then (the stated 40 V).
    await rcdClampLevel.down(queries);
    await testApp.sequelize.query(
      `ALTER TABLE revisions DISABLE TRIGGER revisions_keep_content;
       UPDATE revisions SET document = jsonb_set(document, '{drive,driver,clamp,clampVoltageV}', '40')
         WHERE design_id = :id;
       ALTER TABLE revisions ENABLE TRIGGER revisions_keep_content;`,
      { replacements: { id: rcd.id } },
    );
    const oldDocument = { ...driverDesign('rcd') } as Design;
    if (oldDocument.drive.kind !== 'driver') throw new Error('driver design');
    (oldDocument.drive.driver.clamp as Record<string, unknown>).clampVoltageV = 40;
    const [jobRows] = await testApp.sequelize.query(
      `INSERT INTO simulation_jobs (project_id, requested_by, kind, status, input)
         VALUES (:projectId, :userId, 'driver', 'cancelled', :input) RETURNING id`,
      {
        replacements: {
          projectId: project.id,
          userId: engineer.id,
          input: JSON.stringify({ document: oldDocument, options: {} }),
        },
      },
    );
    const jobId = (jobRows as { id: string }[])[0]!.id;
    expect(await storedClamp(rcd.id)).toMatchObject({ kind: 'rcd', clampVoltageV: 40 });

    await rcdClampLevel.up(queries);
    expect(await storedClamp(rcd.id)).toEqual({ kind: 'rcd', resistorOhm: 4.7e3, capacitorF: 10e-9 });
    expect(await jobClamp(jobId)).toEqual({ kind: 'rcd', resistorOhm: 4.7e3, capacitorF: 10e-9 });
    // A zener's voltage is its breakdown (SPICE BV): it stays.
    expect(await storedClamp(zener.id)).toEqual({ kind: 'zener', clampVoltageV: 30 });

    await rcdClampLevel.down(queries);
    expect(await storedClamp(rcd.id)).toMatchObject({ kind: 'rcd', clampVoltageV: 40, resistorOhm: 4.7e3 });
    expect(await jobClamp(jobId)).toMatchObject({ kind: 'rcd', clampVoltageV: 40 });
    expect(await storedClamp(zener.id)).toEqual({ kind: 'zener', clampVoltageV: 30 });
    await rcdClampLevel.up(queries);
    expect(await storedClamp(rcd.id)).not.toHaveProperty('clampVoltageV');
    // The revisions stay immutable to everything else: the trigger is back on.
    await expect(
      testApp.sequelize.query(`UPDATE revisions SET change_note = 'edited' WHERE design_id = :id`, {
        replacements: { id: rcd.id },
      }),
    ).rejects.toThrow(/immutable/);
  });

  it('imports a design file written before the change with the stated voltage taken out', async () => {
    const engineer = await createUser(testApp, { role: 'engineer' });
    const project = await createProject([{ userId: engineer.id, role: 'engineer' }]);
    const old = driverDesign('rcd');
    if (old.drive.kind !== 'driver') throw new Error('driver design');
    (old.drive.driver.clamp as Record<string, unknown>).clampVoltageV = 40;
    const imported = await testApp.app
      .get(DesignsService)
      .import(project.id, { format: 'ladderwright-design', formatVersion: 1, design: old }, engineer.id);
    expect(await storedClamp(imported.id)).toEqual({ kind: 'rcd', resistorOhm: 4.7e3, capacitorF: 10e-9 });
  });
});
