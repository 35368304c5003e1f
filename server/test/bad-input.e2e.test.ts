import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import fc from 'fast-check';
import request from 'supertest';
import { canInApp, type UserRole } from '@ladderwright/shared/auth';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { type ApiRoute, apiRouteTable } from './utils/route-table';
import { mintSessionCookie } from './utils/sign-in';

/** Generated requests over all write routes together (at least 10,000), 0 × 5xx allowed. */
const TOTAL_CASES = 10_000;
/** Requests of one route in flight at once. */
const IN_FLIGHT = 16;
/** Routes that run the engine or write a design get fewer cases, so the run stays short; the rest share the remainder. */
const COSTLY_ROUTE = /\/(analysis\/evaluate|designs(\/import)?|revisions|bench-runs|simulations|simulation-batches)$/;
const CASES_PER_COSTLY_ROUTE = 40;
const UNKNOWN_ID = '5d1f7c9e-3a4b-4c8d-9e0f-1a2b3c4d5e6f';
/** Routes that would end the caller's session mid-run; their body is ignored anyway. */
// Body-less routes whose success ends the session or closes the project to every write route after it.
const SKIPPED = new Set([
  'POST /api/auth/sign-out-everywhere',
  'POST /api/auth/sign-out',
  'POST /api/projects/:projectId/archive',
]);

const MARKUP = [
  '<img src=x onerror=alert(1)>',
  '<script>alert(1)</script>',
  '"><svg onload=alert(1)>',
  "'; DROP TABLE users; --",
];
const nastyScalar = fc.oneof(
  fc.constantFrom(...MARKUP),
  fc.constantFrom(null, true, false, 0, -1, 1e308, -1e308, Number.MAX_SAFE_INTEGER, 2 ** 53 + 1, 1e-320),
  fc.constantFrom('', ' ', '\u0000', '💥'.repeat(50), 'x'.repeat(5000), '1e999', 'NaN', '-0', '12 kV'),
  fc.constantFrom('a\ud800b', '\udc00', 'x\u0000y', '__proto__', 'constructor', 1e20, -1e20),
  fc.string({ maxLength: 40 }),
  fc.double(),
  fc.integer(),
);
/** An object nested `depth` deep, as hostile clients send to overflow a recursive walk. */
function nested(depth: number): unknown {
  let value: unknown = 1;
  for (let i = 0; i < depth; i += 1) value = { a: value };
  return value;
}
const nastyValue = fc.oneof(
  { weight: 4, arbitrary: nastyScalar },
  { weight: 1, arbitrary: fc.constantFrom(nested(40), nested(2_000), [nested(100)]) },
  { weight: 1, arbitrary: fc.array(nastyScalar, { maxLength: 5 }) },
  { weight: 1, arbitrary: fc.dictionary(fc.string({ minLength: 1, maxLength: 8 }), nastyScalar, { maxKeys: 4 }) },
);

/** Bodies of random shape, and bodies with the route's own field names holding nasty values. */
function bodyArbitrary(fieldNames: string[]): fc.Arbitrary<unknown> {
  const shaped =
    fieldNames.length > 0
      ? fc.record(Object.fromEntries(fieldNames.map((name) => [name, nastyValue])), { requiredKeys: [] })
      : fc.dictionary(fc.string({ minLength: 1, maxLength: 8 }), nastyValue, { maxKeys: 5 });
  return fc.oneof(
    { weight: 3, arbitrary: shaped },
    { weight: 1, arbitrary: fc.array(nastyValue, { maxLength: 4 }) },
    { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }).filter((value) => typeof value === 'object') },
  );
}

/** The request-body property names of each route, from the app's own OpenAPI document. */
function bodyFieldNames(document: Record<string, unknown>, route: ApiRoute): string[] {
  const paths = document.paths as Record<string, Record<string, { requestBody?: unknown }>>;
  const openApiPath = route.path.replace(/:([A-Za-z0-9_]+)/g, '{$1}');
  const operation = paths[openApiPath]?.[route.method.toLowerCase()];
  const schema = (operation?.requestBody as { content?: Record<string, { schema?: { $ref?: string } }> } | undefined)
    ?.content?.['application/json']?.schema;
  const ref = schema?.$ref?.split('/').pop();
  const components = (document.components as { schemas?: Record<string, { properties?: object }> }).schemas ?? {};
  return Object.keys((ref ? components[ref]?.properties : undefined) ?? {});
}

