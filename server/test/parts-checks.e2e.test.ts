import request from 'supertest';
import type { DesignReportBody } from '@ladderwright/shared/api';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies } from './utils/sign-in';

// The surface-charge tester references NF-C472-3K for all four capacitors (document rating 3 kV; C1 sees
// about 1.6 kV). On this shelf the code is rated 500 V, so the Checks must fail C1 on capacitor voltage.
const LOW_RATED_CAPACITOR = {
  code: 'NF-C472-3K',
  kind: 'capacitor',
  description: 'HV ceramic 4.7 nF, under-rated on purpose',
  valueSi: '4.7n',
  tolerance: '10%',
  ratedVoltageV: '500 V',
  unitCost: 0.42,
};

const capVoltage = (report: DesignReportBody, index: number) =>
  report.checks.find((check) => check.id === `cap-voltage-c${index}`);

describe('Checks against the Parts shelf', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let lead: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  let emptyShelfProject: TestProject;
  const cookies = new SessionCookies();
  const { as } = cookies;
  const document: Design = designExamples.surfaceChargeTester;

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer' });
    lead = await createUser(testApp, { role: 'lead' });
    outsider = await createUser(testApp, { role: 'engineer' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: lead.id, role: 'lead' },
    ]);
    emptyShelfProject = await createProject([{ userId: engineer.id, role: 'engineer' }]);
    await createProject([{ userId: outsider.id, role: 'engineer' }]);
    await cookies.signIn(testApp, [engineer, lead, outsider]);
    const added = await http()
      .post(`/api/projects/${project.id}/parts`)
      .set('Cookie', as(lead))
      .send(LOW_RATED_CAPACITOR);
    expect(added.status).toBe(201);
  });
  afterAll(async () => testApp.close());

  const createFrom = (projectId: string, name: string) =>
    http()
      .post(`/api/projects/${projectId}/designs`)
      .set('Cookie', as(engineer))
      .send({ name, from: { kind: 'document', document } });

  it('stores a fail verdict on capacitor voltage when the shelf rates the referenced part low', async () => {
    const created = await createFrom(project.id, 'Shelf-rated tester');
    expect(created.status).toBe(201);
    const revision = await http()
      .get(`/api/projects/${project.id}/designs/${created.body.id}/revisions/1`)
      .set('Cookie', as(engineer));
    expect(revision.status).toBe(200);
    const report = revision.body.report as DesignReportBody;
    // Limit is the derated figure: 500 V × 0.8.
    expect(capVoltage(report, 1)).toMatchObject({ verdict: 'fail', limit: 400 });
    // The diode and bleeder codes are not on this shelf: warnings, checked on the document's own ratings.
    expect(report.partIssues).toEqual([
      { path: 'multiplier.diode.partCode', message: 'no part NF-D4K-50M on the Parts shelf' },
      { path: 'outputNetwork.bleeder.partCode', message: 'no part NF-R82M-1K on the Parts shelf' },
    ]);
  });

  it('fills the shelf ratings on a saved revision too', async () => {
    const created = await createFrom(project.id, 'Shelf-rated tester, saved');
    const saved = await http()
      .post(`/api/projects/${project.id}/designs/${created.body.id}/revisions`)
      .set('Cookie', as(engineer))
      .send({ baseRevisionNumber: 1, document: { ...document, name: 'renamed' }, changeNote: 'rename' });
    expect(saved.status).toBe(201);
    expect(capVoltage(saved.body.report as DesignReportBody, 2)?.verdict).toBe('fail');
  });

  it('saves with the unknown codes as warnings when the shelf is empty, checked on the document ratings', async () => {
    const created = await createFrom(emptyShelfProject.id, 'Unshelved tester');
    expect(created.status).toBe(201);
    const revision = await http()
      .get(`/api/projects/${emptyShelfProject.id}/designs/${created.body.id}/revisions/1`)
      .set('Cookie', as(engineer));
    const report = revision.body.report as DesignReportBody;
    expect(capVoltage(report, 1)).toMatchObject({ verdict: 'pass', limit: 3000 * 0.8 });
    expect(report.partIssues).toContainEqual({
      path: 'multiplier.capacitors[2].partCode',
      message: 'no part NF-C472-3K on the Parts shelf',
    });
  });

  describe('POST /api/projects/:projectId/analysis/evaluate', () => {
    const evaluateUrl = (projectId = project.id) => `/api/projects/${projectId}/analysis/evaluate`;

    it('evaluates against the shelf, where the project-free evaluate keeps the document ratings', async () => {
      const shelved = await http().post(evaluateUrl()).set('Cookie', as(engineer)).send({ document });
      expect(shelved.status).toBe(200);
      expect(capVoltage(shelved.body.report, 1)?.verdict).toBe('fail');
      const plain = await http().post('/api/analysis/evaluate').set('Cookie', as(engineer)).send({ document });
      expect(plain.status).toBe(200);
      expect(capVoltage(plain.body.report, 1)?.verdict).toBe('pass');
      expect(plain.body.report.partIssues).toBeUndefined();
    });

    it('returns 404 to a user who is not a member of the project', async () => {
      expect((await http().post(evaluateUrl()).set('Cookie', as(outsider)).send({ document })).status).toBe(404);
    });

    it('returns 401 without a session', async () => {
      expect((await http().post(evaluateUrl()).send({ document })).status).toBe(401);
    });

    it('returns 400 naming the field of a bad document', async () => {
      const bad = structuredClone(document) as unknown as { multiplier: { capacitors: { partCode: unknown }[] } };
      bad.multiplier.capacitors[2]!.partCode = 42;
      const response = await http().post(evaluateUrl()).set('Cookie', as(engineer)).send({ document: bad });
      expect(response.status).toBe(400);
      expect(JSON.stringify(response.body)).toContain('document.multiplier.capacitors[2].partCode');
    });
  });
});
