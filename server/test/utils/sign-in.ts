import { JwtService } from '@nestjs/jwt';
import request from 'supertest';
import { SessionsService } from '../../src/auth/sessions.service';
import { UserModel } from '../../src/users/user.model';
import type { TestApp } from './create-test-app';

/**
 * A session cookie made without the sign-in route (no password hashing, no rate limits): a session row as
 * sign-in opens it and a token at the account's current session version.
 */
export async function mintSessionCookie(testApp: TestApp, userId: string): Promise<string> {
  const row = await UserModel.findByPk(userId, { attributes: ['sessionVersion'] });
  const jti = await testApp.app.get(SessionsService).open(userId, '127.0.0.1');
  const token = await testApp.app.get(JwtService).signAsync({ sub: userId, jti, sv: row?.sessionVersion ?? 0 });
  return `lw_session=${token}`;
}

/** Signs in through the API and returns the session cookie header (`lw_session=…`) to send with later requests. */
export async function signIn(testApp: TestApp, email: string, password: string): Promise<string> {
  const response = await request(testApp.app.getHttpServer()).post('/api/auth/sign-in').send({ email, password });
  if (response.status !== 200) {
    throw new Error(`sign-in as ${email} failed with ${response.status}: ${JSON.stringify(response.body)}`);
  }
  const cookies = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
  const session = cookies.find((cookie) => /^(__Host-)?lw_session=/.test(cookie));
  if (!session) throw new Error('sign-in did not set the session cookie');
  return session.split(';')[0] ?? '';
}

/** Session cookies of a suite's users, keyed by e-mail: sign them in once in `beforeAll`, then send `as(user)`. */
export class SessionCookies {
  private readonly byEmail = new Map<string, string>();

  /** Signs each user in through the API, one after another, and keeps the cookie. */
  async signIn(testApp: TestApp, users: readonly { email: string; password: string }[]): Promise<void> {
    for (const user of users) this.byEmail.set(user.email, await signIn(testApp, user.email, user.password));
  }

  /** The Cookie header for `user`, or '' (no session) when the user was never signed in. */
  readonly as = (user: { email: string }): string => this.byEmail.get(user.email) ?? '';
}