describe('bad input on every write route: never a 500, a 4xx naming the field', () => {
  let testApp: TestApp;
  let routes: ApiRoute[];
  let project: TestProject;
  const accounts = new Map<UserRole, TestUser>();
  let openApi: Record<string, unknown>;

  beforeAll(async () => {
    testApp = await createTestApp();
    routes = apiRouteTable(testApp.app).filter(
      (route) => route.method !== 'GET' && !SKIPPED.has(`${route.method} ${route.path}`),
    );
    for (const role of ['engineer', 'lead', 'admin'] as const) accounts.set(role, await createUser(testApp, { role }));
    const lead = accounts.get('lead');
    const admin = accounts.get('admin');
    if (!lead || !admin) throw new Error('accounts missing');
    project = await createProject([
      { userId: lead.id, role: 'lead' },
      { userId: admin.id, role: 'lead' },
    ]);
    const response = await request(testApp.app.getHttpServer()).get('/api/docs-json');
    openApi = response.body as Record<string, unknown>;
  });
  afterAll(async () => {
    await testApp?.close();
  });

  /** A caller the guards let through: a lead member, or the admin for admin-only routes. */
  async function cookieFor(route: ApiRoute): Promise<string> {
    const role: UserRole = route.appAction && !canInApp('lead', route.appAction) ? 'admin' : 'lead';
    const user = accounts.get(role);
    if (!user) throw new Error(`no ${role} account`);
    return mintSessionCookie(testApp, user.id);
  }

  function projectsRoute(): ApiRoute {
    const route = routes.find((candidate) => candidate.method === 'POST' && candidate.path === '/api/projects');
    if (!route) throw new Error('POST /api/projects is missing from the route table');
    return route;
  }

  function concretePath(route: ApiRoute): string {
    return route.path.replace(/:([A-Za-z0-9_]+)/g, (_match, name: string) =>
      name === 'projectId' ? project.id : name.endsWith('Id') ? UNKNOWN_ID : '1',
    );
  }

  it('covers the write routes of the route table', () => {
    expect(routes.map((route) => `${route.method} ${route.path}`)).toEqual(
      expect.arrayContaining(['POST /api/projects', 'POST /api/users', 'POST /api/projects/:projectId/members']),
    );
  });

  it('answers 10,000 generated bodies over the write routes with 2xx or 4xx, never 5xx, and every 400 names a field', async () => {
    // One in-process listener with kept-alive connections, and several requests in flight: the cost of a
    // request is mostly waiting on PostgreSQL, so the 10,000 cases overlap instead of queueing one by one.
    const server = testApp.app.getHttpServer() as Server;
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as AddressInfo;
    const failures: string[] = [];
    const costly = routes.filter((route) => COSTLY_ROUTE.test(route.path));
    const cheapCases = Math.ceil(
      (TOTAL_CASES - costly.length * CASES_PER_COSTLY_ROUTE) / (routes.length - costly.length),
    );
    let sent = 0;
    for (const route of routes) {
      const cookie = await cookieFor(route);
      const fields = bodyFieldNames(openApi, route);
      const numRuns = COSTLY_ROUTE.test(route.path) ? CASES_PER_COSTLY_ROUTE : cheapCases;
      const bodies = fc.sample(bodyArbitrary(fields), { numRuns, seed: 8 });
      const send = async (body: unknown): Promise<void> => {
        const response = await fetch(`http://127.0.0.1:${port}${concretePath(route)}`, {
          method: route.method,
          headers: { cookie, 'content-type': 'application/json' },
          body: JSON.stringify(body),
        });
        sent += 1;
        const text = await response.text();
        let parsed: unknown;
        try {
          parsed = JSON.parse(text);
        } catch {
          parsed = null;
        }
        const field = (parsed as { field?: unknown } | null)?.field;
        const named = typeof field === 'string' && field !== '';
        const ok =
          response.status < 500 && (response.status !== 400 || named) && typeof parsed === 'object' && parsed !== null;
        if (!ok) {
          failures.push(
            `${route.method} ${route.path} ${JSON.stringify(body).slice(0, 200)} -> ${response.status} ${text.slice(0, 200)}`,
          );
        }
      };
      for (let start = 0; start < bodies.length; start += IN_FLIGHT) {
        await Promise.all(bodies.slice(start, start + IN_FLIGHT).map(send));
      }
    }
    await new Promise<void>((resolve) => server.close(() => resolve()));
    expect(failures).toEqual([]);
    expect(sent).toBeGreaterThanOrEqual(TOTAL_CASES);
  }, 600_000);

  it('stores markup in a text field exactly as typed', async () => {
    const name = '<img src=x onerror=alert(1)>';
    const created = await request(testApp.app.getHttpServer())
      .post('/api/projects')
      .set('Cookie', await cookieFor(projectsRoute()))
      .send({ name, productLine: '<b>Ionizers</b>' });
    expect(created.status).toBe(201);
    const detail = await request(testApp.app.getHttpServer())
      .get(`/api/projects/${created.body.id}`)
      .set('Cookie', await cookieFor(projectsRoute()));
    expect(detail.body).toMatchObject({ name, productLine: '<b>Ionizers</b>' });
    expect(detail.headers['content-type']).toMatch(/^application\/json/);
  });

  it('refuses an oversized JSON body with 413 from its Content-Length, before reading it', async () => {
    const limit = testApp.env.bodyLimitBytes;
    const response = await request(testApp.app.getHttpServer())
      .post('/api/projects')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ name: 'x'.repeat(limit + 10), productLine: 'Ionizers' }));
    expect(response.status).toBe(413);
    expect(response.body).toMatchObject({ statusCode: 413, code: 'payload_too_large' });
    expect(response.body.message).toContain(String(limit));
  });

  it('answers malformed JSON with 400, not 500', async () => {
    const response = await request(testApp.app.getHttpServer())
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email": "a@b.test", "password": ');
    expect(response.status).toBe(400);
    expect(response.body).toMatchObject({ statusCode: 400, message: expect.any(String) });
  });
});
