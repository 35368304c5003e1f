import request from 'supertest';
import type { DesignDetail } from '@ladderwright/shared/api';
import { designExamples } from '@ladderwright/shared/designs';
import { AuditEntryModel } from '../src/audit/audit-entry.model';
import { RevisionTransitionModel } from '../src/reviews/revision-transition.model';
import { RevisionModel } from '../src/revisions/revision.model';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { type MailCatcher, startMailCatcher } from './utils/mail-catcher';
import { SessionCookies } from './utils/sign-in';

// Expected statuses follow shared/src/reviews/revision-states.ts (states, roles, author rules),
// shared/src/auth/permissions.ts and the project guard (non-member 404, lacking role 403, no session 401),
// and issue 6 (409 with the reason for an illegal transition): common practice, no source.
describe('Sign-off', () => {
  let testApp: TestApp;
  let catcher: MailCatcher;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let reviewer: TestUser;
  let otherReviewer: TestUser;
  let lead: TestUser;
  let otherLead: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  const cookies = new SessionCookies();
  const { as } = cookies;
  const revisionPath = (design: { id: string }, number = 1) =>
    `/api/projects/${project.id}/designs/${design.id}/revisions/${number}`;

  async function newDesign(author: TestUser = engineer, name?: string): Promise<DesignDetail> {
    return createDesign(testApp, project.id, author.id, name ? { name } : {});
  }

  async function command(user: TestUser, design: { id: string }, name: string, body: object = {}, number = 1) {
    return http()
      .post(`${revisionPath(design, number)}/${name}`)
      .set('Cookie', as(user))
      .send(body);
  }

  async function submitted(author: TestUser = engineer, reviewers: TestUser[] = [reviewer]): Promise<DesignDetail> {
    const design = await newDesign(author);
    const response = await command(author, design, 'submit', { reviewerIds: reviewers.map((r) => r.id) });
    expect(response.status).toBe(200);
    return design;
  }

  async function approved(): Promise<DesignDetail> {
    const design = await submitted();
    expect((await command(reviewer, design, 'approve')).status).toBe(200);
    return design;
  }

  async function stateOf(design: { id: string }, number = 1): Promise<string | undefined> {
    return (await RevisionModel.findOne({ where: { designId: design.id, number } }))?.state;
  }

  beforeAll(async () => {
    catcher = await startMailCatcher();
    testApp = await createTestApp({
      env: { smtpHost: '127.0.0.1', smtpPort: catcher.port, mailPollMs: 50, mailRetryBaseMs: 50 },
    });
    engineer = await createUser(testApp, { role: 'engineer', displayName: 'Edda Engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer', displayName: 'Rolf Reviewer' });
    otherReviewer = await createUser(testApp, { role: 'reviewer' });
    lead = await createUser(testApp, { role: 'lead', displayName: 'Lena Lead' });
    otherLead = await createUser(testApp, { role: 'lead' });
    outsider = await createUser(testApp, { role: 'reviewer' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: reviewer.id, role: 'reviewer' },
      { userId: otherReviewer.id, role: 'reviewer' },
      { userId: lead.id, role: 'lead' },
      { userId: otherLead.id, role: 'lead' },
    ]);
    await createProject([{ userId: outsider.id, role: 'lead' }]);
    await cookies.signIn(testApp, [engineer, reviewer, otherReviewer, lead, otherLead, outsider]);
  });
  afterAll(async () => {
    await testApp.close();
    await catcher.close();
  });

  describe('submit', () => {
    it('moves a draft to submitted, names the reviewers, audits it and mails the reviewers', async () => {
      const design = await newDesign(engineer, 'Ionizer bar A');
      const response = await command(engineer, design, 'submit', {
        reviewerIds: [reviewer.id, lead.id],
        note: 'Ready for a look',
      });
      expect(response.status).toBe(200);
      expect(response.body.state).toBe('submitted');
      expect(response.body.reviewers.map((r: { userId: string }) => r.userId).sort()).toEqual(
        [lead.id, reviewer.id].sort(),
      );
      expect(response.body.history).toEqual([
        expect.objectContaining({
          command: 'submit',
          fromState: 'draft',
          toState: 'submitted',
          actorId: engineer.id,
          note: 'Ready for a look',
        }),
      ]);
      const [mail] = await catcher.waitFor(
        (m) => m.subject === '[Ladderwright] Review requested: Ionizer bar A, revision 1',
      );
      expect(mail?.recipients.sort()).toEqual([lead.email, reviewer.email].sort());
      expect(mail?.body).toContain('Edda Engineer submitted Ionizer bar A, revision 1');
      expect(mail?.body).toContain('Ready for a look');
    });

    it.each([
      ['a reviewer', () => reviewer, 403],
      ['a lead who is not the author', () => lead, 409],
    ])('refuses %s (%s)', async (_label, who, status) => {
      const design = await newDesign();
      const response = await command(who(), design, 'submit', { reviewerIds: [otherReviewer.id] });
      expect(response.status).toBe(status);
      expect(await stateOf(design)).toBe('draft');
      if (status === 409)
        expect(response.body).toMatchObject({
          code: 'illegal_transition',
          message: "Only the revision's author may submit it.",
        });
    });

    it('refuses a second submit with 409 and the reason', async () => {
      const design = await submitted();
      const response = await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] });
      expect(response.status).toBe(409);
      expect(response.body.message).toBe('A submitted revision cannot be submitted; it must be draft.');
    });

    it.each([
      ['no reviewerIds', {}, 'reviewerIds'],
      ['an empty list', { reviewerIds: [] }, 'reviewerIds'],
      ['a malformed id', { reviewerIds: ['nope'] }, 'reviewerIds'],
      ['an engineer as reviewer', { reviewerIds: ['ENGINEER'] }, 'reviewerIds[0]'],
      ['a non-member', { reviewerIds: ['OUTSIDER'] }, 'reviewerIds[0]'],
    ])('answers 400 naming the field for %s', async (_label, body, field) => {
      const design = await newDesign();
      const ids = (body as { reviewerIds?: string[] }).reviewerIds?.map((id) =>
        id === 'ENGINEER' ? engineer.id : id === 'OUTSIDER' ? outsider.id : id,
      );
      const response = await command(engineer, design, 'submit', ids ? { reviewerIds: ids } : {});
      expect(response.status).toBe(400);
      expect(response.body.field).toBe(field);
      expect(await stateOf(design)).toBe('draft');
    });

    it('answers 400 when a lead author names themself as reviewer', async () => {
      const design = await newDesign(lead);
      const response = await command(lead, design, 'submit', { reviewerIds: [otherLead.id, lead.id] });
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ field: 'reviewerIds[1]' });
      expect(response.body.message).toContain('author');
    });

    it('answers 404 to a non-member and 401 without a session', async () => {
      const design = await newDesign();
      expect((await command(outsider, design, 'submit', { reviewerIds: [reviewer.id] })).status).toBe(404);
      const anonymous = await http()
        .post(`${revisionPath(design)}/submit`)
        .send({ reviewerIds: [reviewer.id] });
      expect(anonymous.status).toBe(401);
    });

    it('answers 404 naming the field for a revision that does not exist', async () => {
      const design = await newDesign();
      const response = await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] }, 7);
      expect(response.status).toBe(404);
      expect(response.body.field).toBe('revisionNumber');
    });
  });

  describe('withdraw', () => {
    it('lets the author take a submitted revision back to draft', async () => {
      const design = await submitted();
      const response = await command(engineer, design, 'withdraw', { note: 'One more change' });
      expect(response.status).toBe(200);
      expect(response.body.state).toBe('draft');
    });

    it('refuses a reviewer with 403 and a draft with 409', async () => {
      const design = await submitted();
      expect((await command(reviewer, design, 'withdraw')).status).toBe(403);
      const draft = await newDesign();
      expect((await command(engineer, draft, 'withdraw')).status).toBe(409);
    });
  });

  describe('approve and return', () => {
    it('approves for an assigned reviewer, records the approval and mails the author and the leads', async () => {
      const design = await newDesign(engineer, 'Ionizer bar B');
      await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] });
      const response = await command(reviewer, design, 'approve', { note: 'Margins fine' });
      expect(response.status).toBe(200);
      expect(response.body.state).toBe('approved');
      expect(response.body.approvals).toEqual([
        expect.objectContaining({ userId: reviewer.id, displayName: 'Rolf Reviewer', note: 'Margins fine' }),
      ]);
      const [mail] = await catcher.waitFor((m) => m.subject === '[Ladderwright] Approved: Ionizer bar B, revision 1');
      expect(mail?.recipients.sort()).toEqual([engineer.email, lead.email, otherLead.email].sort());
    });

    it('never lets the author approve their own revision (409), even as a lead', async () => {
      const design = await submitted(lead, [otherLead]);
      const response = await command(lead, design, 'approve');
      expect(response.status).toBe(409);
      expect(response.body.message).toBe('The author cannot approve their own revision.');
      expect(await stateOf(design)).toBe('submitted');
    });

    it('refuses an engineer (403) and a reviewer it was not submitted to (403); a lead may decide any', async () => {
      const design = await submitted();
      expect((await command(engineer, design, 'approve')).status).toBe(403);
      expect((await command(otherReviewer, design, 'approve')).status).toBe(403);
      expect((await command(otherLead, design, 'approve')).status).toBe(200);
    });

    it('returns with a note, mails the author the note and makes the revision final', async () => {
      const design = await newDesign(engineer, 'Ionizer bar C');
      await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] });
      const response = await command(reviewer, design, 'return', { note: 'C1 at 92 % of rating' });
      expect(response.status).toBe(200);
      expect(response.body.state).toBe('returned');
      const [mail] = await catcher.waitFor(
        (m) => m.subject === '[Ladderwright] Returned for changes: Ionizer bar C, revision 1',
      );
      expect(mail?.recipients).toEqual([engineer.email]);
      expect(mail?.body).toContain('C1 at 92 % of rating');
      expect((await command(reviewer, design, 'approve')).status).toBe(409);
      expect((await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] })).status).toBe(409);
    });

    it.each([
      ['missing', {}],
      ['blank', { note: '   ' }],
      ['not text', { note: 5 }],
    ])('answers 400 naming note when the return note is %s', async (_label, body) => {
      const design = await submitted();
      const response = await command(reviewer, design, 'return', body);
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('note');
      expect(await stateOf(design)).toBe('submitted');
    });

    it('refuses to approve a draft with 409', async () => {
      const design = await newDesign();
      expect((await command(reviewer, design, 'approve')).status).toBe(409);
    });
  });

  describe('release', () => {
    it('releases an approved revision and supersedes the previously released one, with audit entries', async () => {
      const design = await approved();
      expect((await command(lead, design, 'release')).status).toBe(200);
      const document = structuredClone(designExamples.detectorBias);
      const saved = await http()
        .post(`/api/projects/${project.id}/designs/${design.id}/revisions`)
        .set('Cookie', as(engineer))
        .send({ baseRevisionNumber: 1, document, changeNote: 'second' });
      expect(saved.status).toBe(201);
      await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] }, 2);
      await command(reviewer, design, 'approve', {}, 2);
      const response = await command(lead, design, 'release', { note: 'To the supplier' }, 2);
      expect(response.status).toBe(200);
      expect(response.body.state).toBe('released');
      expect(await stateOf(design, 1)).toBe('superseded');
      const revision1 = await RevisionModel.findOne({ where: { designId: design.id, number: 1 } });
      const audit = await RevisionTransitionModel.findAll({
        where: { revisionId: revision1?.id },
        order: [['createdAt', 'ASC']],
      });
      expect(audit.map((entry) => `${entry.command}:${entry.fromState}->${entry.toState}`)).toEqual([
        'submit:draft->submitted',
        'approve:submitted->approved',
        'release:approved->released',
        'supersede:released->superseded',
      ]);
      expect(audit[3]?.note).toBe('Superseded by revision 2');
      const revision2 = await RevisionModel.findOne({ where: { designId: design.id, number: 2 } });
      const releases = await AuditEntryModel.findAll({
        where: { action: 'revision.released', subjectId: revision2?.id },
      });
      expect(releases).toHaveLength(1);
      expect(releases[0]?.actorId).toBe(lead.id);
      expect(releases[0]?.detail).toMatchObject({ revisionNumber: 2, superseded: 1 });
    });

    it('refuses a reviewer (403), and a lead on a submitted revision (409)', async () => {
      const design = await approved();
      expect((await command(reviewer, design, 'release')).status).toBe(403);
      expect((await command(engineer, design, 'release')).status).toBe(403);
      const pending = await submitted();
      const response = await command(lead, pending, 'release');
      expect(response.status).toBe(409);
      expect(response.body.message).toBe('A submitted revision cannot be released; it must be approved.');
    });

    it('shows each caller only the commands open to them', async () => {
      const design = await approved();
      const forLead = await http()
        .get(`${revisionPath(design)}/sign-off`)
        .set('Cookie', as(lead));
      expect(forLead.body.availableCommands).toEqual(['release']);
      const forEngineer = await http()
        .get(`${revisionPath(design)}/sign-off`)
        .set('Cookie', as(engineer));
      expect(forEngineer.body.availableCommands).toEqual([]);
      const pending = await submitted();
      const forReviewer = await http()
        .get(`${revisionPath(pending)}/sign-off`)
        .set('Cookie', as(reviewer));
      expect(forReviewer.body.availableCommands).toEqual(['return', 'approve']);
      const forOther = await http()
        .get(`${revisionPath(pending)}/sign-off`)
        .set('Cookie', as(otherReviewer));
      expect(forOther.body.availableCommands).toEqual([]);
      const forAuthor = await http()
        .get(`${revisionPath(pending)}/sign-off`)
        .set('Cookie', as(engineer));
      expect(forAuthor.body.availableCommands).toEqual(['withdraw']);
      expect(forAuthor.body.candidateReviewers.map((p: { userId: string }) => p.userId).sort()).toEqual(
        [reviewer.id, otherReviewer.id, lead.id, otherLead.id].sort(),
      );
    });
  });

  describe('comments', () => {
    it('threads an anchored comment and its reply, mails the author, and resolves the thread', async () => {
      const design = await newDesign(engineer, 'Tube bias D');
      await command(engineer, design, 'submit', { reviewerIds: [reviewer.id] });
      const base = `${revisionPath(design)}/comments`;
      const first = await http()
        .post(base)
        .set('Cookie', as(reviewer))
        .send({ body: 'Why 22 nF here?', anchor: { kind: 'input', path: 'multiplier.capacitors[0].valueF' } });
      expect(first.status).toBe(201);
      const [mail] = await catcher.waitFor((m) => m.subject === '[Ladderwright] Comment: Tube bias D, revision 1');
      expect(mail?.recipients).toEqual([engineer.email]);
      expect(mail?.body).toContain('input multiplier.capacitors[0].valueF');

      const reply = await http()
        .post(base)
        .set('Cookie', as(engineer))
        .send({ body: 'Ripple target.', parentId: first.body.id });
      expect(reply.status).toBe(201);
      await catcher.waitFor(
        (m) => m.subject === '[Ladderwright] Reply: Tube bias D, revision 1' && m.recipients.includes(reviewer.email),
      );
      const resultThread = await http()
        .post(base)
        .set('Cookie', as(lead))
        .send({ body: 'Ripple looks high', anchor: { kind: 'result', path: 'ripplePeakToPeakV' } });
      expect(resultThread.status).toBe(201);

      const resolved = await http()
        .patch(`${base}/${first.body.id}`)
        .set('Cookie', as(reviewer))
        .send({ isResolved: true });
      expect(resolved.status).toBe(200);
      expect(resolved.body).toMatchObject({ isResolved: true, resolvedByName: 'Rolf Reviewer' });

      const list = await http().get(base).set('Cookie', as(engineer));
      expect(list.status).toBe(200);
      expect(list.body).toHaveLength(2);
      expect(list.body[0]).toMatchObject({
        body: 'Why 22 nF here?',
        anchor: { kind: 'input', path: 'multiplier.capacitors[0].valueF' },
        isResolved: true,
        replies: [
          expect.objectContaining({ body: 'Ripple target.', authorName: 'Edda Engineer', parentId: first.body.id }),
        ],
      });
      expect(list.body[1]).toMatchObject({ anchor: { kind: 'result', path: 'ripplePeakToPeakV' }, isResolved: false });
    });

    it.each([
      ['an empty body', { body: '' }, 'body'],
      [
        'an unknown input path',
        { body: 'x', anchor: { kind: 'input', path: 'multiplier.capacitors[99].valueF' } },
        'anchor.path',
      ],
      ['an unknown result key', { body: 'x', anchor: { kind: 'result', path: 'noSuchFigure' } }, 'anchor.path'],
      ['a bad anchor kind', { body: 'x', anchor: { kind: 'margin', path: 'name' } }, 'anchor.kind'],
      ['a parent on no comment', { body: 'x', parentId: '6f1c2a4e-0000-4000-8000-000000000000' }, 'parentId'],
    ])('answers 400 naming the field for %s', async (_label, body, field) => {
      const design = await newDesign();
      const response = await http()
        .post(`${revisionPath(design)}/comments`)
        .set('Cookie', as(reviewer))
        .send(body);
      expect(response.status).toBe(400);
      expect(response.body.field).toBe(field);
    });

    it('refuses to resolve a reply (400) and answers 404 to a non-member', async () => {
      const design = await newDesign();
      const base = `${revisionPath(design)}/comments`;
      const first = await http().post(base).set('Cookie', as(reviewer)).send({ body: 'Question' });
      const reply = await http()
        .post(base)
        .set('Cookie', as(engineer))
        .send({ body: 'Answer', parentId: first.body.id });
      const response = await http()
        .patch(`${base}/${reply.body.id}`)
        .set('Cookie', as(reviewer))
        .send({ isResolved: true });
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('commentId');
      expect((await http().get(base).set('Cookie', as(outsider))).status).toBe(404);
      expect((await http().post(base).set('Cookie', as(outsider)).send({ body: 'x' })).status).toBe(404);
    });
  });

  describe('inbox', () => {
    it('lists what waits for a reviewer and what an engineer submitted, each with its state', async () => {
      const design = await newDesign(engineer, 'Precipitator cell E');
      await command(engineer, design, 'submit', { reviewerIds: [otherReviewer.id] });
      const forReviewer = await http().get('/api/inbox').set('Cookie', as(otherReviewer));
      expect(forReviewer.status).toBe(200);
      expect(forReviewer.body.waitingForMe).toEqual([
        expect.objectContaining({
          designId: design.id,
          designName: 'Precipitator cell E',
          revisionNumber: 1,
          state: 'submitted',
          authorName: 'Edda Engineer',
        }),
      ]);
      const forEngineer = await http().get('/api/inbox').set('Cookie', as(engineer));
      expect(forEngineer.body.submittedByMe).toContainEqual(
        expect.objectContaining({
          designId: design.id,
          state: 'submitted',
          reviewerNames: [otherReviewer.displayName],
        }),
      );
      expect(forEngineer.body.waitingForMe).toEqual([]);
      expect((await http().get('/api/inbox')).status).toBe(401);
    });
  });
});
