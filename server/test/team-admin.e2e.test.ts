import request from 'supertest';
import type { AuditPage, Inbox, PasswordResetLink, ProjectDetail, UserPage } from '@ladderwright/shared/api';
import { createDesign } from './factories/create-design';
import { createProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { type MailCatcher, startMailCatcher } from './utils/mail-catcher';
import { SessionCookies, signIn } from './utils/sign-in';

const NEW_PASSWORD = 'Northfold-reset-77';

// Rules: issue 15 (deactivation ends sessions, one-time reset links, last lead kept, archived projects read-only,
// notification settings honoured by the mail queue): this product's policy, common practice, no source.
describe('team administration', () => {
  let testApp: TestApp;
  let catcher: MailCatcher;
  const http = () => request(testApp.app.getHttpServer());
  let admin: TestUser;
  let lead: TestUser;
  let engineer: TestUser;
  let reviewer: TestUser;
  const cookies = new SessionCookies();
  const { as } = cookies;

  beforeAll(async () => {
    catcher = await startMailCatcher();
    testApp = await createTestApp({
      env: { smtpHost: '127.0.0.1', smtpPort: catcher.port, mailPollMs: 50, mailRetryBaseMs: 50 },
    });
    admin = await createUser(testApp, { role: 'admin' });
    lead = await createUser(testApp, { role: 'lead', displayName: 'Lena Lead' });
    engineer = await createUser(testApp, { role: 'engineer', displayName: 'Edda Engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer', displayName: 'Rolf Reviewer' });
    await cookies.signIn(testApp, [admin, lead, engineer, reviewer]);
  });
  afterAll(async () => {
    await testApp.close();
    await catcher.close();
  });

  describe('accounts', () => {
    it('searches and pages the accounts', async () => {
      for (let i = 0; i < 3; i += 1) await createUser(testApp, { email: `pager-${i}@northfold.test` });
      const response = await http()
        .get('/api/users')
        .query({ q: 'PAGER', page: 2, pageSize: 2 })
        .set('Cookie', as(admin));
      expect(response.status).toBe(200);
      const page = response.body as UserPage;
      expect(page).toMatchObject({ total: 3, page: 2, pageSize: 2 });
      expect(page.items.map((user) => user.email)).toEqual(['pager-2@northfold.test']);
      const bad = await http().get('/api/users').query({ pageSize: 1000 }).set('Cookie', as(admin));
      expect(bad.status).toBe(400);
      expect(bad.body.field).toBe('pageSize');
    });

    it('deactivates an account: its session ends at once and it cannot sign in; reactivation restores sign-in', async () => {
      const user = await createUser(testApp, { role: 'engineer' });
      const session = await signIn(testApp, user.email, user.password);
      expect((await http().get('/api/auth/me').set('Cookie', session)).status).toBe(200);
      const response = await http().patch(`/api/users/${user.id}`).set('Cookie', as(admin)).send({ isActive: false });
      expect(response.status).toBe(200);
      expect(response.body).toMatchObject({ isActive: false });
      expect((await http().get('/api/auth/me').set('Cookie', session)).status).toBe(401);
      const refused = await http().post('/api/auth/sign-in').send({ email: user.email, password: user.password });
      expect(refused.status).toBe(401);
      await http().patch(`/api/users/${user.id}`).set('Cookie', as(admin)).send({ isActive: true }).expect(200);
      expect(await signIn(testApp, user.email, user.password)).toMatch(/^lw_session=/);
      const audit = await http()
        .get('/api/audit')
        .query({ action: 'user.deactivated', actor: admin.email })
        .set('Cookie', as(admin));
      expect((audit.body as AuditPage).items[0]).toMatchObject({ subjectId: user.id, actorId: admin.id });
    });

    it('changes an account role, and keeps an admin from changing their own', async () => {
      const user = await createUser(testApp, { role: 'engineer' });
      const changed = await http().patch(`/api/users/${user.id}`).set('Cookie', as(admin)).send({ role: 'reviewer' });
      expect(changed.body).toMatchObject({ role: 'reviewer' });
      const own = await http().patch(`/api/users/${admin.id}`).set('Cookie', as(admin)).send({ role: 'engineer' });
      expect(own.status).toBe(409);
      const bad = await http().patch(`/api/users/${user.id}`).set('Cookie', as(admin)).send({ role: 'owner' });
      expect(bad.status).toBe(400);
      expect(bad.body.field).toBe('role');
    });

    it('issues a one-time reset link that works once and ends the old sessions', async () => {
      const user = await createUser(testApp, { role: 'engineer' });
      const oldSession = await signIn(testApp, user.email, user.password);
      const issued = await http()
        .post(`/api/users/${user.id}/password-reset`)
        .set('Cookie', as(admin))
        .send({ delivery: 'show' });
      expect(issued.status).toBe(201);
      const link = issued.body as PasswordResetLink;
      const token = new URL(link.url ?? '').searchParams.get('token') ?? '';
      await http().post('/api/auth/password-reset').send({ token, password: NEW_PASSWORD }).expect(204);
      expect((await http().get('/api/auth/me').set('Cookie', oldSession)).status).toBe(401);
      expect(await signIn(testApp, user.email, NEW_PASSWORD)).toMatch(/^lw_session=/);
      const again = await http().post('/api/auth/password-reset').send({ token, password: 'Another-pass-99' });
      expect(again.status).toBe(400);
      expect(again.body.field).toBe('token');
      const weak = await http().post('/api/auth/password-reset').send({ token, password: 'short' });
      expect(weak.status).toBe(400);
      expect(weak.body.field).toBe('password');
    });

    it('mails the reset link instead of showing it when asked', async () => {
      const user = await createUser(testApp, { role: 'engineer' });
      const issued = await http()
        .post(`/api/users/${user.id}/password-reset`)
        .set('Cookie', as(admin))
        .send({ delivery: 'mail' });
      expect(issued.body).toMatchObject({ url: null, mailedTo: user.email });
      const [mail] = await catcher.waitFor(
        (candidate) => candidate.recipients.includes(user.email) && candidate.subject.includes('Set a new password'),
      );
      expect(mail?.body.replace(/=\r?\n/g, '')).toMatch(
        /reset-password\?token=3D[A-Za-z0-9_-]{43}|token=[A-Za-z0-9_-]{43}/,
      );
    });
  });

  describe('projects', () => {
    it('changes a member role and keeps the last lead', async () => {
      const project = await createProject([
        { userId: lead.id, role: 'lead' },
        { userId: engineer.id, role: 'engineer' },
      ]);
      const path = `/api/projects/${project.id}/members`;
      const changed = await http().patch(`${path}/${engineer.id}`).set('Cookie', as(lead)).send({ role: 'reviewer' });
      expect(changed.body).toMatchObject({ userId: engineer.id, role: 'reviewer' });
      const demote = await http().patch(`${path}/${lead.id}`).set('Cookie', as(lead)).send({ role: 'engineer' });
      expect(demote.status).toBe(409);
      expect(demote.body.message).toMatch(/at least one lead/);
      expect((await http().delete(`${path}/${lead.id}`).set('Cookie', as(lead))).status).toBe(409);
      const unknown = await http().patch(`${path}/${reviewer.id}`).set('Cookie', as(lead)).send({ role: 'reviewer' });
      expect(unknown.status).toBe(404);
    });

    it('saves settings for the lead only and refuses bad values naming the field', async () => {
      const project = await createProject([
        { userId: lead.id, role: 'lead' },
        { userId: engineer.id, role: 'engineer' },
      ]);
      const path = `/api/projects/${project.id}`;
      const body = {
        name: 'Ionizer bar, 2nd generation',
        description: 'Negative 6 kV for cleanroom bars.',
        defaultTargets: { outputV: -6000, rippleMaxV: 30, dischargeRule: '50V-5min' },
        acceptance: { coverage: 0.99, benchAllowanceFraction: 0.02 },
      };
      expect((await http().patch(path).set('Cookie', as(engineer)).send(body)).status).toBe(403);
      const saved = await http().patch(path).set('Cookie', as(lead)).send(body);
      expect(saved.status).toBe(200);
      expect(saved.body as ProjectDetail).toMatchObject({
        name: body.name,
        settings: { defaultTargets: body.defaultTargets, acceptance: body.acceptance },
      });
      const bad = await http()
        .patch(path)
        .set('Cookie', as(lead))
        .send({ acceptance: { coverage: 0.5, benchAllowanceFraction: 0.02 } });
      expect(bad.status).toBe(400);
      expect(bad.body.field).toBe('acceptance.coverage');
    });

    it('starts a blank design from the project default targets', async () => {
      const project = await createProject([{ userId: lead.id, role: 'lead' }]);
      await http()
        .patch(`/api/projects/${project.id}`)
        .set('Cookie', as(lead))
        .send({ defaultTargets: { outputV: -4000, safeVoltageV: 42 } })
        .expect(200);
      const design = await createDesign(testApp, project.id, lead.id, { from: { kind: 'blank' } });
      const revision = await http()
        .get(`/api/projects/${project.id}/designs/${design.id}/revisions/1`)
        .set('Cookie', as(lead));
      expect(revision.body.document.targets).toMatchObject({ outputV: -4000, safeVoltageV: 42 });
    });

    it('archives a project: still listed and readable, changes refused with 409', async () => {
      const project = await createProject([
        { userId: lead.id, role: 'lead' },
        { userId: engineer.id, role: 'engineer' },
      ]);
      await http().post(`/api/projects/${project.id}/archive`).set('Cookie', as(lead)).expect(204);
      const listed = await http().get('/api/projects').set('Cookie', as(engineer));
      expect(listed.body).toEqual(
        expect.arrayContaining([expect.objectContaining({ id: project.id, isArchived: true })]),
      );
      expect((await http().get(`/api/projects/${project.id}`).set('Cookie', as(engineer))).status).toBe(200);
      const create = await http()
        .post(`/api/projects/${project.id}/designs`)
        .set('Cookie', as(engineer))
        .send({ name: 'Late design', from: { kind: 'blank' } });
      expect(create.status).toBe(409);
      expect(create.body.message).toMatch(/archived/);
    });
  });

  describe('audit log', () => {
    it('filters by date and exports the selection as CSV', async () => {
      const future = await http().get('/api/audit').query({ from: '2999-01-01T00:00:00Z' }).set('Cookie', as(admin));
      expect((future.body as AuditPage).total).toBe(0);
      const csv = await http().get('/api/audit/export.csv').query({ action: 'auth.sign_in' }).set('Cookie', as(admin));
      expect(csv.status).toBe(200);
      expect(csv.headers['content-type']).toMatch(/text\/csv/);
      const lines = csv.text.trim().split('\r\n');
      expect(lines[0]).toBe('occurredAt,action,actorEmail,actorId,subjectType,subjectId,detail,clientAddress');
      expect(lines.slice(1).every((line) => line.split(',')[1] === 'auth.sign_in')).toBe(true);
      expect(lines.length).toBeGreaterThan(1);
      const bad = await http().get('/api/audit').query({ from: 'yesterday' }).set('Cookie', as(admin));
      expect(bad.status).toBe(400);
      expect(bad.body.field).toBe('from');
    });
  });

  describe('Inbox and notification settings', () => {
    it('gives each role its list: reviewer the submitted, lead the approved, engineer the returned', async () => {
      const project = await createProject([
        { userId: lead.id, role: 'lead' },
        { userId: engineer.id, role: 'engineer' },
        { userId: reviewer.id, role: 'reviewer' },
      ]);
      const submit = async () => {
        const design = await createDesign(testApp, project.id, engineer.id);
        await http()
          .post(`/api/projects/${project.id}/designs/${design.id}/revisions/1/submit`)
          .set('Cookie', as(engineer))
          .send({ reviewerIds: [reviewer.id] })
          .expect(200);
        return design;
      };
      const waiting = await submit();
      const approved = await submit();
      const returned = await submit();
      const decide = (design: { id: string }, name: string, note = '') =>
        http()
          .post(`/api/projects/${project.id}/designs/${design.id}/revisions/1/${name}`)
          .set('Cookie', as(reviewer))
          .send(note ? { note } : {})
          .expect(200);
      await decide(approved, 'approve');
      await decide(returned, 'return', 'Raise C2 to 1 kV.');
      const inboxOf = async (user: TestUser) => (await http().get('/api/inbox').set('Cookie', as(user))).body as Inbox;
      const forReviewer = await inboxOf(reviewer);
      expect(forReviewer.waitingForMe.map((item) => item.designId)).toContain(waiting.id);
      const forLead = await inboxOf(lead);
      expect(forLead.awaitingRelease.map((item) => item.designId)).toEqual([approved.id]);
      expect(forLead.actionCount).toBe(forLead.awaitingRelease.length + forLead.waitingForMe.length);
      const forEngineer = await inboxOf(engineer);
      expect(forEngineer.returnedToMe.map((item) => item.designId)).toEqual([returned.id]);
    });

    it('leaves out mail a user switched off, and still sends the kinds left on', async () => {
      const project = await createProject([
        { userId: lead.id, role: 'lead' },
        { userId: engineer.id, role: 'engineer' },
        { userId: reviewer.id, role: 'reviewer' },
      ]);
      const settings = await http().get('/api/me/notifications').set('Cookie', as(reviewer));
      expect(settings.body).toMatchObject({ 'sign-off.submit': true });
      await http()
        .put('/api/me/notifications')
        .set('Cookie', as(reviewer))
        .send({ ...settings.body, 'sign-off.submit': false })
        .expect(200);
      const partial = await http().put('/api/me/notifications').set('Cookie', as(reviewer)).send({});
      expect(partial.status).toBe(400);
      const design = await createDesign(testApp, project.id, engineer.id, { name: 'Quiet bar' });
      await http()
        .post(`/api/projects/${project.id}/designs/${design.id}/revisions/1/submit`)
        .set('Cookie', as(engineer))
        .send({ reviewerIds: [reviewer.id, lead.id] })
        .expect(200);
      const [mail] = await catcher.waitFor((candidate) => candidate.subject.includes('Quiet bar'));
      expect(mail?.recipients).toEqual([lead.email]);
      await http()
        .put('/api/me/notifications')
        .set('Cookie', as(reviewer))
        .send({ ...settings.body })
        .expect(200);
    });
  });
});
