import request from 'supertest';
import { AuditEntryModel } from '../src/audit/audit-entry.model';
import { createUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';

const WRONG = 'Wrong-password-1';

describe('sign-in: exponential delay per account, aggregated audit', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  const attempt = (email: string, password: string) => http().post('/api/auth/sign-in').send({ email, password });
  /** Lets the account's current delay pass at once (stands in for waiting it out). */
  const waitOut = (email: string) =>
    testApp.sequelize.query('UPDATE sign_in_failures SET next_attempt_at = now() WHERE email = :email', {
      replacements: { email },
    });

  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(async () => testApp.close());

  // Delays: none for 4 failures in a row, then 1, 2, 4 ... s, at most 60 s (common practice, no source).
  it('lets four failures through, then asks for 1 s after the fifth, even with the right password', async () => {
    const user = await createUser(testApp);
    for (let failure = 1; failure <= 5; failure += 1) expect((await attempt(user.email, WRONG)).status).toBe(401);
    const refused = await attempt(user.email, user.password);
    expect(refused.status).toBe(429);
    expect(refused.body).toMatchObject({ statusCode: 429, code: 'too_many_requests' });
    expect(Number(refused.headers['retry-after'])).toBe(1);
    await new Promise((done) => setTimeout(done, 1_100));
    expect((await attempt(user.email, user.password)).status).toBe(200);
  });

  it('never makes the real user wait more than a minute, however long the stranger keeps guessing', async () => {
    const user = await createUser(testApp);
    await attempt(user.email, WRONG);
    await testApp.sequelize.query('UPDATE sign_in_failures SET failures = 40 WHERE email = :email', {
      replacements: { email: user.email },
    });
    await waitOut(user.email);
    expect((await attempt(user.email, WRONG)).status).toBe(401);
    const refused = await attempt(user.email, user.password);
    expect(refused.status).toBe(429);
    const retryAfterS = Number(refused.headers['retry-after']);
    expect(retryAfterS).toBeGreaterThan(55);
    expect(retryAfterS).toBeLessThanOrEqual(60);
    // Attempts inside the delay neither lengthen it nor count as failures.
    for (let i = 0; i < 5; i += 1) await attempt(user.email, WRONG);
    const [row] = await testApp.sequelize.query<{ failures: number }>(
      'SELECT failures FROM sign_in_failures WHERE email = :email',
      { replacements: { email: user.email }, type: 'SELECT' as never },
    );
    expect(row?.failures).toBe(41);
    await waitOut(user.email);
    expect((await attempt(user.email, user.password)).status).toBe(200);
  });

  it('writes one audit entry per doubling of the streak: 5 entries for 20 failures, none while refused', async () => {
    const user = await createUser(testApp);
    for (let failure = 1; failure <= 20; failure += 1) {
      expect((await attempt(user.email, WRONG)).status).toBe(401);
      if (failure < 5) continue;
      expect((await attempt(user.email, WRONG)).status).toBe(429);
      await waitOut(user.email);
    }
    const entries = await AuditEntryModel.findAll({
      where: { action: 'auth.sign_in_failed', actorEmail: user.email },
      order: [['occurredAt', 'ASC']],
    });
    expect(entries.map((entry) => entry.detail['failuresInRow'])).toEqual([1, 2, 4, 8, 16]);
  });

  it("does not hold one account's failures against another", async () => {
    const victim = await createUser(testApp);
    const other = await createUser(testApp);
    for (let failure = 1; failure <= 6; failure += 1) await attempt(victim.email, WRONG);
    expect((await attempt(other.email, other.password)).status).toBe(200);
  });
});

describe('sign-in: per-address and global limits (@nestjs/throttler, counters in PostgreSQL)', () => {
  // Last in the file: the second app of the shared-counter test rebinds the models to its own connection.
  it('refuses the sixth attempt from one address in a minute with 429 and Retry-After, whatever the e-mail', async () => {
    const testApp = await createTestApp({ env: { signInPerAddressPerMin: 5 } });
    try {
      const http = () => request(testApp.app.getHttpServer());
      for (let i = 1; i <= 5; i += 1) {
        const response = await http()
          .post('/api/auth/sign-in')
          .send({ email: `nobody-${i}@northfold.test`, password: WRONG });
        expect(response.status).toBe(401);
      }
      const sixth = await http().post('/api/auth/sign-in').send({ email: 'nobody-6@northfold.test', password: WRONG });
      expect(sixth.status).toBe(429);
      expect(Number(sixth.headers['retry-after'])).toBeGreaterThan(50);
      expect(Number(sixth.headers['retry-after'])).toBeLessThanOrEqual(60);
      // Other routes are not limited.
      expect((await http().get('/api/health')).status).toBe(200);
    } finally {
      await testApp.close();
    }
  });

  it('behind a trusted proxy, counts per visitor from X-Forwarded-For; untrusted, the header changes nothing', async () => {
    const attempt = (app: TestApp, visitor: string, i: number) =>
      request(app.app.getHttpServer())
        .post('/api/auth/sign-in')
        .set('X-Forwarded-For', visitor)
        .send({ email: `visitor-${i}@northfold.test`, password: WRONG });
    const behindProxy = await createTestApp({ env: { signInPerAddressPerMin: 3, trustProxy: ['loopback'] } });
    try {
      for (let i = 1; i <= 3; i += 1) expect((await attempt(behindProxy, '203.0.113.7', i)).status).toBe(401);
      expect((await attempt(behindProxy, '203.0.113.7', 4)).status).toBe(429);
      // Another visitor through the same proxy keeps a budget of its own.
      expect((await attempt(behindProxy, '198.51.100.9', 5)).status).toBe(401);
    } finally {
      await behindProxy.close();
    }
    const direct = await createTestApp({ env: { signInPerAddressPerMin: 3 } });
    try {
      // Off by default: a client cannot pick a fresh address per attempt by sending the header.
      for (let i = 1; i <= 3; i += 1) expect((await attempt(direct, `192.0.2.${i}`, i)).status).toBe(401);
      expect((await attempt(direct, '192.0.2.99', 4)).status).toBe(429);
    } finally {
      await direct.close();
    }
  });

  it('counts every instance against the same limits: 3 + 3 attempts on two apps meet a limit of 5', async () => {
    const first = await createTestApp({ env: { signInPerMin: 5 } });
    const second = await createTestApp({ env: { signInPerMin: 5 }, prepareDatabase: false });
    try {
      const statuses: number[] = [];
      for (const app of [first, second, first, second, first, second]) {
        const response = await request(app.app.getHttpServer())
          .post('/api/auth/sign-in')
          .send({ email: 'stranger@northfold.test', password: WRONG });
        statuses.push(response.status);
      }
      expect(statuses.slice(0, 5).every((status) => status === 401 || status === 429)).toBe(true);
      expect(statuses.filter((status) => status === 429)).toHaveLength(1);
      expect(statuses[5]).toBe(429);
    } finally {
      await second.close();
      await first.close();
    }
  });
});
