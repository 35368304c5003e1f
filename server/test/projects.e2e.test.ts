import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies, signIn } from './utils/sign-in';

// Expected statuses follow the permission table in shared/src/auth/permissions.ts and issue 2
// (non-member 404, member without the role 403): common practice, no source.
describe('projects', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let reviewer: TestUser;
  let lead: TestUser;
  let outsider: TestUser;
  let admin: TestUser;
  let projectA: TestProject;
  let projectB: TestProject;
  const cookies = new SessionCookies();
  const { as } = cookies;

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer' });
    lead = await createUser(testApp, { role: 'lead' });
    outsider = await createUser(testApp, { role: 'engineer' });
    admin = await createUser(testApp, { role: 'admin' });
    projectA = await createProject(
      [
        { userId: engineer.id, role: 'engineer' },
        { userId: reviewer.id, role: 'reviewer' },
        { userId: lead.id, role: 'lead' },
      ],
      { name: 'Cleanroom ionizer bar' },
    );
    projectB = await createProject([{ userId: outsider.id, role: 'lead' }], { name: 'Detector tube bias' });
    await cookies.signIn(testApp, [engineer, reviewer, lead, outsider, admin]);
  });
  afterAll(async () => testApp.close());

  describe('listing', () => {
    it('lists only the projects the user belongs to, with the role and member count', async () => {
      const response = await http().get('/api/projects').set('Cookie', as(engineer));
      expect(response.status).toBe(200);
      expect(response.body).toEqual([
        {
          id: projectA.id,
          name: 'Cleanroom ionizer bar',
          productLine: 'Ionizers',
          description: '',
          myRole: 'engineer',
          memberCount: 3,
          isArchived: false,
        },
      ]);
    });

    it('does not show project B to a member of A only', async () => {
      const response = await http().get('/api/projects').set('Cookie', as(reviewer));
      expect(response.body.map((project: { id: string }) => project.id)).not.toContain(projectB.id);
    });

    it('gives an empty list to an account in no project', async () => {
      const response = await http().get('/api/projects').set('Cookie', as(admin));
      expect(response.status).toBe(200);
      expect(response.body).toEqual([]);
    });

    it('returns 401 without a session', async () => {
      expect((await http().get('/api/projects')).status).toBe(401);
    });
  });

  describe('detail and members', () => {
    it.each(['engineer', 'reviewer', 'lead'] as const)(
      'lets a project %s read the detail with its members',
      async (role) => {
        const user = { engineer, reviewer, lead }[role];
        const response = await http().get(`/api/projects/${projectA.id}`).set('Cookie', as(user));
        expect(response.status).toBe(200);
        expect(response.body.myRole).toBe(role);
        expect(response.body.members.map((m: { email: string; role: string }) => [m.email, m.role]).sort()).toEqual(
          [
            [engineer.email, 'engineer'],
            [lead.email, 'lead'],
            [reviewer.email, 'reviewer'],
          ].sort(),
        );
      },
    );

    it('returns 404 for the detail and the members of a project the user is not in', async () => {
      const detail = await http().get(`/api/projects/${projectB.id}`).set('Cookie', as(engineer));
      expect(detail.status).toBe(404);
      expect(detail.body).toMatchObject({ statusCode: 404, code: 'not_found' });
      const members = await http().get(`/api/projects/${projectB.id}/members`).set('Cookie', as(engineer));
      expect(members.status).toBe(404);
    });

    it('returns the same 404 for a random UUID and for a malformed id', async () => {
      const guessed = await http().get(`/api/projects/${randomUUID()}`).set('Cookie', as(engineer));
      expect(guessed.status).toBe(404);
      const malformed = await http().get('/api/projects/not-a-uuid').set('Cookie', as(engineer));
      expect(malformed.status).toBe(404);
      expect(malformed.body.message).toBe(guessed.body.message);
    });

    it('returns 404 to an admin who is not a member', async () => {
      expect((await http().get(`/api/projects/${projectA.id}`).set('Cookie', as(admin))).status).toBe(404);
    });

    it('returns 401 for the detail without a session', async () => {
      expect((await http().get(`/api/projects/${projectA.id}`)).status).toBe(401);
    });
  });

  describe('managing members', () => {
    it.each(['engineer', 'reviewer'] as const)('refuses a project %s with 403', async (role) => {
      const user = { engineer, reviewer }[role];
      const add = await http()
        .post(`/api/projects/${projectA.id}/members`)
        .set('Cookie', as(user))
        .send({ email: outsider.email, role: 'engineer' });
      expect(add.status).toBe(403);
      expect(add.body).toMatchObject({ statusCode: 403, code: 'forbidden' });
      const remove = await http().delete(`/api/projects/${projectA.id}/members/${engineer.id}`).set('Cookie', as(user));
      expect(remove.status).toBe(403);
    });

    it('returns 404, not 403, to a non-member trying to manage members', async () => {
      const response = await http()
        .post(`/api/projects/${projectA.id}/members`)
        .set('Cookie', as(outsider))
        .send({ email: outsider.email, role: 'lead' });
      expect(response.status).toBe(404);
    });

    it('lets the lead add a member, change the role and remove the member', async () => {
      const newcomer = await createUser(testApp, { role: 'engineer' });
      const added = await http()
        .post(`/api/projects/${projectA.id}/members`)
        .set('Cookie', as(lead))
        .send({ email: newcomer.email, role: 'engineer' });
      expect(added.status).toBe(201);
      expect(added.body).toEqual({
        userId: newcomer.id,
        email: newcomer.email,
        displayName: newcomer.displayName,
        role: 'engineer',
      });

      const changed = await http()
        .post(`/api/projects/${projectA.id}/members`)
        .set('Cookie', as(lead))
        .send({ email: newcomer.email, role: 'reviewer' });
      expect(changed.body.role).toBe('reviewer');

      const newcomerCookie = await signIn(testApp, newcomer.email, newcomer.password);
      expect((await http().get(`/api/projects/${projectA.id}`).set('Cookie', newcomerCookie)).body.myRole).toBe(
        'reviewer',
      );

      const removed = await http()
        .delete(`/api/projects/${projectA.id}/members/${newcomer.id}`)
        .set('Cookie', as(lead));
      expect(removed.status).toBe(204);
      expect((await http().get(`/api/projects/${projectA.id}`).set('Cookie', newcomerCookie)).status).toBe(404);
    });

    it("applies a role change and a removal to the member's next request at once, though standings are cached", async () => {
      const member = await createUser(testApp, { role: 'engineer' });
      const add = (role: 'engineer' | 'reviewer') =>
        http().post(`/api/projects/${projectA.id}/members`).set('Cookie', as(lead)).send({ email: member.email, role });
      expect((await add('engineer')).status).toBe(201);
      const memberCookie = await signIn(testApp, member.email, member.password);
      const read = () => http().get(`/api/projects/${projectA.id}`).set('Cookie', memberCookie);
      expect((await read()).body.myRole).toBe('engineer');
      expect((await read()).body.myRole).toBe('engineer');

      expect((await add('reviewer')).status).toBe(201);
      expect((await read()).body.myRole).toBe('reviewer');

      const removed = await http().delete(`/api/projects/${projectA.id}/members/${member.id}`).set('Cookie', as(lead));
      expect(removed.status).toBe(204);
      expect((await read()).status).toBe(404);
    });

    it('returns 400 naming email for an address with no account', async () => {
      const response = await http()
        .post(`/api/projects/${projectA.id}/members`)
        .set('Cookie', as(lead))
        .send({ email: 'nobody@northfold.test', role: 'engineer' });
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('email');
    });

    it('returns 400 naming role for a role that is not a project role', async () => {
      const response = await http()
        .post(`/api/projects/${projectA.id}/members`)
        .set('Cookie', as(lead))
        .send({ email: outsider.email, role: 'admin' });
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ code: 'invalid_argument', field: 'role' });
    });

    it('refuses to remove or demote the last lead with 409', async () => {
      const remove = await http().delete(`/api/projects/${projectA.id}/members/${lead.id}`).set('Cookie', as(lead));
      expect(remove.status).toBe(409);
      const demote = await http()
        .post(`/api/projects/${projectA.id}/members`)
        .set('Cookie', as(lead))
        .send({ email: lead.email, role: 'engineer' });
      expect(demote.status).toBe(409);
    });

    it('returns 404 when removing someone who is not a member', async () => {
      const response = await http()
        .delete(`/api/projects/${projectA.id}/members/${outsider.id}`)
        .set('Cookie', as(lead));
      expect(response.status).toBe(404);
    });
  });

  describe('creating projects', () => {
    it.each(['lead', 'admin'] as const)(
      'lets an account with role %s create a project and become its lead',
      async (role) => {
        const user = { lead, admin }[role];
        const response = await http()
          .post('/api/projects')
          .set('Cookie', as(user))
          .send({ name: `Range-hood precipitator cell (${role})`, productLine: 'Precipitators' });
        expect(response.status).toBe(201);
        expect(response.body).toMatchObject({ myRole: 'lead', memberCount: 1, description: '' });
        const detail = await http().get(`/api/projects/${response.body.id}`).set('Cookie', as(user));
        expect(detail.body.members).toEqual([
          { userId: user.id, email: user.email, displayName: user.displayName, role: 'lead' },
        ]);
      },
    );

    it('refuses an engineer account with 403', async () => {
      const response = await http()
        .post('/api/projects')
        .set('Cookie', as(engineer))
        .send({ name: 'Handheld surface-charge tester', productLine: 'Field instruments' });
      expect(response.status).toBe(403);
    });

    it('returns 400 naming name when it is empty', async () => {
      const response = await http()
        .post('/api/projects')
        .set('Cookie', as(lead))
        .send({ name: '', productLine: 'Ionizers' });
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('name');
    });
  });
});
