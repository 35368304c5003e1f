import request from 'supertest';
import { AuditService } from '../src/audit/audit.service';
import { createProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

interface Entry {
  action: string;
  actorId: string | null;
  actorEmail: string | null;
  subjectId: string | null;
  detail: Record<string, unknown>;
}

describe('audit log', () => {
  let testApp: TestApp;
  let admin: TestUser;
  let lead: TestUser;
  let adminSession: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    admin = await createUser(testApp, { role: 'admin' });
    lead = await createUser(testApp, { role: 'lead' });
    adminSession = await signIn(testApp, admin.email, admin.password);
  });
  afterAll(async () => {
    await testApp?.close();
  });

  async function entries(action?: string): Promise<Entry[]> {
    const response = await request(testApp.app.getHttpServer())
      .get('/api/audit')
      .query(action ? { action } : {})
      .set('Cookie', adminSession);
    expect(response.status).toBe(200);
    return (response.body as { items: Entry[] }).items;
  }

  it('records successful and failed sign-ins with the e-mail tried', async () => {
    const server = testApp.app.getHttpServer();
    await request(server)
      .post('/api/auth/sign-in')
      .send({ email: lead.email, password: 'Wrong-password-1' })
      .expect(401);
    await signIn(testApp, lead.email, lead.password);
    const failed = await entries('auth.sign_in_failed');
    expect(failed[0]).toMatchObject({ actorId: null, actorEmail: lead.email, detail: { reason: 'bad_credentials' } });
    const succeeded = await entries('auth.sign_in');
    expect(succeeded[0]).toMatchObject({ actorId: lead.id, actorEmail: lead.email });
  });

  it('records project role changes with the old and new role and who made them', async () => {
    const member = await createUser(testApp, { role: 'engineer' });
    const project = await createProject([
      { userId: lead.id, role: 'lead' },
      { userId: member.id, role: 'engineer' },
    ]);
    const leadSession = await signIn(testApp, lead.email, lead.password);
    await request(testApp.app.getHttpServer())
      .post(`/api/projects/${project.id}/members`)
      .set('Cookie', leadSession)
      .send({ email: member.email, role: 'reviewer' })
      .expect(201);
    const [change] = await entries('project.member_role_changed');
    expect(change).toMatchObject({
      actorId: lead.id,
      subjectId: project.id,
      detail: { userId: member.id, fromRole: 'engineer', toRole: 'reviewer' },
    });
  });

  it('records entries that other modules write through AuditService (a release)', async () => {
    await testApp.app.get(AuditService).record({
      action: 'revision.released',
      actorId: lead.id,
      actorEmail: lead.email,
      subjectType: 'revision',
      subjectId: 'design-1/rev-3',
      detail: { revisionNumber: 3 },
    });
    const [release] = await entries('revision.released');
    expect(release).toMatchObject({ actorId: lead.id, subjectId: 'design-1/rev-3', detail: { revisionNumber: 3 } });
  });

  it('is for admins only: a lead gets 403, nobody signed in gets 401', async () => {
    const leadSession = await signIn(testApp, lead.email, lead.password);
    const server = testApp.app.getHttpServer();
    expect((await request(server).get('/api/audit').set('Cookie', leadSession)).status).toBe(403);
    expect((await request(server).get('/api/audit')).status).toBe(401);
  });

  it('answers 400 naming the field for an unknown action filter or a limit out of range', async () => {
    const server = testApp.app.getHttpServer();
    const badAction = await request(server)
      .get('/api/audit')
      .query({ action: 'everything' })
      .set('Cookie', adminSession);
    expect(badAction.status).toBe(400);
    expect(badAction.body.field).toBe('action');
    const badLimit = await request(server).get('/api/audit').query({ limit: '100000' }).set('Cookie', adminSession);
    expect(badLimit.status).toBe(400);
    expect(badLimit.body.field).toBe('limit');
  });
});
