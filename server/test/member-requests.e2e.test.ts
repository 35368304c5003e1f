import request from 'supertest';
import type { AuditPage, Inbox, MemberRequest, ProjectDetail } from '@ladderwright/shared/api';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { type MailCatcher, startMailCatcher } from './utils/mail-catcher';
import { SessionCookies } from './utils/sign-in';

// Rules: a member who is not a lead asks, a lead decides, one pending request per person, the requester is told
// (this product's policy, common practice, no source).
describe('member requests', () => {
  let testApp: TestApp;
  let catcher: MailCatcher;
  const http = () => request(testApp.app.getHttpServer());
  let admin: TestUser;
  let lead: TestUser;
  let engineer: TestUser;
  let reviewer: TestUser;
  let outsider: TestUser;
  const cookies = new SessionCookies();
  const { as } = cookies;

  beforeAll(async () => {
    catcher = await startMailCatcher();
    testApp = await createTestApp({
      env: { smtpHost: '127.0.0.1', smtpPort: catcher.port, mailPollMs: 50, mailRetryBaseMs: 50 },
    });
    admin = await createUser(testApp, { role: 'admin' });
    lead = await createUser(testApp, { role: 'lead' });
    engineer = await createUser(testApp, { role: 'engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer' });
    outsider = await createUser(testApp, { role: 'engineer' });
    await cookies.signIn(testApp, [admin, lead, engineer, reviewer, outsider]);
  });
  afterAll(async () => {
    await testApp?.close();
    await catcher?.close();
  });

  async function teamProject(): Promise<TestProject> {
    return createProject([
      { userId: lead.id, role: 'lead' },
      { userId: engineer.id, role: 'engineer' },
      { userId: reviewer.id, role: 'reviewer' },
    ]);
  }

  function ask(project: TestProject, by: TestUser, body: object) {
    return http().post(`/api/projects/${project.id}/member-requests`).set('Cookie', as(by)).send(body);
  }

  it('an engineer asks, the lead sees it in the Inbox and accepts: the person is a member, audited and told', async () => {
    const project = await teamProject();
    const asked = await ask(project, engineer, {
      email: outsider.email.toUpperCase(),
      role: 'reviewer',
      note: 'Checks the creepage on the ionizer bar',
    });
    expect(asked.status).toBe(201);
    const pending = asked.body as MemberRequest;
    expect(pending).toMatchObject({ email: outsider.email, role: 'reviewer', state: 'pending' });

    const inbox = (await http().get('/api/inbox').set('Cookie', as(lead))).body as Inbox;
    expect(inbox.memberRequests).toEqual([
      expect.objectContaining({ projectId: project.id, requestId: pending.id, email: outsider.email }),
    ]);
    expect(inbox.actionCount).toBeGreaterThanOrEqual(1);
    const engineerInbox = (await http().get('/api/inbox').set('Cookie', as(engineer))).body as Inbox;
    expect(engineerInbox.memberRequests).toEqual([]);

    const accepted = await http()
      .post(`/api/projects/${project.id}/member-requests/${pending.id}/accept`)
      .set('Cookie', as(lead));
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ state: 'accepted', decidedAt: expect.any(String) });
    const detail = (await http().get(`/api/projects/${project.id}`).set('Cookie', as(outsider))).body as ProjectDetail;
    expect(detail.myRole).toBe('reviewer');

    const [mail] = await catcher.waitFor((candidate) => candidate.subject.includes('Member request accepted'));
    expect(mail?.recipients).toEqual([engineer.email]);
    const own = (await http().get(`/api/projects/${project.id}/member-requests`).set('Cookie', as(engineer)))
      .body as MemberRequest[];
    expect(own.map((entry) => entry.state)).toEqual(['accepted']);

    const audit = (await http().get('/api/audit').query({ from: '2000-01-01T00:00:00Z' }).set('Cookie', as(admin)))
      .body as AuditPage;
    const actions = audit.items.filter((entry) => entry.subjectId === project.id).map((entry) => entry.action);
    expect(actions).toEqual(
      expect.arrayContaining(['project.member_requested', 'project.member_request_accepted', 'project.member_added']),
    );
  });

  it('declines with a reason the requester reads; a reviewer may ask too', async () => {
    const project = await teamProject();
    const asked = await ask(project, reviewer, { email: 'newcomer@northfold.test', role: 'engineer' });
    expect(asked.status).toBe(201);
    const id = (asked.body as MemberRequest).id;
    const declined = await http()
      .post(`/api/projects/${project.id}/member-requests/${id}/decline`)
      .set('Cookie', as(lead))
      .send({ reason: 'The bench team covers this line' });
    expect(declined.status).toBe(200);
    const own = (await http().get(`/api/projects/${project.id}/member-requests`).set('Cookie', as(reviewer)))
      .body as MemberRequest[];
    expect(own).toEqual([
      expect.objectContaining({ state: 'declined', declineReason: 'The bench team covers this line' }),
    ]);
    const again = await http().post(`/api/projects/${project.id}/member-requests/${id}/accept`).set('Cookie', as(lead));
    expect(again.status).toBe(409);
    expect(again.body.field).toBe('requestId');
  });

  it('answers 409 for a duplicate pending request, a member already, or an address without an account', async () => {
    const project = await teamProject();
    const first = await ask(project, engineer, { email: 'twice@northfold.test', role: 'engineer' });
    expect(first.status).toBe(201);
    const duplicate = await ask(project, reviewer, { email: 'Twice@northfold.test', role: 'reviewer' });
    expect(duplicate.status).toBe(409);
    expect(duplicate.body).toMatchObject({ field: 'email', message: expect.stringMatching(/pending/) });
    const member = await ask(project, engineer, { email: reviewer.email, role: 'engineer' });
    expect(member.status).toBe(409);
    expect(member.body.message).toMatch(/member/);
    const noAccount = await http()
      .post(`/api/projects/${project.id}/member-requests/${(first.body as MemberRequest).id}/accept`)
      .set('Cookie', as(lead));
    expect(noAccount.status).toBe(409);
    expect(noAccount.body.message).toMatch(/No account/);
  });

  it('keeps deciding to leads and requests to members: 403 and 404 as elsewhere, 400 naming the field', async () => {
    const project = await teamProject();
    const asked = await ask(project, engineer, { email: 'someone@northfold.test', role: 'engineer' });
    const id = (asked.body as MemberRequest).id;
    const byEngineer = await http()
      .post(`/api/projects/${project.id}/member-requests/${id}/accept`)
      .set('Cookie', as(engineer));
    expect(byEngineer.status).toBe(403);
    const byLead = await ask(project, lead, { email: 'direct@northfold.test', role: 'engineer' });
    expect(byLead.status).toBe(403);
    const byOutsider = await ask(project, outsider, { email: 'x@northfold.test', role: 'engineer' });
    expect(byOutsider.status).toBe(404);
    expect(byOutsider.body.field).toBe('projectId');
    const listByOutsider = await http().get(`/api/projects/${project.id}/member-requests`).set('Cookie', as(outsider));
    expect(listByOutsider.status).toBe(404);
    const unknown = await http()
      .post(`/api/projects/${project.id}/member-requests/not-an-id/decline`)
      .set('Cookie', as(lead))
      .send({});
    expect(unknown.status).toBe(404);
    expect(unknown.body.field).toBe('requestId');

    const longNote = await ask(project, engineer, {
      email: 'a@northfold.test',
      role: 'engineer',
      note: 'x'.repeat(501),
    });
    expect(longNote.status).toBe(400);
    expect(longNote.body.field).toBe('note');
    const badRole = await ask(project, engineer, { email: 'a@northfold.test', role: 'admin' });
    expect(badRole.status).toBe(400);
    expect(badRole.body.field).toBe('role');
    const badEmail = await ask(project, engineer, { email: 'not an address', role: 'engineer' });
    expect(badEmail.status).toBe(400);
    expect(badEmail.body.field).toBe('email');
    const longReason = await http()
      .post(`/api/projects/${project.id}/member-requests/${id}/decline`)
      .set('Cookie', as(lead))
      .send({ reason: 'y'.repeat(501) });
    expect(longReason.status).toBe(400);
    expect(longReason.body.field).toBe('reason');
  });

  it('mails no outcome to a requester who switched that mail off', async () => {
    const project = await teamProject();
    const settings = await http().get('/api/me/notifications').set('Cookie', as(engineer));
    await http()
      .put('/api/me/notifications')
      .set('Cookie', as(engineer))
      .send({ ...settings.body, 'members.request-decided': false })
      .expect(200);
    const asked = await ask(project, engineer, { email: 'quiet@northfold.test', role: 'engineer' });
    await http()
      .post(`/api/projects/${project.id}/member-requests/${(asked.body as MemberRequest).id}/decline`)
      .set('Cookie', as(lead))
      .send({})
      .expect(200);
    // A mail of another kind queued after the decline arrives; the declined outcome never does.
    const other = await ask(project, reviewer, { email: 'loud@northfold.test', role: 'engineer' });
    await http()
      .post(`/api/projects/${project.id}/member-requests/${(other.body as MemberRequest).id}/decline`)
      .set('Cookie', as(lead))
      .send({})
      .expect(200);
    await catcher.waitFor((mail) => mail.subject.includes('loud@northfold.test'));
    expect(catcher.mails.filter((mail) => mail.subject.includes('quiet@northfold.test'))).toEqual([]);
    await http()
      .put('/api/me/notifications')
      .set('Cookie', as(engineer))
      .send({ ...settings.body })
      .expect(200);
  });
});
