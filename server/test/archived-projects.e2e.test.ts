import request from 'supertest';
import type { AuditPage, SignOff } from '@ladderwright/shared/api';
import { canInProject } from '@ladderwright/shared/auth';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { type ApiRoute, apiRouteTable } from './utils/route-table';
import { SessionCookies } from './utils/sign-in';

const UNKNOWN_ID = '5d1f7c9e-3a4b-4c8d-9e0f-1a2b3c4d5e6f';

/** The non-GET routes an archived project still answers: they change nothing, or reopen it. */
const ALLOWED_WHEN_ARCHIVED = [
  'POST /api/projects/:projectId/analysis/evaluate',
  'POST /api/projects/:projectId/unarchive',
];

// Rule: an archived project stays readable and takes no change but its unarchiving (this product's policy).
describe('archived projects', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let admin: TestUser;
  let lead: TestUser;
  let engineer: TestUser;
  const cookies = new SessionCookies();
  const { as } = cookies;

  beforeAll(async () => {
    testApp = await createTestApp();
    admin = await createUser(testApp, { role: 'admin' });
    lead = await createUser(testApp, { role: 'lead' });
    engineer = await createUser(testApp, { role: 'engineer' });
    await cookies.signIn(testApp, [admin, lead, engineer]);
  });
  afterAll(async () => {
    await testApp?.close();
  });

  async function archivedProject(): Promise<TestProject> {
    const project = await createProject([
      { userId: lead.id, role: 'lead' },
      { userId: engineer.id, role: 'engineer' },
    ]);
    await http().post(`/api/projects/${project.id}/archive`).set('Cookie', as(lead)).expect(204);
    return project;
  }

  it('refuses every write route with 409 naming the archive, before looking at the body', async () => {
    const project = await archivedProject();
    const routes = apiRouteTable(testApp.app).filter(
      (route: ApiRoute) => route.method !== 'GET' && route.params.includes('projectId'),
    );
    expect(routes.length).toBeGreaterThan(15);
    const key = (route: ApiRoute) => `${route.method} ${route.path}`;
    expect(routes.filter((route) => route.isAllowedWhenArchived).map(key)).toEqual(ALLOWED_WHEN_ARCHIVED);
    const answers: string[] = [];
    for (const route of routes.filter((candidate) => !candidate.isAllowedWhenArchived)) {
      const path = route.path.replace(/:([A-Za-z0-9_]+)/g, (_match, name: string) =>
        name === 'projectId' ? project.id : name.endsWith('Id') ? UNKNOWN_ID : '1',
      );
      const method = route.method.toLowerCase() as 'post' | 'put' | 'patch' | 'delete';
      // A member whose role grants the action, so that only the archive can refuse it.
      const caller = canInProject('lead', route.projectAction ?? 'project.read') ? lead : engineer;
      let call = http()[method](path).set('Cookie', as(caller));
      if (route.method !== 'DELETE') call = call.send({});
      const response = await call;
      const archived = response.status === 409 && /archived/.test(String(response.body.message));
      if (!archived) answers.push(`${key(route)}: ${response.status} ${JSON.stringify(response.body).slice(0, 120)}`);
    }
    expect(answers).toEqual([]);
  });

  it('offers no Sign-off command in an archived project', async () => {
    const project = await createProject([
      { userId: lead.id, role: 'lead' },
      { userId: engineer.id, role: 'engineer' },
    ]);
    const design = await createDesign(testApp, project.id, engineer.id);
    const signOffUrl = `/api/projects/${project.id}/designs/${design.id}/revisions/1/sign-off`;
    const before = await http().get(signOffUrl).set('Cookie', as(engineer));
    expect((before.body as SignOff).availableCommands).toContain('submit');
    await http().post(`/api/projects/${project.id}/archive`).set('Cookie', as(lead)).expect(204);
    const after = await http().get(signOffUrl).set('Cookie', as(engineer));
    expect(after.status).toBe(200);
    expect((after.body as SignOff).availableCommands).toEqual([]);
  });

  it('lets only a lead unarchive, audits it, and takes changes again afterwards', async () => {
    const project = await archivedProject();
    const byEngineer = await http().post(`/api/projects/${project.id}/unarchive`).set('Cookie', as(engineer));
    expect(byEngineer.status).toBe(403);
    const stranger = await createUser(testApp, { role: 'lead' });
    await cookies.signIn(testApp, [stranger]);
    const byStranger = await http().post(`/api/projects/${project.id}/unarchive`).set('Cookie', as(stranger));
    expect(byStranger.status).toBe(404);

    await http().post(`/api/projects/${project.id}/unarchive`).set('Cookie', as(lead)).expect(204);
    const detail = await http().get(`/api/projects/${project.id}`).set('Cookie', as(engineer));
    expect(detail.body.isArchived).toBe(false);
    const create = await http()
      .post(`/api/projects/${project.id}/designs`)
      .set('Cookie', as(engineer))
      .send({ name: 'After the archive', from: { kind: 'blank' } });
    expect(create.status).toBe(201);

    const again = await http().post(`/api/projects/${project.id}/unarchive`).set('Cookie', as(lead));
    expect(again.status).toBe(409);
    expect(again.body.message).toMatch(/not archived/);

    const audit = await http().get('/api/audit').query({ action: 'project.unarchived' }).set('Cookie', as(admin));
    const entries = (audit.body as AuditPage).items.filter((entry) => entry.subjectId === project.id);
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({ actorId: lead.id, subjectType: 'project' });
  });
});
