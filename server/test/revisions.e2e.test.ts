import request from 'supertest';
import { expandCheckRules, type DesignDetail } from '@ladderwright/shared/api';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import { RevisionModel } from '../src/revisions/revision.model';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies } from './utils/sign-in';

// Statuses follow shared/src/auth/permissions.ts (design.write: engineer, lead) and the project guard
// (non-member 404, member without the role 403): common practice, no source.
describe('revisions', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let reviewer: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  let otherProject: TestProject;
  const cookies = new SessionCookies();
  const { as } = cookies;
  const revisionsPath = (design: { id: string }, projectId = project.id) =>
    `/api/projects/${projectId}/designs/${design.id}/revisions`;

  function edited(document: Design, capacitorIndex: number, valueF: number): Design {
    const copy = structuredClone(document);
    copy.multiplier.capacitors[capacitorIndex]!.valueF = valueF;
    return copy;
  }

  async function save(design: DesignDetail, base: number, document: Design, note = 'edit') {
    return http()
      .post(revisionsPath(design))
      .set('Cookie', as(engineer))
      .send({ baseRevisionNumber: base, document, changeNote: note });
  }

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer' });
    outsider = await createUser(testApp, { role: 'engineer' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: reviewer.id, role: 'reviewer' },
    ]);
    otherProject = await createProject([{ userId: outsider.id, role: 'engineer' }]);
    await cookies.signIn(testApp, [engineer, reviewer, outsider]);
  });
  afterAll(async () => testApp.close());

  describe('saving', () => {
    it('creates revision n+1 and leaves revision n byte-identical', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const before = await http()
        .get(`${revisionsPath(design)}/1`)
        .set('Cookie', as(engineer));
      expect(before.status).toBe(200);

      const saved = await save(design, 1, edited(before.body.document, 1, 22e-9), 'Raised C2 to 22 nF');
      expect(saved.status).toBe(201);
      expect(saved.body).toMatchObject({
        number: 2,
        state: 'draft',
        baseRevisionNumber: 1,
        changeNote: 'Raised C2 to 22 nF',
        authorId: engineer.id,
      });
      expect(saved.body.document.multiplier.capacitors[1].valueF).toBe(22e-9);

      const after = await http()
        .get(`${revisionsPath(design)}/1`)
        .set('Cookie', as(engineer));
      expect(after.text).toBe(before.text);
      const list = await http().get(revisionsPath(design)).set('Cookie', as(reviewer));
      expect(list.body.map((revision: { number: number }) => revision.number)).toEqual([2, 1]);
    });

    it('stores the report the server computed with the engine against the project shelf, with the engine version', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const stored = await http()
        .get(`${revisionsPath(design)}/1`)
        .set('Cookie', as(engineer));
      const evaluated = await http()
        .post(`/api/projects/${project.id}/analysis/evaluate`)
        .set('Cookie', as(engineer))
        .send({ document: stored.body.document });
      expect(stored.body.report).toEqual(evaluated.body.report);
      expect(stored.body.engineVersion).toBe(evaluated.body.engineVersion);
    });

    it('returns 409 stale_base with the latest number and the changed fields, and writes nothing', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const base = (
        await http()
          .get(`${revisionsPath(design)}/1`)
          .set('Cookie', as(engineer))
      ).body.document as Design;
      expect((await save(design, 1, edited(base, 0, 47e-9))).status).toBe(201);

      const stale = await save(design, 1, edited(base, 2, 33e-9), 'my parallel edit');
      expect(stale.status).toBe(409);
      expect(stale.body).toMatchObject({
        statusCode: 409,
        code: 'stale_base',
        latestRevisionNumber: 2,
        changedFields: ['multiplier.capacitors[0].valueF'],
      });
      expect(await RevisionModel.count({ where: { designId: design.id } })).toBe(2);
    });

    it('numbers concurrent saves on the same base once: one succeeds, the other is stale', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const base = designExamples.detectorBias;
      const results = await Promise.all([
        save(design, 1, edited(base, 0, 15e-9)),
        save(design, 1, edited(base, 0, 33e-9)),
      ]);
      expect(results.map((result) => result.status).sort()).toEqual([201, 409]);
      expect(await RevisionModel.count({ where: { designId: design.id } })).toBe(2);
    });

    it('refuses to change a saved document even past the service (database trigger)', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const revision = await RevisionModel.findOne({ where: { designId: design.id, number: 1 } });
      await expect(revision!.update({ changeNote: 'rewritten history' })).rejects.toThrow(/immutable/);
    });

    it('returns 400 naming the field of an invalid document, and writes nothing', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const bad = edited(designExamples.detectorBias, 1, -5);
      const response = await save(design, 1, bad);
      expect(response.status).toBe(400);
      expect(response.body.issues.map((issue: { path: string }) => issue.path)).toContain(
        'document.multiplier.capacitors[1].valueF',
      );
      expect(await RevisionModel.count({ where: { designId: design.id } })).toBe(1);
    });

    it.each([
      [
        'baseRevisionNumber',
        'baseRevisionNumber is required',
        { document: designExamples.detectorBias, changeNote: 'x' },
      ],
      [
        'baseRevisionNumber',
        'baseRevisionNumber must be 1 or more',
        { baseRevisionNumber: 0, document: designExamples.detectorBias, changeNote: 'x' },
      ],
      ['document', 'document is required', { baseRevisionNumber: 1, changeNote: 'x' }],
      [
        'document',
        'document must be a design document object',
        { baseRevisionNumber: 1, document: 'text', changeNote: 'x' },
      ],
      ['changeNote', 'changeNote is required', { baseRevisionNumber: 1, document: designExamples.detectorBias }],
    ])('returns 400 naming %s (%s)', async (field, message, body) => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const response = await http().post(revisionsPath(design)).set('Cookie', as(engineer)).send(body);
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ field, message });
    });

    it('returns 400 naming baseRevisionNumber when the base does not exist yet', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const response = await save(design, 5, designExamples.detectorBias);
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('baseRevisionNumber');
    });
  });

  describe('detail', () => {
    it('answers every read of a revision with the same bytes and ETag, the summary fresh, and 304 when unchanged', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const path = `${revisionsPath(design)}/1`;
      const first = await http().get(path).set('Cookie', as(engineer));
      const second = await http().get(path).set('Cookie', as(reviewer));
      expect(first.status).toBe(200);
      expect(first.headers['content-type']).toBe('application/json; charset=utf-8');
      expect(second.text).toBe(first.text);
      expect(second.headers.etag).toBe(first.headers.etag);
      const stored = await RevisionModel.findOne({ where: { designId: design.id, number: 1 } });
      expect(first.body.document).toEqual(stored?.document);
      expect(expandCheckRules(first.body.report)).toEqual(stored?.report);
      // Each check rule's text travels once, in the report's map; the checks name it by key.
      const rules = first.body.report.checkRules as Record<string, string>;
      expect(new Set(Object.values(rules)).size).toBe(Object.keys(rules).length);
      expect(Object.keys(rules).length).toBeLessThan(first.body.report.checks.length);
      for (const check of first.body.report.checks as { ruleKey: string }[]) {
        expect(check).not.toHaveProperty('rule');
        expect(rules[check.ruleKey]).toBeDefined();
      }
      expect(Object.keys(first.body)).toEqual([
        'number',
        'state',
        'authorId',
        'authorName',
        'createdAt',
        'changeNote',
        'baseRevisionNumber',
        'engineVersion',
        'designId',
        'projectId',
        'document',
        'report',
      ]);
      const unchanged = await http().get(path).set('Cookie', as(engineer)).set('If-None-Match', first.headers.etag!);
      expect(unchanged.status).toBe(304);

      // The summary is read on every request: a state change shows at once beside the kept document and report.
      await RevisionModel.update({ state: 'submitted' }, { where: { designId: design.id, number: 1 } });
      const after = await http().get(path).set('Cookie', as(engineer));
      expect(after.body.state).toBe('submitted');
      expect(after.body.report).toEqual(first.body.report);
    });
  });

  describe('denials', () => {
    let design: DesignDetail;
    beforeAll(async () => {
      design = await createDesign(testApp, project.id, engineer.id);
    });

    it('returns 403 when a reviewer saves a revision', async () => {
      const response = await http()
        .post(revisionsPath(design))
        .set('Cookie', as(reviewer))
        .send({ baseRevisionNumber: 1, document: designExamples.detectorBias, changeNote: 'x' });
      expect(response.status).toBe(403);
    });

    it.each(['', '/1', '/1/export', '/1/netlist'])(
      'returns 401 without a session and 404 to a non-member for revisions%s',
      async (suffix) => {
        expect((await http().get(`${revisionsPath(design)}${suffix}`)).status).toBe(401);
        expect(
          (
            await http()
              .get(`${revisionsPath(design)}${suffix}`)
              .set('Cookie', as(outsider))
          ).status,
        ).toBe(404);
      },
    );

    it('returns 404 for a design of another project reached through a project the user belongs to', async () => {
      const foreign = await createDesign(testApp, otherProject.id, outsider.id);
      const response = await http().get(revisionsPath(foreign, project.id)).set('Cookie', as(engineer));
      expect(response.status).toBe(404);
      const write = await http()
        .post(revisionsPath(foreign, project.id))
        .set('Cookie', as(engineer))
        .send({ baseRevisionNumber: 1, document: designExamples.detectorBias, changeNote: 'x' });
      expect(write.status).toBe(404);
    });

    it.each(['not-a-uuid', '00000000-0000-4000-8000-000000000000'])(
      'returns 404 for design id %s',
      async (designId) => {
        const response = await http()
          .get(revisionsPath({ id: designId }))
          .set('Cookie', as(engineer));
        expect(response.status).toBe(404);
      },
    );

    it.each(['0', 'abc', '99', '1.5'])('returns 404 for revision number %s', async (number) => {
      const response = await http()
        .get(`${revisionsPath(design)}/${number}`)
        .set('Cookie', as(engineer));
      expect(response.status).toBe(404);
      expect(response.body.field).toBe('revisionNumber');
    });
  });

  describe('export and netlist', () => {
    it('exports a revision as a ladderwright-design attachment that imports back', async () => {
      const design = await createDesign(testApp, project.id, engineer.id, { name: 'Detector bias, export check' });
      const response = await http()
        .get(`${revisionsPath(design)}/1/export`)
        .set('Cookie', as(reviewer));
      expect(response.status).toBe(200);
      expect(response.headers['content-type']).toMatch(/^application\/json/);
      expect(response.headers['content-disposition']).toBe(
        'attachment; filename="detector-bias-export-check-r1.ladderwright.json"',
      );
      const file = JSON.parse(response.text);
      expect(file).toMatchObject({
        format: 'ladderwright-design',
        formatVersion: 1,
        engineVersion: design.revisions[0]!.engineVersion,
      });
      expect(file.design.name).toBe('Detector bias, export check');
      const imported = await http()
        .post(`/api/projects/${project.id}/designs/import`)
        .set('Cookie', as(engineer))
        .send(file);
      expect(imported.status).toBe(201);
      expect(imported.body.name).toBe('Detector bias, export check');
    });

    it('serves the SPICE netlist of a revision as a .cir text attachment', async () => {
      const design = await createDesign(testApp, project.id, engineer.id, { name: 'Tripler' });
      const response = await http()
        .get(`${revisionsPath(design)}/1/netlist`)
        .set('Cookie', as(reviewer));
      expect(response.status).toBe(200);
      expect(response.headers['content-type']).toMatch(/^text\/plain/);
      expect(response.headers['content-disposition']).toBe('attachment; filename="tripler-r1.cir"');
      expect(response.text.split('\n')[0]).toContain('Tripler, revision 1');
      expect(response.text).toMatch(/^\.end\s*$/im);
      // A tripler has three capacitors and three diodes.
      expect(response.text.match(/^C\S*\s/gim)).toHaveLength(3);
      expect(response.text.match(/^D\S*\s/gim)).toHaveLength(3);
    });

    it('exports a driver-stage design with the pulse secondary the engine resolves from the driver', async () => {
      const design = await createDesign(testApp, project.id, engineer.id, {
        from: { kind: 'template', templateId: 'surfaceChargeTester' },
      });
      const response = await http()
        .get(`${revisionsPath(design)}/1/netlist`)
        .set('Cookie', as(engineer));
      expect(response.status).toBe(200);
      expect(response.text).toMatch(/PULSE\s*\(/i);
      expect(response.text.match(/^D\S*\s/gim)).toHaveLength(4);
    });
  });
});
