import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

// Password policy from issue 2 (>= 10 characters, a letter and a digit): common practice, no source.
describe('users (admin)', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let admin: TestUser;
  let lead: TestUser;
  let adminCookie: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    admin = await createUser(testApp, { role: 'admin' });
    lead = await createUser(testApp, { role: 'lead' });
    adminCookie = await signIn(testApp, admin.email, admin.password);
  });
  afterAll(async () => testApp.close());

  it('lists the accounts to an admin', async () => {
    const response = await http().get('/api/users').set('Cookie', adminCookie);
    expect(response.status).toBe(200);
    expect(response.body.items.map((user: { email: string }) => user.email)).toEqual([admin.email, lead.email].sort());
    expect(response.body).toMatchObject({ total: 2, page: 1, pageSize: 25 });
    expect(response.body.items[0]).not.toHaveProperty('passwordHash');
  });

  it('refuses a non-admin with 403 and no session with 401', async () => {
    const leadCookie = await signIn(testApp, lead.email, lead.password);
    expect((await http().get('/api/users').set('Cookie', leadCookie)).status).toBe(403);
    expect((await http().get('/api/users')).status).toBe(401);
  });

  it('creates an account that can then sign in', async () => {
    const response = await http().post('/api/users').set('Cookie', adminCookie).send({
      email: 'New.Reviewer@northfold.test',
      displayName: 'New Reviewer',
      role: 'reviewer',
      password: 'Ripple-check-9',
    });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      email: 'new.reviewer@northfold.test',
      displayName: 'New Reviewer',
      role: 'reviewer',
    });
    expect(await signIn(testApp, 'new.reviewer@northfold.test', 'Ripple-check-9')).toMatch(/^lw_session=/);
  });

  it('returns 400 naming email for an address already in use', async () => {
    const response = await http()
      .post('/api/users')
      .set('Cookie', adminCookie)
      .send({ email: lead.email, displayName: 'Twin', role: 'engineer', password: 'Ripple-check-9' });
    expect(response.status).toBe(400);
    expect(response.body.field).toBe('email');
  });

  it.each([
    ['shorter than 10 characters', 'Short-1', 'at least 10 characters'],
    ['without a digit', 'No-digits-here', 'digit'],
    ['without a letter', '1234567890-', 'letter'],
  ])('returns 400 naming password for a password %s', async (_case, password, reason) => {
    const response = await http()
      .post('/api/users')
      .set('Cookie', adminCookie)
      .send({ email: 'weak@northfold.test', displayName: 'Weak', role: 'engineer', password });
    expect(response.status).toBe(400);
    expect(response.body).toMatchObject({ code: 'invalid_argument', field: 'password' });
    expect(response.body.message).toContain(reason);
  });

  it('returns 400 naming role for an unknown account role', async () => {
    const response = await http()
      .post('/api/users')
      .set('Cookie', adminCookie)
      .send({ email: 'odd@northfold.test', displayName: 'Odd', role: 'owner', password: 'Ripple-check-9' });
    expect(response.status).toBe(400);
    expect(response.body.field).toBe('role');
  });

  it('resets a password: the old one stops working, the new one works', async () => {
    const user = await createUser(testApp, { role: 'engineer' });
    const response = await http()
      .post(`/api/users/${user.id}/password`)
      .set('Cookie', adminCookie)
      .send({ password: 'Fresh-start-2024' });
    expect(response.status).toBe(204);
    const oldTry = await http().post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    expect(oldTry.status).toBe(401);
    expect(await signIn(testApp, user.email, 'Fresh-start-2024')).toMatch(/^lw_session=/);
  });

  it('returns 400 naming password when the reset password breaks the policy', async () => {
    const response = await http()
      .post(`/api/users/${lead.id}/password`)
      .set('Cookie', adminCookie)
      .send({ password: 'short' });
    expect(response.status).toBe(400);
    expect(response.body.field).toBe('password');
  });

  it('returns 404 when resetting the password of an account that does not exist', async () => {
    const response = await http()
      .post(`/api/users/${randomUUID()}/password`)
      .set('Cookie', adminCookie)
      .send({ password: 'Fresh-start-2024' });
    expect(response.status).toBe(404);
  });

  it('refuses a password reset by a non-admin with 403', async () => {
    const leadCookie = await signIn(testApp, lead.email, lead.password);
    const response = await http()
      .post(`/api/users/${admin.id}/password`)
      .set('Cookie', leadCookie)
      .send({ password: 'Takeover-2024' });
    expect(response.status).toBe(403);
  });
});
