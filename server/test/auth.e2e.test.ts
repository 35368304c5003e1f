import request from 'supertest';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

// Expected statuses and cookie attributes are this API's contract (issue 2), common practice, no source.
describe('auth', () => {
  let testApp: TestApp;
  let engineer: TestUser;
  const http = () => request(testApp.app.getHttpServer());

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer' });
  });
  afterAll(async () => testApp.close());

  it('signs in with the right password, sets an httpOnly SameSite=Strict session cookie and returns the user', async () => {
    const response = await http()
      .post('/api/auth/sign-in')
      .send({ email: engineer.email, password: engineer.password });
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      user: { id: engineer.id, email: engineer.email, displayName: engineer.displayName, role: 'engineer' },
    });
    const cookie = ([] as string[])
      .concat(response.headers['set-cookie'] ?? [])
      .find((c) => c.startsWith('lw_session='));
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
    expect(cookie).toMatch(/Path=\//);
  });

  it('matches the e-mail without regard to case', async () => {
    const response = await http()
      .post('/api/auth/sign-in')
      .send({ email: engineer.email.toUpperCase(), password: engineer.password });
    expect(response.status).toBe(200);
  });

  it('returns 401 for a wrong password and sets no cookie', async () => {
    const response = await http()
      .post('/api/auth/sign-in')
      .send({ email: engineer.email, password: 'Wrong-password-1' });
    expect(response.status).toBe(401);
    expect(response.body).toMatchObject({ statusCode: 401, code: 'unauthorized' });
    expect(response.headers['set-cookie']).toBeUndefined();
  });

  it('returns the same 401 for an unknown e-mail', async () => {
    const response = await http()
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@northfold.test', password: 'Whatever-12' });
    expect(response.status).toBe(401);
    expect(response.body.message).toBe('E-mail or password is not correct');
  });

  it.each([
    ['email', { password: 'Anything-123' }],
    ['password', { email: 'engineer@northfold.test' }],
  ])('returns 400 naming %s when it is missing', async (field, body) => {
    const response = await http().post('/api/auth/sign-in').send(body);
    expect(response.status).toBe(400);
    expect(response.body).toMatchObject({ statusCode: 400, code: 'invalid_argument', field });
    expect(response.body.message).toContain(field);
  });

  it('returns 400 naming email, with its reason, when it is not a string', async () => {
    const response = await http()
      .post('/api/auth/sign-in')
      .send({ email: { $gt: '' }, password: 'Anything-123' });
    expect(response.status).toBe(400);
    expect(response.body).toMatchObject({ field: 'email', message: 'email must be a string' });
  });

  it('returns 400 naming the first missing field for a JSON array body', async () => {
    const response = await http().post('/api/auth/sign-in').set('Content-Type', 'application/json').send('[]');
    expect(response.status).toBe(400);
    expect(response.body).toMatchObject({ field: 'email', message: 'email is required' });
    expect(response.body.issues).toEqual([
      { path: 'email', message: 'email is required' },
      { path: 'password', message: 'password is required' },
    ]);
  });

  it('returns 400 for a body that is not valid JSON', async () => {
    const response = await http().post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email": ');
    expect(response.status).toBe(400);
    expect(response.body).toMatchObject({ statusCode: 400 });
  });

  it('returns 400 naming an unexpected field', async () => {
    const response = await http()
      .post('/api/auth/sign-in')
      .send({ email: engineer.email, password: engineer.password, role: 'admin' });
    expect(response.status).toBe(400);
    expect(response.body.field).toBe('role');
  });

  it('answers /api/auth/me with the signed-in user', async () => {
    const cookie = await signIn(testApp, engineer.email, engineer.password);
    const response = await http().get('/api/auth/me').set('Cookie', cookie);
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      user: { id: engineer.id, email: engineer.email, displayName: engineer.displayName, role: 'engineer' },
    });
  });

  it('answers /api/auth/me with 401 without a cookie', async () => {
    const response = await http().get('/api/auth/me');
    expect(response.status).toBe(401);
    expect(response.body).toMatchObject({ statusCode: 401, code: 'unauthorized' });
  });

  it('answers /api/auth/me with 401 for a tampered token', async () => {
    const cookie = await signIn(testApp, engineer.email, engineer.password);
    const tampered = `${cookie.slice(0, -4)}AAAA`;
    const response = await http().get('/api/auth/me').set('Cookie', tampered);
    expect(response.status).toBe(401);
  });

  it('signs out by expiring the cookie', async () => {
    const cookie = await signIn(testApp, engineer.email, engineer.password);
    const response = await http().post('/api/auth/sign-out').set('Cookie', cookie);
    expect(response.status).toBe(204);
    const cleared = ([] as string[])
      .concat(response.headers['set-cookie'] ?? [])
      .find((c) => c.startsWith('lw_session='));
    expect(cleared).toMatch(/^lw_session=;/);
    expect(cleared).toMatch(/Expires=Thu, 01 Jan 1970/);
  });
});
