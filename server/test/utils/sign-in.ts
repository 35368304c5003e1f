import request from 'supertest';
import type { TestApp } from './create-test-app';

/** Signs in through the API and returns the `lw_session` cookie header to send with later requests. */
export async function signIn(testApp: TestApp, email: string, password: string): Promise<string> {
  const response = await request(testApp.app.getHttpServer()).post('/api/auth/sign-in').send({ email, password });
  if (response.status !== 200) {
    throw new Error(`sign-in as ${email} failed with ${response.status}: ${JSON.stringify(response.body)}`);
  }
  const cookies = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
  const session = cookies.find((cookie) => cookie.startsWith('lw_session='));
  if (!session) throw new Error('sign-in did not set the lw_session cookie');
  return session.split(';')[0] ?? '';
}
