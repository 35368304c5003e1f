import request from 'supertest';
import type { DesignDetail, DesignSummary, ResultDifference } from '@ladderwright/shared/api';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import { DEMO_PASSWORD, seedDemo } from '../src/database/seed-demo';
import { DEMO_DESIGNS } from '../src/designs/seed-demo-designs';
import { RevisionModel } from '../src/revisions/revision.model';
import { PasswordHasherService } from '../src/users/password-hasher.service';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies, signIn } from './utils/sign-in';

// Statuses follow shared/src/auth/permissions.ts (project.read for reads, design.write for writes) and the
// project guard (non-member 404, member without the role 403): common practice, no source.
describe('designs', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let lead: TestUser;
  let reviewer: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  let listProject: TestProject;
  let otherProject: TestProject;
  const cookies = new SessionCookies();
  const { as } = cookies;
  const designsPath = (projectId = project.id) => `/api/projects/${projectId}/designs`;

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer', displayName: 'Ada Engineer' });
    lead = await createUser(testApp, { role: 'lead', displayName: 'Lee Lead' });
    reviewer = await createUser(testApp, { role: 'reviewer' });
    outsider = await createUser(testApp, { role: 'engineer' });
    const team = [
      { userId: engineer.id, role: 'engineer' as const },
      { userId: lead.id, role: 'lead' as const },
      { userId: reviewer.id, role: 'reviewer' as const },
    ];
    project = await createProject(team);
    listProject = await createProject(team);
    otherProject = await createProject([{ userId: outsider.id, role: 'engineer' }]);
    await cookies.signIn(testApp, [engineer, lead, reviewer, outsider]);
  });
  afterAll(async () => testApp.close());

  describe('creating', () => {
    it('creates a design from a template with revision 1 as a draft owned by the creator', async () => {
      const response = await http()
        .post(designsPath())
        .set('Cookie', as(engineer))
        .send({ name: 'Bias supply, low ripple', from: { kind: 'template', templateId: 'detectorBias' } });
      expect(response.status).toBe(201);
      expect(response.body).toMatchObject({
        projectId: project.id,
        name: 'Bias supply, low ripple',
        ownerId: engineer.id,
        ownerName: 'Ada Engineer',
        latestRevisionNumber: 1,
        latestState: 'draft',
      });
      expect(response.body.revisions).toHaveLength(1);
      expect(response.body.revisions[0]).toMatchObject({ number: 1, state: 'draft', baseRevisionNumber: null });
      const revision = await http().get(`${designsPath()}/${response.body.id}/revisions/1`).set('Cookie', as(reviewer));
      expect(revision.body.document).toEqual({ ...designExamples.detectorBias, name: 'Bias supply, low ripple' });
    });

    it('creates a blank design whose document is valid and analysed', async () => {
      const response = await http()
        .post(designsPath())
        .set('Cookie', as(lead))
        .send({ name: 'Scratch', from: { kind: 'blank' } });
      expect(response.status).toBe(201);
      const revision = await http().get(`${designsPath()}/${response.body.id}/revisions/1`).set('Cookie', as(lead));
      expect(revision.body.document.name).toBe('Scratch');
      expect(typeof revision.body.report.outputMeanV).toBe('number');
    });

    it('duplicates a chosen revision of another design of the project', async () => {
      const source = await createDesign(testApp, project.id, engineer.id, {
        from: { kind: 'template', templateId: 'ionizerBar' },
      });
      const response = await http()
        .post(designsPath())
        .set('Cookie', as(engineer))
        .send({ name: 'Ionizer copy', from: { kind: 'duplicate', designId: source.id, revisionNumber: 1 } });
      expect(response.status).toBe(201);
      const revision = await http().get(`${designsPath()}/${response.body.id}/revisions/1`).set('Cookie', as(engineer));
      expect(revision.body.document.multiplier).toEqual(designExamples.ionizerBar.multiplier);
    });

    it('creates a design from a supplied document', async () => {
      const response = await http()
        .post(designsPath())
        .set('Cookie', as(engineer))
        .send({ name: 'From file', from: { kind: 'document', document: designExamples.precipitatorCell } });
      expect(response.status).toBe(201);
      expect(response.body.latestRevisionNumber).toBe(1);
    });

    it.each([
      ['name', 'name is required', { from: { kind: 'blank' } }],
      ['name', 'name must not be empty', { name: '', from: { kind: 'blank' } }],
      ['from', 'from is required', { name: 'x' }],
      [
        'from.kind',
        'from.kind must be one of blank, template, duplicate, document',
        { name: 'x', from: { kind: 'copy' } },
      ],
      [
        'from.templateId',
        "from.templateId 'nope' is not a known template",
        { name: 'x', from: { kind: 'template', templateId: 'nope' } },
      ],
      [
        'from.revisionNumber',
        'from.revisionNumber must be a revision number (an integer ≥ 1)',
        { name: 'x', from: { kind: 'duplicate', designId: 'x', revisionNumber: 0 } },
      ],
      ['from.document', 'from.document is required', { name: 'x', from: { kind: 'document' } }],
    ])('returns 400 naming %s (%s)', async (field, message, body) => {
      const response = await http().post(designsPath()).set('Cookie', as(engineer)).send(body);
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ field, message });
    });

    it('returns 400 with the field path of an invalid supplied document', async () => {
      const document = structuredClone(designExamples.detectorBias) as unknown as { load: { currentA: unknown } };
      document.load.currentA = 'lots';
      const response = await http()
        .post(designsPath())
        .set('Cookie', as(engineer))
        .send({ name: 'Broken', from: { kind: 'document', document } });
      expect(response.status).toBe(400);
      expect(response.body.issues.map((issue: { path: string }) => issue.path)).toContain(
        'from.document.load.currentA',
      );
    });

    it('returns 404 naming from.designId when duplicating a design of another project', async () => {
      const foreign = await createDesign(testApp, otherProject.id, outsider.id);
      const response = await http()
        .post(designsPath())
        .set('Cookie', as(engineer))
        .send({ name: 'Stolen', from: { kind: 'duplicate', designId: foreign.id } });
      expect(response.status).toBe(404);
      expect(response.body.field).toBe('from.designId');
    });

    it('returns 403 when a reviewer creates a design, and 404 to a non-member', async () => {
      const body = { name: 'x', from: { kind: 'blank' } };
      expect((await http().post(designsPath()).set('Cookie', as(reviewer)).send(body)).status).toBe(403);
      expect((await http().post(designsPath()).set('Cookie', as(outsider)).send(body)).status).toBe(404);
      expect((await http().post(designsPath()).send(body)).status).toBe(401);
    });
  });

  describe('listing', () => {
    let alpha: DesignDetail;
    let bravo: DesignDetail;
    let charlie: DesignDetail;

    beforeAll(async () => {
      alpha = await createDesign(testApp, listProject.id, engineer.id, { name: 'Alpha ionizer' });
      bravo = await createDesign(testApp, listProject.id, lead.id, { name: 'Bravo 50%_bias' });
      charlie = await createDesign(testApp, listProject.id, engineer.id, { name: 'charlie ionizer' });
      await RevisionModel.update({ state: 'submitted' }, { where: { designId: bravo.id } });
    });

    const names = (items: DesignSummary[]) => items.map((item) => item.name);

    it('lists the project designs, last changed first by default, with owner and latest state', async () => {
      const response = await http().get(designsPath(listProject.id)).set('Cookie', as(reviewer));
      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ total: 3, page: 1, pageSize: 20 });
      // Bravo's state change is its latest update, so it comes before the later-created charlie.
      expect(names(response.body.items)).toEqual(['Bravo 50%_bias', 'charlie ionizer', 'Alpha ionizer']);
      expect(response.body.items[0]).toMatchObject({
        ownerId: lead.id,
        ownerName: 'Lee Lead',
        latestState: 'submitted',
      });
    });

    it('searches names case-insensitively, with % and _ taken literally', async () => {
      const byWord = await http()
        .get(designsPath(listProject.id))
        .query({ q: 'IONIZER', sort: 'name' })
        .set('Cookie', as(engineer));
      expect(names(byWord.body.items)).toEqual(['Alpha ionizer', 'charlie ionizer']);
      const literal = await http().get(designsPath(listProject.id)).query({ q: '%_' }).set('Cookie', as(engineer));
      expect(names(literal.body.items)).toEqual(['Bravo 50%_bias']);
    });

    it('filters by latest state and by owner', async () => {
      const submitted = await http()
        .get(designsPath(listProject.id))
        .query({ state: 'submitted' })
        .set('Cookie', as(engineer));
      expect(names(submitted.body.items)).toEqual(['Bravo 50%_bias']);
      const mine = await http()
        .get(designsPath(listProject.id))
        .query({ ownerId: engineer.id, sort: 'name', order: 'desc' })
        .set('Cookie', as(engineer));
      expect(names(mine.body.items)).toEqual(['charlie ionizer', 'Alpha ionizer']);
    });

    it('pages with the total of all matches', async () => {
      const response = await http()
        .get(designsPath(listProject.id))
        .query({ sort: 'name', page: 2, pageSize: 2 })
        .set('Cookie', as(engineer));
      expect(response.body).toMatchObject({ total: 3, page: 2, pageSize: 2 });
      expect(names(response.body.items)).toEqual(['charlie ionizer']);
      const beyond = await http().get(designsPath(listProject.id)).query({ page: 9 }).set('Cookie', as(engineer));
      expect(beyond.body).toMatchObject({ items: [], total: 3 });
    });

    it('sorts by state', async () => {
      const response = await http()
        .get(designsPath(listProject.id))
        .query({ sort: 'state', order: 'desc' })
        .set('Cookie', as(engineer));
      expect(response.body.items[0].id).toBe(bravo.id);
      expect([alpha.id, charlie.id]).toContain(response.body.items[1].id);
    });

    it.each([
      ['state', 'state must be one of draft, submitted, returned, approved, released, superseded', { state: 'done' }],
      ['sort', 'sort must be one of name, updatedAt, state', { sort: 'owner' }],
      ['order', 'order must be asc or desc', { order: 'up' }],
      ['page', 'page must be 1 or more', { page: 0 }],
      ['pageSize', 'pageSize must be at most 100', { pageSize: 500 }],
      ['ownerId', 'ownerId must be a user id (UUID)', { ownerId: 'me' }],
    ])('returns 400 naming %s (%s)', async (field, message, query) => {
      const response = await http().get(designsPath(listProject.id)).query(query).set('Cookie', as(engineer));
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ field, message });
    });

    it('returns 401 without a session and 404 to a non-member', async () => {
      expect((await http().get(designsPath(listProject.id))).status).toBe(401);
      expect((await http().get(designsPath(listProject.id)).set('Cookie', as(outsider))).status).toBe(404);
    });
  });

  describe('detail', () => {
    it('returns the design with its revisions, newest first', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const response = await http().get(`${designsPath()}/${design.id}`).set('Cookie', as(reviewer));
      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ id: design.id, latestRevisionNumber: 1 });
      expect(response.body.revisions.map((revision: { number: number }) => revision.number)).toEqual([1]);
    });

    it.each(['not-a-uuid', '00000000-0000-4000-8000-000000000000'])(
      'returns 404 for design id %s',
      async (designId) => {
        expect((await http().get(`${designsPath()}/${designId}`).set('Cookie', as(engineer))).status).toBe(404);
      },
    );

    it('returns 404 for a design of another project, and to a non-member', async () => {
      const foreign = await createDesign(testApp, otherProject.id, outsider.id);
      expect((await http().get(`${designsPath()}/${foreign.id}`).set('Cookie', as(engineer))).status).toBe(404);
      const own = await createDesign(testApp, project.id, engineer.id);
      expect((await http().get(`${designsPath()}/${own.id}`).set('Cookie', as(outsider))).status).toBe(404);
      expect((await http().get(`${designsPath()}/${own.id}`)).status).toBe(401);
    });
  });

  describe('compare', () => {
    let design: DesignDetail;

    beforeAll(async () => {
      design = await createDesign(testApp, project.id, engineer.id);
      const document: Design = structuredClone(designExamples.detectorBias);
      document.name = design.name;
      document.multiplier.capacitors[2]!.valueF = 47e-9;
      const saved = await http()
        .post(`${designsPath()}/${design.id}/revisions`)
        .set('Cookie', as(engineer))
        .send({ baseRevisionNumber: 1, document, changeNote: 'top smoothing C3 22 nF -> 47 nF' });
      expect(saved.status).toBe(201);
    });

    it('shows a changed capacitor with its path and delta, and the headline results that moved', async () => {
      const response = await http()
        .get(`${designsPath()}/${design.id}/compare`)
        .query({ a: 1, b: 2 })
        .set('Cookie', as(reviewer));
      expect(response.status).toBe(200);
      expect(response.body.a.number).toBe(1);
      expect(response.body.b.number).toBe(2);
      // 47 nF − 22 nF = 25 nF; 1e-18 F absolute tolerance covers binary rounding of the two values.
      expect(response.body.inputs).toHaveLength(1);
      expect(response.body.inputs[0]).toMatchObject({ path: 'multiplier.capacitors[2].valueF', a: 22e-9, b: 47e-9 });
      expect(Math.abs(response.body.inputs[0].delta - 25e-9)).toBeLessThan(1e-18);
      const ripple = response.body.results.find((result: ResultDifference) => result.key === 'ripplePeakToPeakV');
      expect(ripple).toMatchObject({ label: 'Ripple (peak-to-peak)', unit: 'V' });
      // A larger top smoothing capacitor lowers the output ripple: the direction is the check, not the size.
      expect(ripple.delta).toBeLessThan(0);
      expect(ripple.deltaPct).toBeCloseTo((ripple.delta / Math.abs(ripple.a)) * 100, 10);
    });

    it('shows no input differences and zero deltas for a revision against itself', async () => {
      const response = await http()
        .get(`${designsPath()}/${design.id}/compare`)
        .query({ a: 2, b: 2 })
        .set('Cookie', as(engineer));
      expect(response.body.inputs).toEqual([]);
      const moved = response.body.results.filter(
        (result: ResultDifference) => result.delta !== null && result.delta !== 0,
      );
      expect(moved).toEqual([]);
    });

    it.each([
      ['a', 'a is required', { b: 1 }],
      ['b', 'b must be a revision number (an integer)', { a: 1, b: 'two' }],
      ['a', 'a must be 1 or more', { a: 0, b: 1 }],
    ])('returns 400 naming %s (%s)', async (field, message, query) => {
      const response = await http()
        .get(`${designsPath()}/${design.id}/compare`)
        .query(query)
        .set('Cookie', as(engineer));
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ field, message });
    });

    it('returns 404 naming b for a revision that does not exist, 404 to a non-member and 401 without a session', async () => {
      const missing = await http()
        .get(`${designsPath()}/${design.id}/compare`)
        .query({ a: 1, b: 9 })
        .set('Cookie', as(engineer));
      expect(missing.status).toBe(404);
      expect(missing.body.field).toBe('b');
      const path = `${designsPath()}/${design.id}/compare?a=1&b=2`;
      expect((await http().get(path).set('Cookie', as(outsider))).status).toBe(404);
      expect((await http().get(path)).status).toBe(401);
    });

    it('compares with a revision of another design of the project, naming both and the capacitors that move', async () => {
      const other = await createDesign(testApp, project.id, engineer.id, {
        name: 'Four-cell tester',
        from: { kind: 'template', templateId: 'surfaceChargeTester' },
      });
      const response = await http()
        .get(`${designsPath()}/${design.id}/compare`)
        .query({ a: 1, b: 1, bDesignId: other.id })
        .set('Cookie', as(reviewer));
      expect(response.status).toBe(200);
      expect(response.body.designs).toEqual({
        a: { id: design.id, name: design.name },
        b: { id: other.id, name: 'Four-cell tester' },
      });
      // The tripler starts with a half-wave cell (C1 in the smoothing column); a four-cell ladder starts in the
      // oscillating column (capacitor order of the design document, design.types.ts).
      expect(response.body.roleChanges[0]).toMatchObject({
        index: 0,
        from: { column: 'smoothing' },
        to: { column: 'oscillating' },
      });
      expect(response.body.checks.a.length).toBeGreaterThan(0);
      expect(response.body.checks.b.length).toBeGreaterThan(0);
      expect(response.body.inputs.some((input: { path: string }) => input.path === 'multiplier.cellCount')).toBe(true);
    });

    it('returns 400 naming bDesignId when it is not an id, and 404 for a design of another project', async () => {
      const malformed = await http()
        .get(`${designsPath()}/${design.id}/compare`)
        .query({ a: 1, b: 1, bDesignId: 'not-an-id' })
        .set('Cookie', as(engineer));
      expect(malformed.status).toBe(400);
      expect(malformed.body).toMatchObject({ field: 'bDesignId', message: 'bDesignId must be a design id (a UUID)' });
      const foreign = await createDesign(testApp, otherProject.id, outsider.id);
      const hidden = await http()
        .get(`${designsPath()}/${design.id}/compare`)
        .query({ a: 1, b: 1, bDesignId: foreign.id })
        .set('Cookie', as(engineer));
      expect(hidden.status).toBe(404);
    });
  });

  describe('import', () => {
    const importPath = () => `${designsPath()}/import`;

    it('imports a bare design document as a new design named after it', async () => {
      const response = await http()
        .post(importPath())
        .set('Cookie', as(engineer))
        .send(designExamples.surfaceChargeTester);
      expect(response.status).toBe(201);
      expect(response.body).toMatchObject({ name: designExamples.surfaceChargeTester.name, latestRevisionNumber: 1 });
      expect(response.body.revisions[0].changeNote).toBe('Imported');
    });

    it('returns 400 with every offending field of an export file under design.', async () => {
      const design = structuredClone(designExamples.detectorBias) as unknown as Record<string, unknown> & {
        multiplier: { cellCount: unknown };
      };
      design.multiplier.cellCount = 2.5;
      delete design.targets;
      const response = await http().post(importPath()).set('Cookie', as(engineer)).send({
        format: 'ladderwright-design',
        formatVersion: 1,
        exportedAt: '2026-01-01T00:00:00Z',
        engineVersion: '1.0.0',
        design,
      });
      expect(response.status).toBe(400);
      const paths = response.body.issues.map((issue: { path: string }) => issue.path);
      expect(paths).toEqual(expect.arrayContaining(['design.multiplier.cellCount', 'design.targets']));
    });

    it('returns 400 naming the field of a bare document', async () => {
      const document = { ...designExamples.detectorBias, drive: { kind: 'square' } };
      const response = await http().post(importPath()).set('Cookie', as(engineer)).send(document);
      expect(response.status).toBe(400);
      expect(response.body.issues[0].path).toMatch(/^drive\./);
    });

    it.each([
      ['format', { format: 'other-tool', formatVersion: 1, design: designExamples.detectorBias }],
      ['formatVersion', { format: 'ladderwright-design', formatVersion: 7, design: designExamples.detectorBias }],
      ['design', { format: 'ladderwright-design', formatVersion: 1 }],
    ])('returns 400 naming %s of a bad export file', async (field, body) => {
      const response = await http().post(importPath()).set('Cookie', as(engineer)).send(body);
      expect(response.status).toBe(400);
      expect(response.body.field).toBe(field);
    });

    it('returns 400 for a body that is not JSON', async () => {
      const response = await http()
        .post(importPath())
        .set('Cookie', as(engineer))
        .set('Content-Type', 'application/json')
        .send('{"format":');
      expect(response.status).toBe(400);
    });

    it('returns 403 to a reviewer, 404 to a non-member and 401 without a session', async () => {
      const body = designExamples.detectorBias;
      expect((await http().post(importPath()).set('Cookie', as(reviewer)).send(body)).status).toBe(403);
      expect((await http().post(importPath()).set('Cookie', as(outsider)).send(body)).status).toBe(404);
      expect((await http().post(importPath()).send(body)).status).toBe(401);
    });
  });

  describe('demo seed', () => {
    it('gives each demo project its demo design in its Sign-off state, once', async () => {
      const hasher = testApp.app.get(PasswordHasherService);
      await seedDemo(hasher);
      expect(await seedDemo(hasher)).toBe(0);
      const demoCookie = await signIn(testApp, 'lead@northfold.test', DEMO_PASSWORD);
      const projects = await http().get('/api/projects').set('Cookie', demoCookie);
      const seen = new Map<string, DesignSummary[]>();
      for (const demoProject of projects.body as { id: string; name: string }[]) {
        const page = await http().get(designsPath(demoProject.id)).set('Cookie', demoCookie);
        seen.set(demoProject.name, page.body.items);
      }
      for (const demo of DEMO_DESIGNS) {
        const items = seen.get(demo.projectName) ?? [];
        expect(items).toHaveLength(1);
        expect(items[0]).toMatchObject({
          latestRevisionNumber: demo.revisions.length,
          latestState: demo.revisions[demo.revisions.length - 1]!.state,
        });
      }
      const ionizer = seen.get('Cleanroom ionizer bar')![0]!;
      const compare = await http()
        .get(`${designsPath(ionizer.projectId)}/${ionizer.id}/compare`)
        .query({ a: 1, b: 2 })
        .set('Cookie', demoCookie);
      expect(compare.body.inputs.map((input: { path: string }) => input.path)).toContain(
        'multiplier.capacitors[0].valueF',
      );
    });
  });
});
