import request from 'supertest';
import { UserModel } from '../src/users/user.model';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

// The attack: a page on another port of the same host posts a form to /api/users with the admin's cookie
// (SameSite=Strict does not separate ports: RFC 6265bis "same-site" compares the registrable domain only).
const APP_HOST = 'ladderwright.test:8080';
const OTHER_PORT = 'http://ladderwright.test:9999';

describe('cross-origin changes: Origin/Referer check and JSON-only bodies', () => {
  let testApp: TestApp;
  let admin: TestUser;
  let adminCookie: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    admin = await createUser(testApp, { role: 'admin' });
    adminCookie = await signIn(testApp, admin.email, admin.password);
  });
  afterAll(async () => {
    await testApp?.close();
  });

  const newUser = (tag: string) => ({
    email: `csrf-${tag}@northfold.test`,
    displayName: `Csrf ${tag}`,
    role: 'admin',
    password: 'Planted-admin-77',
  });
  const exists = async (tag: string) => (await UserModel.count({ where: { email: `csrf-${tag}@northfold.test` } })) > 0;

  it('refuses a form-encoded POST with 415 and creates nothing, even from the same origin', async () => {
    const form = new URLSearchParams(newUser('form')).toString();
    const response = await request(testApp.app.getHttpServer())
      .post('/api/users')
      .set('Cookie', adminCookie)
      .set('Content-Type', 'application/x-www-form-urlencoded')
      .send(form);
    expect(response.status).toBe(415);
    expect(response.body.code).toBe('unsupported_media_type');
    expect(await exists('form')).toBe(false);
  });

  it('refuses text/plain and multipart bodies on a JSON route with 415', async () => {
    const plain = await request(testApp.app.getHttpServer())
      .post('/api/users')
      .set('Cookie', adminCookie)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify(newUser('plain')));
    expect(plain.status).toBe(415);
    const multipart = await request(testApp.app.getHttpServer())
      .post('/api/users')
      .set('Cookie', adminCookie)
      .field('email', 'csrf-multipart@northfold.test')
      .field('password', 'Planted-admin-77');
    expect(multipart.status).toBe(415);
    expect(multipart.body.message).toMatch(/application\/json/);
    expect(await exists('plain')).toBe(false);
    expect(await exists('multipart')).toBe(false);
  });

  it('refuses a JSON POST whose Origin is another port of the same host with 403 cross_origin', async () => {
    const response = await request(testApp.app.getHttpServer())
      .post('/api/users')
      .set('Host', APP_HOST)
      .set('Origin', OTHER_PORT)
      .set('Cookie', adminCookie)
      .send(newUser('origin'));
    expect(response.status).toBe(403);
    expect(response.body.code).toBe('cross_origin');
    expect(await exists('origin')).toBe(false);
  });

  it('refuses by the Referer when there is no Origin, and refuses Origin "null"', async () => {
    const byReferer = await request(testApp.app.getHttpServer())
      .delete(`/api/projects/00000000-0000-4000-8000-000000000000/members/${admin.id}`)
      .set('Host', APP_HOST)
      .set('Referer', `${OTHER_PORT}/attack.html`)
      .set('Cookie', adminCookie);
    expect(byReferer.status).toBe(403);
    const opaque = await request(testApp.app.getHttpServer())
      .post('/api/auth/sign-out')
      .set('Host', APP_HOST)
      .set('Origin', 'null')
      .set('Cookie', adminCookie);
    expect(opaque.status).toBe(403);
  });

  it("accepts the same change from the app's own origin, and from a program that states no origin", async () => {
    const sameOrigin = await request(testApp.app.getHttpServer())
      .post('/api/users')
      .set('Host', APP_HOST)
      .set('Origin', `http://${APP_HOST}`)
      .set('Cookie', adminCookie)
      .send(newUser('same'));
    expect(sameOrigin.status).toBe(201);
    const program = await request(testApp.app.getHttpServer())
      .post('/api/users')
      .set('Cookie', adminCookie)
      .send(newUser('program'));
    expect(program.status).toBe(201);
  });

  it('lets reads through from any origin (they change nothing and CORS keeps their answers from the page)', async () => {
    const response = await request(testApp.app.getHttpServer())
      .get('/api/auth/me')
      .set('Host', APP_HOST)
      .set('Origin', OTHER_PORT)
      .set('Cookie', adminCookie);
    expect(response.status).toBe(200);
    expect(response.headers['access-control-allow-origin']).toBeUndefined();
  });

  // Last: a second app rebinds the models to its own connection, which closes with it.
  it('over TLS (COOKIE_SECURE) names the cookie __Host-lw_session: Secure, Path=/, no Domain', async () => {
    const secureApp = await createTestApp({ env: { cookieSecure: true, publicUrl: 'https://hv.northfold.test' } });
    try {
      const user = await createUser(secureApp, { role: 'engineer' });
      const response = await request(secureApp.app.getHttpServer())
        .post('/api/auth/sign-in')
        .send({ email: user.email, password: user.password });
      const cookies = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
      const cookie = cookies.find((line) => line.startsWith('__Host-lw_session=')) ?? '';
      expect(cookie).toMatch(/; Secure/);
      expect(cookie).toMatch(/; Path=\//);
      expect(cookie).not.toMatch(/; Domain=/i);
      const session = cookie.split(';')[0] ?? '';
      const me = await request(secureApp.app.getHttpServer()).get('/api/auth/me').set('Cookie', session);
      expect(me.status).toBe(200);
      // The plain name is not read when the prefixed one is in use.
      const plain = session.replace('__Host-', '');
      expect((await request(secureApp.app.getHttpServer()).get('/api/auth/me').set('Cookie', plain)).status).toBe(401);
      // publicUrl is a trusted origin even when the Host header says otherwise (a proxy in front).
      const viaProxy = await request(secureApp.app.getHttpServer())
        .post('/api/auth/sign-out')
        .set('Host', 'internal:8080')
        .set('Origin', 'https://hv.northfold.test')
        .set('Cookie', session);
      expect(viaProxy.status).toBe(204);
    } finally {
      await secureApp.close();
    }
  });
});
