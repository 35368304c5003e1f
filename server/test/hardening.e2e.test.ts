import { JwtService } from '@nestjs/jwt';
import request from 'supertest';
import { SessionsService } from '../src/auth/sessions.service';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

function setCookies(response: request.Response): string[] {
  return ([] as string[]).concat(response.headers['set-cookie'] ?? []);
}

// Header values are helmet 8's defaults plus our CSP choices (OWASP secure headers project: common practice).
describe('hardening: headers, CORS, cookies, session expiry, sign out everywhere', () => {
  let testApp: TestApp;
  let engineer: TestUser;
  let admin: TestUser;

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer' });
    admin = await createUser(testApp, { role: 'admin' });
  });
  afterAll(async () => {
    await testApp?.close();
  });

  it('sends the security header set and no x-powered-by', async () => {
    const response = await request(testApp.app.getHttpServer()).get('/api/health');
    expect(response.headers).toMatchObject({
      'x-content-type-options': 'nosniff',
      'x-frame-options': 'SAMEORIGIN',
      'referrer-policy': 'no-referrer',
      'cross-origin-opener-policy': 'same-origin',
      'cross-origin-resource-policy': 'same-origin',
      'x-dns-prefetch-control': 'off',
      'x-download-options': 'noopen',
      'x-permitted-cross-domain-policies': 'none',
      'origin-agent-cluster': '?1',
      'x-xss-protection': '0',
    });
    const csp = String(response.headers['content-security-policy']);
    for (const directive of [
      "default-src 'self'",
      "script-src 'self'",
      "object-src 'none'",
      "frame-ancestors 'self'",
      "base-uri 'self'",
    ]) {
      expect(csp).toContain(directive);
    }
    expect(response.headers['x-powered-by']).toBeUndefined();
    // Plain http on loopback (cookieSecure false): no HSTS.
    expect(response.headers['strict-transport-security']).toBeUndefined();
  });

  it('answers a cross-origin preflight without any Access-Control-Allow-Origin (CORS closed by default)', async () => {
    const response = await request(testApp.app.getHttpServer())
      .options('/api/projects')
      .set('Origin', 'https://elsewhere.example')
      .set('Access-Control-Request-Method', 'POST')
      .set('Access-Control-Request-Headers', 'content-type');
    expect(response.headers['access-control-allow-origin']).toBeUndefined();
    expect(response.headers['access-control-allow-credentials']).toBeUndefined();
    const simple = await request(testApp.app.getHttpServer())
      .get('/api/health')
      .set('Origin', 'https://elsewhere.example');
    expect(simple.headers['access-control-allow-origin']).toBeUndefined();
  });

  it('sets the session cookie httpOnly, SameSite=Strict, path /, with a max age, and not Secure on loopback http', async () => {
    const response = await request(testApp.app.getHttpServer())
      .post('/api/auth/sign-in')
      .send({ email: engineer.email, password: engineer.password });
    expect(response.status).toBe(200);
    const cookie = setCookies(response).find((line) => line.startsWith('lw_session=')) ?? '';
    expect(cookie).toMatch(/; HttpOnly/);
    expect(cookie).toMatch(/; SameSite=Strict/);
    expect(cookie).toMatch(/; Path=\//);
    expect(cookie).toMatch(/; Max-Age=\d+/);
    expect(cookie).not.toMatch(/; Secure/);
  });

  it('refuses an expired session token with 401', async () => {
    const jti = await testApp.app.get(SessionsService).open(engineer.id, '127.0.0.1');
    const expired = new JwtService({ secret: testApp.env.jwtSecret }).sign(
      { sub: engineer.id, jti, sv: 0, exp: Math.floor(Date.now() / 1000) - 5 },
      { algorithm: 'HS256' },
    );
    const response = await request(testApp.app.getHttpServer())
      .get('/api/auth/me')
      .set('Cookie', `lw_session=${expired}`);
    expect(response.status).toBe(401);
    const valid = new JwtService({ secret: testApp.env.jwtSecret }).sign(
      { sub: engineer.id, jti, sv: 0, exp: Math.floor(Date.now() / 1000) + 60 },
      { algorithm: 'HS256' },
    );
    const fresh = await request(testApp.app.getHttpServer()).get('/api/auth/me').set('Cookie', `lw_session=${valid}`);
    expect(fresh.status).toBe(200);
  });

  it('refuses a token signed with another secret, or without a session version, session id or expiry', async () => {
    const jti = await testApp.app.get(SessionsService).open(engineer.id, '127.0.0.1');
    const exp = Math.floor(Date.now() / 1000) + 600;
    const own = new JwtService({ secret: testApp.env.jwtSecret });
    const forged = new JwtService({ secret: 'another-secret-another-secret-0123456789' }).sign({
      sub: engineer.id,
      jti,
      sv: 0,
      exp,
    });
    const noVersion = own.sign({ sub: engineer.id, jti, exp });
    const noSession = own.sign({ sub: engineer.id, sv: 0, exp });
    const noExpiry = own.sign({ sub: engineer.id, jti, sv: 0 });
    expect(own.decode<Record<string, unknown>>(noExpiry).exp).toBeUndefined();
    for (const token of [forged, noVersion, noSession, noExpiry]) {
      const response = await request(testApp.app.getHttpServer())
        .get('/api/auth/me')
        .set('Cookie', `lw_session=${token}`);
      expect(response.status).toBe(401);
    }
  });

  it('signs out everywhere: both sessions of the account stop working, a new sign-in works', async () => {
    const user = await createUser(testApp, { role: 'reviewer' });
    const laptop = await signIn(testApp, user.email, user.password);
    const bench = await signIn(testApp, user.email, user.password);
    const server = testApp.app.getHttpServer();
    expect((await request(server).get('/api/auth/me').set('Cookie', bench)).status).toBe(200);

    const out = await request(server).post('/api/auth/sign-out-everywhere').set('Cookie', laptop);
    expect(out.status).toBe(204);
    expect(setCookies(out).some((line) => line.startsWith('lw_session=;'))).toBe(true);
    expect((await request(server).get('/api/auth/me').set('Cookie', laptop)).status).toBe(401);
    expect((await request(server).get('/api/auth/me').set('Cookie', bench)).status).toBe(401);

    const again = await signIn(testApp, user.email, user.password);
    expect((await request(server).get('/api/auth/me').set('Cookie', again)).status).toBe(200);
  });

  it('ends the sessions of an account whose password an admin resets', async () => {
    const user = await createUser(testApp, { role: 'engineer' });
    const session = await signIn(testApp, user.email, user.password);
    const adminSession = await signIn(testApp, admin.email, admin.password);
    const server = testApp.app.getHttpServer();
    const reset = await request(server)
      .post(`/api/users/${user.id}/password`)
      .set('Cookie', adminSession)
      .send({ password: 'Fresh-bench-77' });
    expect(reset.status).toBe(204);
    expect((await request(server).get('/api/auth/me').set('Cookie', session)).status).toBe(401);
    expect((await request(server).get('/api/auth/me').set('Cookie', adminSession)).status).toBe(200);
    await signIn(testApp, user.email, 'Fresh-bench-77');
  });

  it('keeps the password policy: a short or digit-less password is a 400 naming password', async () => {
    const adminSession = await signIn(testApp, admin.email, admin.password);
    for (const password of ['short1', 'no-digits-at-all', '1234567890123', `${'a'.repeat(72)}1`]) {
      const response = await request(testApp.app.getHttpServer())
        .post('/api/users')
        .set('Cookie', adminSession)
        .send({ email: `policy-${password.length}@northfold.test`, displayName: 'Policy', role: 'engineer', password });
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('password');
    }
  });
  // Last: a second app rebinds the models to its own connection, which closes with it.
  it('marks the cookie Secure and sends HSTS when COOKIE_SECURE is on', async () => {
    const secureApp = await createTestApp({ env: { cookieSecure: true } });
    try {
      const user = await createUser(secureApp, { role: 'engineer' });
      const response = await request(secureApp.app.getHttpServer())
        .post('/api/auth/sign-in')
        .send({ email: user.email, password: user.password });
      const cookie = setCookies(response).find((line) => line.startsWith('__Host-lw_session=')) ?? '';
      expect(cookie).toMatch(/; Secure/);
      expect(cookie).toMatch(/; HttpOnly/);
      expect(response.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    } finally {
      await secureApp.close();
    }
  });
});
