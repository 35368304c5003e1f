import request from 'supertest';
import { SessionCacheService } from '../src/auth/session-cache.service';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

describe('sessions: sign-out revokes the token', () => {
  let testApp: TestApp;
  let engineer: TestUser;

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer' });
  });
  afterAll(async () => {
    await testApp?.close();
  });

  const me = (cookie: string) => request(testApp.app.getHttpServer()).get('/api/auth/me').set('Cookie', cookie);

  it('refuses a token replayed after sign-out with 401, and leaves the other sessions open', async () => {
    const laptop = await signIn(testApp, engineer.email, engineer.password);
    const bench = await signIn(testApp, engineer.email, engineer.password);
    // Both used once, so both sit in the session cache when the sign-out comes.
    expect((await me(laptop)).status).toBe(200);
    expect((await me(bench)).status).toBe(200);

    const out = await request(testApp.app.getHttpServer()).post('/api/auth/sign-out').set('Cookie', laptop);
    expect(out.status).toBe(204);
    const replay = await me(laptop);
    expect(replay.status).toBe(401);
    const change = await request(testApp.app.getHttpServer())
      .post('/api/projects')
      .set('Cookie', laptop)
      .send({ name: 'After sign-out', productLine: 'Ionizers' });
    expect(change.status).toBe(401);
    expect((await me(bench)).status).toBe(200);
  });

  it("ends a deactivated account's sessions at once, even those in the session cache", async () => {
    const admin = await createUser(testApp, { role: 'admin' });
    const reviewer = await createUser(testApp, { role: 'reviewer' });
    const adminCookie = await signIn(testApp, admin.email, admin.password);
    const cookie = await signIn(testApp, reviewer.email, reviewer.password);
    expect((await me(cookie)).status).toBe(200);
    const off = await request(testApp.app.getHttpServer())
      .patch(`/api/users/${reviewer.id}`)
      .set('Cookie', adminCookie)
      .send({ isActive: false });
    expect(off.status).toBe(200);
    expect((await me(cookie)).status).toBe(401);
    // Reactivation does not bring the old session back.
    await request(testApp.app.getHttpServer())
      .patch(`/api/users/${reviewer.id}`)
      .set('Cookie', adminCookie)
      .send({ isActive: true });
    expect((await me(cookie)).status).toBe(401);
  });

  it('signs out without a session, or with a bad token, as a no-op 204', async () => {
    const server = testApp.app.getHttpServer();
    expect((await request(server).post('/api/auth/sign-out')).status).toBe(204);
    expect((await request(server).post('/api/auth/sign-out').set('Cookie', 'lw_session=not-a-token')).status).toBe(204);
  });

  it('serves repeated requests of a session from the cache: a row changed behind its back shows after the cache time', async () => {
    const cookie = await signIn(testApp, engineer.email, engineer.password);
    expect((await me(cookie)).status).toBe(200);
    // Another instance revokes the session in the database; this one trusts its cache until it ages out.
    await testApp.sequelize.query('UPDATE sessions SET revoked_at = now() WHERE user_id = :id', {
      replacements: { id: engineer.id },
    });
    expect((await me(cookie)).status).toBe(200);
    testApp.app.get(SessionCacheService).forgetUser(engineer.id);
    expect((await me(cookie)).status).toBe(401);
  });
});
