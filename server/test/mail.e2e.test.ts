import request from 'supertest';
import { CapturedMailModel } from '../src/mail/captured-mail.model';
import { parseReceivedMail } from '../src/mail/fake-smtp-server';
import { MailQueueModel } from '../src/mail/mail-queue.model';
import { MailService } from '../src/mail/mail.service';
import { createDesign } from './factories/create-design';
import { createProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { freePort, type MailCatcher, startMailCatcher } from './utils/mail-catcher';
import { signIn } from './utils/sign-in';

// Delivery behaviour is this product's contract (issue 6: queue in the transaction, retry with backoff):
// common practice, no source.
describe('mail', () => {
  describe('parsing what the fake SMTP server receives', () => {
    it('decodes an encoded-word subject and a quoted-printable body', () => {
      const raw = [
        'From: ladderwright@northfold.test',
        'Subject: =?UTF-8?Q?[Ladderwright]_Approved:_Ionizer_=E2=88=926_kV?=',
        'Content-Type: text/plain; charset=utf-8',
        'Content-Transfer-Encoding: quoted-printable',
        '',
        'Ripple 12 =C2=B5A=',
        ' ok',
      ].join('\r\n');
      const mail = parseReceivedMail(raw, 'a@northfold.test', ['b@northfold.test']);
      expect(mail.subject).toBe('[Ladderwright] Approved: Ionizer −6 kV');
      expect(mail.body).toBe('Ripple 12 µA ok');
      expect(mail.recipients).toEqual(['b@northfold.test']);
    });
  });

  describe('delivery through the queue', () => {
    let testApp: TestApp;
    let catcher: MailCatcher;

    beforeAll(async () => {
      catcher = await startMailCatcher();
      testApp = await createTestApp({
        env: { smtpHost: '127.0.0.1', smtpPort: catcher.port, mailPollMs: 50, mailRetryBaseMs: 50 },
      });
    });
    afterAll(async () => {
      await testApp.close();
      await catcher.close();
    });

    it('delivers a queued mail once, to its recipients, with its subject, and marks it sent', async () => {
      const mail = testApp.app.get(MailService);
      await testApp.sequelize.transaction((transaction) =>
        mail.enqueue(
          [
            {
              kind: 'test',
              recipients: ['Reviewer@northfold.test', 'reviewer@northfold.test', 'lead@northfold.test'],
              subject: '[Ladderwright] Queue check',
              body: 'One message.',
            },
          ],
          transaction,
        ),
      );
      mail.kick();
      const [received] = await catcher.waitFor((m) => m.subject === '[Ladderwright] Queue check');
      expect(received?.recipients.sort()).toEqual(['lead@northfold.test', 'reviewer@northfold.test']);
      expect(received?.body).toBe('One message.');
      await new Promise((done) => setTimeout(done, 200));
      expect(catcher.mails.filter((m) => m.subject === '[Ladderwright] Queue check')).toHaveLength(1);
      const row = await MailQueueModel.findOne({ where: { subject: '[Ladderwright] Queue check' } });
      expect(row?.status).toBe('sent');
      expect(row?.attempts).toBe(1);
    });

    it('does not queue a mail whose recipient list is empty', async () => {
      const mail = testApp.app.get(MailService);
      await testApp.sequelize.transaction((transaction) =>
        mail.enqueue([{ kind: 'test', recipients: [], subject: 'nobody', body: '' }], transaction),
      );
      expect(await MailQueueModel.count({ where: { subject: 'nobody' } })).toBe(0);
    });
  });

  describe('while SMTP is down', () => {
    let testApp: TestApp;
    let catcher: MailCatcher | null = null;
    let smtpPort: number;

    beforeAll(async () => {
      smtpPort = await freePort();
      testApp = await createTestApp({
        env: { smtpHost: '127.0.0.1', smtpPort, mailPollMs: 50, mailRetryBaseMs: 100 },
      });
    });
    afterAll(async () => {
      await testApp.close();
      await catcher?.close();
    });

    it('completes the transition, keeps the mail queued with its error, and delivers it once SMTP is back', async () => {
      const engineer: TestUser = await createUser(testApp, { role: 'engineer' });
      const reviewer: TestUser = await createUser(testApp, { role: 'reviewer' });
      const project = await createProject([
        { userId: engineer.id, role: 'engineer' },
        { userId: reviewer.id, role: 'reviewer' },
      ]);
      const design = await createDesign(testApp, project.id, engineer.id, { name: 'Detector tube bias, 900 V' });
      const cookie = await signIn(testApp, engineer.email, engineer.password);

      const response = await request(testApp.app.getHttpServer())
        .post(`/api/projects/${project.id}/designs/${design.id}/revisions/1/submit`)
        .set('Cookie', cookie)
        .send({ reviewerIds: [reviewer.id] });
      expect(response.status).toBe(200);
      expect(response.body.state).toBe('submitted');

      const subject = '[Ladderwright] Review requested: Detector tube bias, 900 V, revision 1';
      const deadline = Date.now() + 5_000;
      let row = await MailQueueModel.findOne({ where: { subject } });
      while ((row?.attempts ?? 0) < 1 && Date.now() < deadline) {
        await new Promise((done) => setTimeout(done, 50));
        row = await MailQueueModel.findOne({ where: { subject } });
      }
      expect(row?.status).toBe('pending');
      expect(row?.attempts).toBeGreaterThanOrEqual(1);
      expect(row?.lastError).toMatch(/ECONNREFUSED|connect/i);

      catcher = await startMailCatcher(smtpPort);
      const [received] = await catcher.waitFor((m) => m.subject === subject, 1, 10_000);
      expect(received?.recipients).toEqual([reviewer.email]);
      await new Promise((done) => setTimeout(done, 300));
      expect(catcher.mails.filter((m) => m.subject === subject)).toHaveLength(1);
      expect((await MailQueueModel.findOne({ where: { subject } }))?.status).toBe('sent');
    });
  });

  describe('the in-process fake SMTP server and the Outbox', () => {
    let testApp: TestApp;
    let admin: TestUser;
    let engineer: TestUser;

    beforeAll(async () => {
      const port = await freePort();
      testApp = await createTestApp({
        env: { smtpFake: true, smtpHost: '127.0.0.1', smtpPort: port, mailPollMs: 50, mailRetryBaseMs: 50 },
      });
      admin = await createUser(testApp, { role: 'admin' });
      engineer = await createUser(testApp, { role: 'engineer' });
    });
    afterAll(async () => testApp.close());

    it('stores what it receives and shows it to an admin, newest first', async () => {
      const mail = testApp.app.get(MailService);
      await testApp.sequelize.transaction((transaction) =>
        mail.enqueue(
          [
            {
              kind: 'test',
              recipients: [engineer.email],
              subject: '[Ladderwright] Outbox check',
              body: 'Kept locally.',
            },
          ],
          transaction,
        ),
      );
      mail.kick();
      const deadline = Date.now() + 5_000;
      while ((await CapturedMailModel.count()) === 0 && Date.now() < deadline) {
        await new Promise((done) => setTimeout(done, 50));
      }
      const cookie = await signIn(testApp, admin.email, admin.password);
      const response = await request(testApp.app.getHttpServer()).get('/api/outbox').set('Cookie', cookie);
      expect(response.status).toBe(200);
      expect(response.body.mails).toEqual([
        expect.objectContaining({
          from: 'ladderwright@northfold.test',
          to: [engineer.email],
          subject: '[Ladderwright] Outbox check',
          text: 'Kept locally.',
        }),
      ]);
      expect(response.body.queue).toEqual({ pending: 0, failed: 0 });
    });

    it('refuses the Outbox to a non-admin with 403', async () => {
      const cookie = await signIn(testApp, engineer.email, engineer.password);
      const response = await request(testApp.app.getHttpServer()).get('/api/outbox').set('Cookie', cookie);
      expect(response.status).toBe(403);
    });

    it('refuses the Outbox without a session with 401', async () => {
      expect((await request(testApp.app.getHttpServer()).get('/api/outbox')).status).toBe(401);
    });
  });
});
