import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies } from './utils/sign-in';

const fixture = (name: string) => readFileSync(join(__dirname, 'fixtures', 'parts', name));

// Roles follow shared/src/auth/permissions.ts ('parts.manage' is lead-only); non-members get 404.
describe('parts shelf', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let lead: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  let otherProject: TestProject;
  const cookies = new SessionCookies();
  const { as } = cookies;
  const partsUrl = (projectId = project.id) => `/api/projects/${projectId}/parts`;
  const importCsv = (body: Buffer, dryRun: boolean, user = lead, name = 'shelf.csv') =>
    http()
      .post(`${partsUrl()}/import?dryRun=${dryRun}`)
      .set('Cookie', as(user))
      .attach('file', body, { filename: name, contentType: 'text/csv' });

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer' });
    lead = await createUser(testApp, { role: 'lead' });
    outsider = await createUser(testApp, { role: 'lead' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: lead.id, role: 'lead' },
    ]);
    otherProject = await createProject([{ userId: outsider.id, role: 'lead' }]);
    await cookies.signIn(testApp, [engineer, lead, outsider]);
  });
  afterAll(async () => testApp.close());

  const capacitor = {
    code: 'NF-C222-2K',
    kind: 'capacitor',
    description: 'HV ceramic 2.2 nF',
    valueSi: '2.2n',
    tolerance: '10%',
    ratedVoltageV: '2 kV',
    unitCost: 0.3,
    sizeMm: '8x4',
  };

  describe('create, edit, remove', () => {
    it('lets a lead add a part with engineering units, stored in SI', async () => {
      const response = await http().post(partsUrl()).set('Cookie', as(lead)).send(capacitor);
      expect(response.status).toBe(201);
      expect(response.body).toMatchObject({
        code: 'NF-C222-2K',
        kind: 'capacitor',
        tolerance: 0.1,
        ratedVoltageV: 2000,
        unitCost: 0.3,
      });
      expect(response.body.valueSi).toBeCloseTo(2.2e-9, 18);
    });

    it('returns 403 when an engineer adds a part', async () => {
      const response = await http()
        .post(partsUrl())
        .set('Cookie', as(engineer))
        .send({ ...capacitor, code: 'NF-C1-1' });
      expect(response.status).toBe(403);
      expect(response.body.message).toContain('lead');
    });

    it('returns 404 for a project the user is not in', async () => {
      expect((await http().get(partsUrl()).set('Cookie', as(outsider))).status).toBe(404);
    });

    it('returns 400 naming each bad field', async () => {
      const response = await http()
        .post(partsUrl())
        .set('Cookie', as(lead))
        .send({ code: 'NF-C9', kind: 'capacitor', valueSi: '10 mA', unitCost: -2 });
      expect(response.status).toBe(400);
      expect(response.body.issues.map((issue: { path: string }) => issue.path)).toEqual([
        'unitCost',
        'valueSi',
        'ratedVoltageV',
      ]);
      expect(response.body.field).toBe('unitCost');
    });

    it('returns 400 for a code already on the shelf', async () => {
      const response = await http().post(partsUrl()).set('Cookie', as(lead)).send(capacitor);
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ field: 'code', message: 'code NF-C222-2K is already on this shelf' });
    });

    it('returns 400 for a body that is not an object', async () => {
      const response = await http().post(partsUrl()).set('Cookie', as(lead)).send([1, 2]);
      expect(response.status).toBe(400);
    });

    it('edits the cost and refuses a change of kind', async () => {
      const [part] = (await http().get(partsUrl()).set('Cookie', as(lead))).body;
      const edited = await http().patch(`${partsUrl()}/${part.id}`).set('Cookie', as(lead)).send({ unitCost: '0.28' });
      expect(edited.status).toBe(200);
      expect(edited.body.unitCost).toBe(0.28);
      const refused = await http().patch(`${partsUrl()}/${part.id}`).set('Cookie', as(lead)).send({ kind: 'diode' });
      expect(refused.status).toBe(400);
      expect(refused.body.field).toBe('kind');
    });

    it('removes a part, and a second removal is 404', async () => {
      const created = await http()
        .post(partsUrl())
        .set('Cookie', as(lead))
        .send({ ...capacitor, code: 'NF-C000-TMP' });
      expect((await http().delete(`${partsUrl()}/${created.body.id}`).set('Cookie', as(lead))).status).toBe(204);
      expect((await http().delete(`${partsUrl()}/${created.body.id}`).set('Cookie', as(lead))).status).toBe(404);
    });

    it('does not let a lead of another project edit this shelf', async () => {
      const [part] = (await http().get(partsUrl()).set('Cookie', as(lead))).body;
      const response = await http()
        .patch(`${partsUrl(otherProject.id)}/${part.id}`)
        .set('Cookie', as(outsider))
        .send({ unitCost: 1 });
      expect(response.status).toBe(404);
    });
  });

  describe('CSV import', () => {
    it('previews a good file without writing it', async () => {
      const response = await importCsv(fixture('ok/shelf.csv'), true);
      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ dryRun: true, written: false, errors: [] });
      expect(response.body.rows.map((row: { line: number; action: string }) => [row.line, row.action])).toEqual([
        [2, 'create'],
        [3, 'create'],
        [4, 'create'],
        [5, 'create'],
        [6, 'create'],
      ]);
      const list = await http().get(partsUrl()).set('Cookie', as(lead));
      expect(list.body).toHaveLength(1);
    });

    it('writes a good file when dryRun is false', async () => {
      const response = await importCsv(fixture('ok/shelf.csv'), false);
      expect(response.status).toBe(200);
      expect(response.body.written).toBe(true);
      const list = await http().get(partsUrl()).set('Cookie', as(engineer));
      expect(list.body.map((part: { code: string }) => part.code)).toEqual([
        'NF-C222-2K',
        'NF-C472-3K',
        'NF-K18-AL250',
        'NF-D4K-50M',
        'NF-R82M-1K',
        'NF-Q40-1A',
      ]);
      const diode = list.body.find((part: { code: string }) => part.code === 'NF-D4K-50M');
      expect(diode).toMatchObject({ ratedVoltageV: 4000, ratedCurrentA: 0.05, ratedSurgeCurrentA: 8, unitCost: 0.3 });
    });

    it('marks codes already on the shelf as updates on a second import', async () => {
      const response = await importCsv(fixture('ok/shelf.csv'), true);
      expect(response.body.rows.every((row: { action: string }) => row.action === 'update')).toBe(true);
    });

    it('filters the list by kind, text and rated voltage', async () => {
      const byKind = await http().get(`${partsUrl()}?kind=diode`).set('Cookie', as(engineer));
      expect(byKind.body.map((part: { code: string }) => part.code)).toEqual(['NF-D4K-50M']);
      const byText = await http().get(`${partsUrl()}?q=ceramic`).set('Cookie', as(engineer));
      expect(byText.body.map((part: { code: string }) => part.code)).toEqual(['NF-C222-2K', 'NF-C472-3K']);
      const byVoltage = await http().get(`${partsUrl()}?minVoltageV=3000`).set('Cookie', as(engineer));
      expect(byVoltage.body.map((part: { code: string }) => part.code)).toEqual(['NF-C472-3K', 'NF-D4K-50M']);
      const bad = await http().get(`${partsUrl()}?kind=inductor`).set('Cookie', as(engineer));
      expect(bad.status).toBe(400);
      expect(bad.body.field).toBe('kind');
    });

    it('refuses a file with wrong columns, naming them', async () => {
      const response = await importCsv(fixture('not-ok/wrong-columns.csv'), true);
      expect(response.status).toBe(400);
      expect(response.body.issues.map((issue: { path: string }) => issue.path)).toEqual([
        'line 1, part',
        'line 1, type',
        'line 1, price',
        'line 1, code',
        'line 1, kind',
        'line 1, unitCost',
      ]);
    });

    it('previews bad units with the line and column of each, and writes nothing on import', async () => {
      const preview = await importCsv(fixture('not-ok/bad-units.csv'), true);
      expect(preview.status).toBe(200);
      expect(preview.body.errors.map((error: { line: number; column: string }) => [error.line, error.column])).toEqual([
        [3, 'valueSi'],
        [4, 'ratedVoltageV'],
      ]);
      expect(preview.body.errors[0].message).toContain('unit A given where F is expected');
      const before = (await http().get(partsUrl()).set('Cookie', as(lead))).body;
      const refused = await importCsv(fixture('not-ok/bad-units.csv'), false);
      expect(refused.status).toBe(400);
      expect(refused.body.field).toBe('line 3, valueSi');
      expect(refused.body.message).toContain('nothing was written');
      expect((await http().get(partsUrl()).set('Cookie', as(lead))).body).toEqual(before);
    });

    it('refuses a code that appears twice in the file', async () => {
      const response = await importCsv(fixture('not-ok/duplicates.csv'), false);
      expect(response.status).toBe(400);
      expect(response.body.issues).toEqual([
        { path: 'line 4, code', message: 'line 4, code: NF-C472-3K already appears on line 2' },
      ]);
    });

    it('refuses a row with too few cells', async () => {
      const response = await importCsv(fixture('not-ok/ragged-row.csv'), false);
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('line 2, row');
    });

    it('returns 413 for a file over the limit', async () => {
      const header = fixture('ok/shelf.csv').toString().split('\n')[0];
      const big = Buffer.from(`${header}\n${'#'.repeat(600 * 1024)}\n`);
      const response = await importCsv(big, true);
      expect(response.status).toBe(413);
      expect(response.body).toMatchObject({ code: 'payload_too_large', field: 'file' });
      expect(response.body.message).toContain('512 kB');
    });

    it('returns 400 for a file that is not a CSV', async () => {
      const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]);
      const response = await importCsv(png, true, lead, 'shelf.png');
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('file');
    });

    it('returns 400 when no file is attached', async () => {
      const response = await http().post(`${partsUrl()}/import?dryRun=true`).set('Cookie', as(lead));
      expect(response.status).toBe(400);
      expect(response.body.message).toContain('file is required');
    });

    it('returns 403 when an engineer imports', async () => {
      expect((await importCsv(fixture('ok/shelf.csv'), true, engineer)).status).toBe(403);
    });
  });

  describe('CSV export', () => {
    it('exports the shelf in the import layout, neutralising formula cells', async () => {
      expect((await importCsv(fixture('ok/formula-description.csv'), false)).status).toBe(200);
      const response = await http().get(`${partsUrl()}/export.csv`).set('Cookie', as(engineer));
      expect(response.status).toBe(200);
      expect(response.headers['content-type']).toContain('text/csv');
      const lines = response.text.split('\r\n');
      expect(lines[0]).toBe(fixture('ok/shelf.csv').toString().split('\n')[0]);
      expect(lines).toContain(
        `NF-C103-3K,capacitor,"'=HYPERLINK(""http://example.test"")",1e-8,,3000,,,,0.35,${','.repeat(18)}`,
      );
    });

    it('round-trips: the exported file imports again without errors', async () => {
      const exported = await http().get(`${partsUrl()}/export.csv`).set('Cookie', as(lead));
      const response = await importCsv(Buffer.from(exported.text), true);
      expect(response.status).toBe(200);
      expect(response.body.errors).toEqual([]);
      expect(response.body.rows).toHaveLength(7);
    });
  });

  describe('cores, wires and tapes', () => {
    let shelf: TestProject;
    const shelfUrl = () => partsUrl(shelf.id);
    const importInto = (body: Buffer, dryRun: boolean) =>
      http()
        .post(`${shelfUrl()}/import?dryRun=${dryRun}`)
        .set('Cookie', as(lead))
        .attach('file', body, { filename: 'magnetics.csv', contentType: 'text/csv' });
    const core = {
      code: 'NF-KP18-M1',
      kind: 'core',
      description: 'Ferrite pot core 18x11 with bobbin',
      valueSi: '4µ',
      unitCost: 0.85,
      coreAreaM2: '43.3 mm²',
      corePathLengthM: '26 mm',
      coreVolumeM3: '1120 mm³',
      windowAreaM2: '15.8 mm²',
      bobbinBreadthM: '7.2 mm',
      bobbinHeightM: '2.2 mm',
      meanTurnLengthM: '37 mm',
      saturationFluxDensity25T: '490 mT',
      saturationFluxDensity100T: '390 mT',
      steinmetzK: 2.5,
      steinmetzAlpha: 1.4,
      steinmetzBeta: 2.5,
    };

    beforeAll(async () => {
      shelf = await createProject([
        { userId: engineer.id, role: 'engineer' },
        { userId: lead.id, role: 'lead' },
      ]);
    });

    it('adds a core with its geometry and material, stored in SI', async () => {
      const response = await http().post(shelfUrl()).set('Cookie', as(lead)).send(core);
      expect(response.status).toBe(201);
      // mm² = 1e-6 m², mm³ = 1e-9 m³, mT = 1e-3 T (SI); compared to 12 digits after the parser's rounding.
      expect(response.body.coreAreaM2).toBeCloseTo(43.3e-6, 12);
      expect(response.body.coreVolumeM3).toBeCloseTo(1.12e-6, 15);
      expect(response.body).toMatchObject({ kind: 'core', corePathLengthM: 0.026, saturationFluxDensity100T: 0.39 });
    });

    it('edits one core field and keeps the rest', async () => {
      const [stored] = (await http().get(`${shelfUrl()}?kind=core`).set('Cookie', as(lead))).body;
      const response = await http()
        .patch(`${shelfUrl()}/${stored.id}`)
        .set('Cookie', as(lead))
        .send({ saturationFluxDensity100T: '380 mT' });
      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ saturationFluxDensity100T: 0.38, coreAreaM2: stored.coreAreaM2 });
    });

    it('returns 400 naming the field for a core without its area and for a unit slip', async () => {
      const missing = await http()
        .post(shelfUrl())
        .set('Cookie', as(lead))
        .send({ ...core, code: 'NF-KX-1', coreAreaM2: undefined });
      expect(missing.status).toBe(400);
      expect(missing.body).toMatchObject({ field: 'coreAreaM2', message: 'coreAreaM2 is required for a core' });
      const slip = await http()
        .post(shelfUrl())
        .set('Cookie', as(lead))
        .send({ ...core, code: 'NF-KX-2', bobbinHeightM: '2.2' });
      expect(slip.status).toBe(400);
      expect(slip.body.field).toBe('bobbinHeightM');
      expect(slip.body.message).toContain('0.1 mm to 200 mm');
    });

    it('returns 403 when an engineer adds a wire', async () => {
      const wire = { code: 'NF-W1', kind: 'wire', unitCost: 0.01, copperDiameterM: '0.1 mm' };
      expect((await http().post(shelfUrl()).set('Cookie', as(engineer)).send(wire)).status).toBe(403);
    });

    it('imports cores, wires and tapes from CSV', async () => {
      const response = await importInto(fixture('ok/magnetics.csv'), false);
      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ written: true, errors: [] });
      const list = (await http().get(shelfUrl()).set('Cookie', as(engineer))).body;
      const byCode = (code: string) => list.find((part: { code: string }) => part.code === code);
      expect(byCode('NF-KE25-M1')).toMatchObject({ kind: 'core', corePathLengthM: 0.0575, steinmetzAlpha: 1.4 });
      expect(byCode('NF-W010-G2')).toMatchObject({ kind: 'wire', enamelGrade: 2, breakdownVoltageV: 1000 });
      // 100 kV/mm = 1e8 V/m (SI).
      expect(byCode('NF-T025-PE')).toMatchObject({ kind: 'tape', thicknessM: 2.5e-5, dielectricStrengthVPerM: 1e8 });
      const wires = (await http().get(`${shelfUrl()}?kind=wire`).set('Cookie', as(engineer))).body;
      expect(wires.map((part: { code: string }) => part.code)).toEqual(['NF-W010-G2']);
    });

    it('previews a file with bad rows naming line and column, and writes nothing on import', async () => {
      const before = (await http().get(shelfUrl()).set('Cookie', as(lead))).body;
      const preview = await importInto(fixture('not-ok/magnetics.csv'), true);
      expect(preview.status).toBe(200);
      expect(preview.body.rows.map((row: { line: number }) => row.line)).toEqual([2]);
      expect(preview.body.errors.map((error: { line: number; column: string }) => [error.line, error.column])).toEqual([
        [3, 'coreAreaM2'],
        [4, 'overallDiameterM'],
        [5, 'dielectricStrengthVPerM'],
      ]);
      expect(preview.body.errors[0].message).toBe('line 3, coreAreaM2: coreAreaM2 must be from 0.1 mm² to 10,000 mm²');
      expect(preview.body.errors[2].message).toContain('dielectricStrengthVPerM is required for a tape');
      const refused = await importInto(fixture('not-ok/magnetics.csv'), false);
      expect(refused.status).toBe(400);
      expect(refused.body.field).toBe('line 3, coreAreaM2');
      expect((await http().get(shelfUrl()).set('Cookie', as(lead))).body).toEqual(before);
    });
  });
});
