import request from 'supertest';
import type { DesignDetail, GatesClosedBody, SignOff } from '@ladderwright/shared/api';
import { type Design, designExamples } from '@ladderwright/shared/designs';
import { ENGINE_VERSION } from '@ladderwright/shared/multiplier';
import { AuditEntryModel } from '../src/audit/audit-entry.model';
import { DesignModel } from '../src/designs/design.model';
import { RevisionModel } from '../src/revisions/revision.model';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { type MailCatcher, startMailCatcher } from './utils/mail-catcher';
import { SessionCookies } from './utils/sign-in';

/** The detector-bias example with C1 rated far below its working voltage, so its voltage Check fails. */
function failingDocument(): Design {
  const document = structuredClone(designExamples.detectorBias);
  document.multiplier.capacitors = document.multiplier.capacitors.map((capacitor, index) => {
    const { partCode: _partCode, ...rest } = capacitor;
    return index === 0 ? { ...rest, ratedVoltageV: 100 } : rest;
  });
  return document;
}

const REASON = 'C1 is replaced by a 1 kV part on the build; agreed with the lead.';

// Gate rules: shared/src/reviews/sign-off-gates.ts (failing Check, open thread, older engine; override reason of at
// least 20 characters) and issue 15: this product's Sign-off policy, common practice, no source.
describe('Sign-off gates', () => {
  let testApp: TestApp;
  let catcher: MailCatcher;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let reviewer: TestUser;
  let lead: TestUser;
  let project: TestProject;
  const cookies = new SessionCookies();
  const { as } = cookies;
  const revisionPath = (design: { id: string }, number = 1) =>
    `/api/projects/${project.id}/designs/${design.id}/revisions/${number}`;

  const command = (user: TestUser, design: { id: string }, name: string, body: object = {}, number = 1) =>
    http()
      .post(`${revisionPath(design, number)}/${name}`)
      .set('Cookie', as(user))
      .send(body);

  const failingDesign = (): Promise<DesignDetail> =>
    createDesign(testApp, project.id, engineer.id, { from: { kind: 'document', document: failingDocument() } });

  beforeAll(async () => {
    catcher = await startMailCatcher();
    testApp = await createTestApp({
      env: { smtpHost: '127.0.0.1', smtpPort: catcher.port, mailPollMs: 50, mailRetryBaseMs: 50 },
    });
    engineer = await createUser(testApp, { role: 'engineer', displayName: 'Edda Engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer', displayName: 'Rolf Reviewer' });
    lead = await createUser(testApp, { role: 'lead', displayName: 'Lena Lead' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: reviewer.id, role: 'reviewer' },
      { userId: lead.id, role: 'lead' },
    ]);
    await cookies.signIn(testApp, [engineer, reviewer, lead]);
  });
  afterAll(async () => {
    await testApp.close();
    await catcher.close();
  });

  it('shows the closed gates in the Sign-off before any click', async () => {
    const design = await failingDesign();
    const response = await http()
      .get(`${revisionPath(design)}/sign-off`)
      .set('Cookie', as(engineer));
    expect(response.status).toBe(200);
    const signOff = response.body as SignOff;
    expect(signOff.gateReasons.map((reason) => reason.code)).toEqual(['failing_checks']);
    expect(signOff.gateReasons[0]?.message).toMatch(/C1/);
  });

  it('refuses submit of a revision with a failing Check with 409 naming the Check, writing nothing', async () => {
    const design = await failingDesign();
    const response = await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] });
    expect(response.status).toBe(409);
    const body = response.body as GatesClosedBody;
    expect(body.code).toBe('gates_closed');
    expect(body.reasons.map((reason) => reason.code)).toEqual(['failing_checks']);
    expect(body.message).toMatch(/Cannot submit while: 1 Check fails: /);
    expect((await RevisionModel.findOne({ where: { designId: design.id, number: 1 } }))?.state).toBe('draft');
  });

  it('refuses an override without a reason or with one under 20 characters (400 naming override.reason)', async () => {
    const design = await failingDesign();
    const missing = await command(engineer, design, 'submit', { reviewerIds: [reviewer.id], override: {} });
    expect(missing.status).toBe(400);
    expect(missing.body.field).toBe('override.reason');
    const short = await command(engineer, design, 'submit', {
      reviewerIds: [reviewer.id],
      override: { reason: 'it is fine really' },
    });
    expect(short.status).toBe(400);
    expect(short.body).toMatchObject({ field: 'override.reason' });
    expect(short.body.message).toMatch(/at least 20 characters \(it has 17\)/);
  });

  it('submits with an override: recorded in the Sign-off, the audit log and the mail', async () => {
    const design = await failingDesign();
    const response = await command(engineer, design, 'submit', {
      reviewerIds: [reviewer.id],
      override: { reason: REASON },
    });
    expect(response.status).toBe(200);
    const signOff = response.body as SignOff;
    expect(signOff.state).toBe('submitted');
    expect(signOff.overrides).toEqual([
      expect.objectContaining({
        command: 'submit',
        actorId: engineer.id,
        reason: REASON,
        overridden: [expect.objectContaining({ code: 'failing_checks' })],
      }),
    ]);
    const audit = await AuditEntryModel.findOne({
      where: { action: 'revision.gates_overridden', actorId: engineer.id },
      order: [['occurredAt', 'DESC']],
    });
    expect(audit?.detail).toMatchObject({ command: 'submit', reason: REASON, revisionNumber: 1 });
    const [mail] = await catcher.waitFor(
      (candidate) => candidate.subject.includes(design.name) && candidate.subject.includes('Review requested'),
    );
    expect(mail?.body).toContain('OVERRIDE');
    expect(mail?.body.replace(/=\r?\n/g, '')).toContain(REASON);
  });

  it('holds approve and release back too, each needing its own override', async () => {
    const design = await failingDesign();
    await command(engineer, design, 'submit', { reviewerIds: [reviewer.id], override: { reason: REASON } }).expect(200);
    expect((await command(reviewer, design, 'approve')).status).toBe(409);
    await command(reviewer, design, 'approve', { override: { reason: 'Accepted for the pilot build of ten.' } }).expect(
      200,
    );
    expect((await command(lead, design, 'release')).status).toBe(409);
    const released = await command(lead, design, 'release', {
      override: { reason: 'Released for the pilot build only.' },
    });
    expect(released.status).toBe(200);
    expect((released.body as SignOff).overrides.map((override) => override.command)).toEqual([
      'submit',
      'approve',
      'release',
    ]);
  });

  it('refuses while a comment thread is open, and lets it through once the thread is resolved', async () => {
    const design = await createDesign(testApp, project.id, engineer.id);
    const thread = await http()
      .post(`${revisionPath(design)}/comments`)
      .set('Cookie', as(reviewer))
      .send({ body: 'Why 22 nF for C1?' });
    expect(thread.status).toBe(201);
    const refused = await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] });
    expect(refused.status).toBe(409);
    expect((refused.body as GatesClosedBody).reasons).toEqual([
      expect.objectContaining({ code: 'open_threads', threadCount: 1 }),
    ]);
    await http()
      .patch(`${revisionPath(design)}/comments/${thread.body.id as string}`)
      .set('Cookie', as(engineer))
      .send({ isResolved: true })
      .expect(200);
    const submitted = await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] });
    expect(submitted.status).toBe(200);
    expect((submitted.body as SignOff).overrides).toEqual([]);
  });

  it('refuses a revision whose stored results come from another engine version', async () => {
    const design = await createDesign(testApp, project.id, engineer.id);
    const first = await RevisionModel.findOne({ where: { designId: design.id, number: 1 } });
    if (!first) throw new Error('revision 1 missing');
    await RevisionModel.create({
      designId: design.id,
      number: 2,
      document: first.document,
      report: first.report,
      engineVersion: '0.9.0',
      authorId: engineer.id,
      changeNote: 'computed by an older engine',
      baseRevisionNumber: 1,
    });
    await DesignModel.update({ latestRevisionNumber: 2 }, { where: { id: design.id } });
    const refused = await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] }, 2);
    expect(refused.status).toBe(409);
    expect((refused.body as GatesClosedBody).reasons).toEqual([
      expect.objectContaining({ code: 'stale_results', engineVersion: '0.9.0', currentEngineVersion: ENGINE_VERSION }),
    ]);
  });

  it('keeps the author from approving their own revision (409), override or not', async () => {
    const design = await createDesign(testApp, project.id, lead.id);
    await command(lead, design, 'submit', { reviewerIds: [reviewer.id] }).expect(200);
    const own = await command(lead, design, 'approve', { override: { reason: REASON } });
    expect(own.status).toBe(409);
    expect(own.body.message).toMatch(/author cannot approve/);
  });

  it('answers 404 with one message for a malformed and for an unknown revision number', async () => {
    const design = await createDesign(testApp, project.id, engineer.id);
    for (const number of ['x1', '0', '99']) {
      const response = await http()
        .get(`/api/projects/${project.id}/designs/${design.id}/revisions/${number}/sign-off`)
        .set('Cookie', as(engineer));
      expect(response.status).toBe(404);
      expect(response.body).toMatchObject({ field: 'revisionNumber', message: `Revision ${number} not found` });
    }
  });
});
