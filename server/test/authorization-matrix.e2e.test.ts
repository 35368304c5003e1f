import request from 'supertest';
import { canInApp, canInProject, PROJECT_ROLES, type ProjectRole, USER_ROLES } from '@ladderwright/shared/auth';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { type ApiRoute, apiRouteTable } from './utils/route-table';
import { mintSessionCookie } from './utils/sign-in';

/**
 * Routes open to any signed-in account, on purpose. Every other route must say who may call it:
 * `@Public()`, `@RequiresAppAction(...)`, or a `:projectId` in its path (project guard, `@RequiresProjectAction`).
 * A new route with none of these fails the first test below until it gets one or is listed here.
 */
const ANY_SIGNED_IN_ACCOUNT = new Set([
  'GET /api/auth/me',
  'POST /api/auth/sign-out-everywhere',
  'GET /api/projects',
  'POST /api/analysis/evaluate',
  'GET /api/design-schema',
  'GET /api/design-templates',
  'GET /api/inbox',
  'GET /api/me/notifications',
  'PUT /api/me/notifications',
]);

/** Routes after which the caller's earlier tokens no longer work. */
const SESSION_REVOKING = new Set(['POST /api/auth/sign-out', 'POST /api/auth/sign-out-everywhere']);

/** An id that names nothing: deeper resources of a project the caller may use are then "not found". */
const UNKNOWN_ID = '5d1f7c9e-3a4b-4c8d-9e0f-1a2b3c4d5e6f';

type Membership = ProjectRole | 'none';
type Expected = 'denied-401' | 'denied-403' | 'hidden-404' | 'allowed';

interface Caller {
  label: string;
  user: TestUser | null;
  membership: Membership;
}

function routeKey(route: ApiRoute): string {
  return `${route.method} ${route.path}`;
}

function isClassified(route: ApiRoute): boolean {
  return (
    route.isPublic ||
    route.appAction !== null ||
    route.projectAction !== null ||
    ANY_SIGNED_IN_ACCOUNT.has(routeKey(route))
  );
}

/** What the guards must answer, from the route's metadata and shared/auth permissions alone. */
function expectedOutcome(route: ApiRoute, caller: Caller): Expected {
  if (route.isPublic) return 'allowed';
  if (!caller.user) return 'denied-401';
  if (route.appAction && !canInApp(caller.user.role, route.appAction)) return 'denied-403';
  if (route.projectAction) {
    if (caller.membership === 'none') return 'hidden-404';
    if (!canInProject(caller.membership, route.projectAction)) return 'denied-403';
  }
  return 'allowed';
}

function matches(expected: Expected, status: number, body: { field?: unknown }): boolean {
  switch (expected) {
    case 'denied-401':
      return status === 401;
    case 'denied-403':
      return status === 403;
    case 'hidden-404':
      return status === 404 && body.field === 'projectId';
    case 'allowed':
      // Past the guards: success, or the handler's own 400/404/409/422 for the empty body and unknown ids.
      return status < 500 && status !== 401 && status !== 403 && !(status === 404 && body.field === 'projectId');
  }
}

describe('authorization matrix (every API route x every role x member / non-member)', () => {
  let testApp: TestApp;
  let routes: ApiRoute[];
  let project: TestProject;
  const callers: Caller[] = [];

  beforeAll(async () => {
    testApp = await createTestApp();
    routes = apiRouteTable(testApp.app);
    callers.push({ label: 'anonymous', user: null, membership: 'none' });
    const members: { userId: string; role: ProjectRole }[] = [];
    for (const accountRole of USER_ROLES) {
      for (const membership of ['none', ...PROJECT_ROLES] as const) {
        const user = await createUser(testApp, { role: accountRole });
        callers.push({
          label: `${accountRole} account, ${membership === 'none' ? 'non-member' : `${membership} member`}`,
          user,
          membership,
        });
        if (membership !== 'none') members.push({ userId: user.id, role: membership });
      }
    }
    project = await createProject(members);
    // A second project with nobody of ours in it, so the first is not the only one.
    await createProject([]);
  });

  afterAll(async () => {
    await testApp?.close();
  });

  const cookies = new Map<string, string>();

  /** A token at the account's current session version, re-minted after a route that revokes sessions. */
  async function cookieFor(user: TestUser): Promise<string> {
    const cached = cookies.get(user.id);
    if (cached) return cached;
    const cookie = await mintSessionCookie(testApp, user.id);
    cookies.set(user.id, cookie);
    return cookie;
  }

  function concretePath(route: ApiRoute): string {
    return route.path.replace(/:([A-Za-z0-9_]+)/g, (_match, name: string) =>
      name === 'projectId' ? project.id : name.endsWith('Id') ? UNKNOWN_ID : '1',
    );
  }

  it('finds the routes and every one declares who may call it', () => {
    expect(routes.length).toBeGreaterThan(10);
    expect(routes.map(routeKey)).toEqual(
      expect.arrayContaining([
        'GET /api/projects',
        'GET /api/audit',
        'POST /api/users',
        'POST /api/projects/:projectId/unarchive',
        'GET /api/projects/:projectId/member-requests',
        'POST /api/projects/:projectId/member-requests',
        'POST /api/projects/:projectId/member-requests/:requestId/accept',
        'POST /api/projects/:projectId/member-requests/:requestId/decline',
      ]),
    );
    expect(routes.filter((route) => !isClassified(route)).map(routeKey)).toEqual([]);
  });

  it('answers each caller as the route metadata and the permission table say, before any validation', async () => {
    const server = testApp.app.getHttpServer();
    const mismatches: string[] = [];
    let checked = 0;
    for (const route of routes) {
      const relevant = route.projectAction ? callers : callers.filter((caller) => caller.membership === 'none');
      await Promise.all(
        relevant.map(async (caller) => {
          const expected = expectedOutcome(route, caller);
          const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
          let call = request(server)[method](concretePath(route));
          if (caller.user) call = call.set('Cookie', await cookieFor(caller.user));
          if (route.method !== 'GET' && route.method !== 'DELETE') call = call.send({});
          const response = await call;
          checked += 1;
          if (!matches(expected, response.status, response.body as { field?: unknown })) {
            mismatches.push(
              `${routeKey(route)} as ${caller.label}: expected ${expected}, got ${response.status} ${JSON.stringify(response.body).slice(0, 160)}`,
            );
          }
        }),
      );
      if (SESSION_REVOKING.has(routeKey(route))) cookies.clear();
    }
    expect(mismatches).toEqual([]);
    expect(checked).toBeGreaterThan(routes.length * 5);
    // Every route times up to 17 callers; the route count grows with the API.
  }, 120_000);

  it('denies a non-member with 404 even when that account role could do the action in its own projects', async () => {
    const lead = callers.find((caller) => caller.user?.role === 'lead' && caller.membership === 'none');
    if (!lead?.user) throw new Error('no lead non-member caller');
    const response = await request(testApp.app.getHttpServer())
      .post(`/api/projects/${project.id}/members`)
      .set('Cookie', await cookieFor(lead.user))
      .send({ email: 'nobody@northfold.test', role: 'engineer' });
    expect(response.status).toBe(404);
    expect(response.body).toMatchObject({ code: 'not_found', field: 'projectId' });
  });
});
