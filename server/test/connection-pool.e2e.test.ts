import { spawn } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import request from 'supertest';
import type { DesignDetail, RevisionDetail } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

const TEMPLATE = { kind: 'template', templateId: 'ionizerBar' } as const;

async function setUp(testApp: TestApp): Promise<{ engineer: TestUser; project: TestProject; cookie: string }> {
  const engineer = await createUser(testApp, { role: 'engineer' });
  const project = await createProject([{ userId: engineer.id, role: 'engineer' }]);
  const cookie = await signIn(testApp, engineer.email, engineer.password);
  return { engineer, project, cookie };
}

async function firstRevision(
  server: Parameters<typeof request>[0],
  cookie: string,
  projectId: string,
  designId: string,
) {
  const response = await request(server)
    .get(`/api/projects/${projectId}/designs/${designId}/revisions/1`)
    .set('Cookie', cookie);
  expect(response.status).toBe(200);
  return (response.body as RevisionDetail).document;
}

function saveBody(document: Design, note: string) {
  return { baseRevisionNumber: 1, document, changeNote: note };
}

interface BurstOutcome {
  statuses: number[];
  bystanderStatus: number;
  bystanderMs: number;
}

/** Runs utils/burst-client.mjs in its own process (an outside client) and resolves to what it measured. */
function runBurstClient(plan: {
  baseUrl: string;
  cookie: string;
  requests: { path: string; body: unknown }[];
  bystanderPath: string;
}): Promise<BurstOutcome> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [join(__dirname, 'utils', 'burst-client.mjs')], {
      stdio: ['pipe', 'pipe', 'inherit'],
    });
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.on('error', reject);
    child.on('exit', (code) =>
      code === 0 ? resolve(JSON.parse(output) as BurstOutcome) : reject(new Error(`burst client exited ${code}`)),
    );
    child.stdin.end(JSON.stringify(plan));
  });
}

// A transaction that needs a second pooled connection deadlocks once every connection is held by such a
// transaction; with a pool of one it deadlocks at once. So every write path must pass with a pool of one.
describe('a pool of one connection: writes never wait on a second connection', () => {
  let testApp: TestApp;
  let project: TestProject;
  let cookie: string;

  beforeAll(async () => {
    testApp = await createTestApp({ env: { databasePoolMax: 1, databaseAcquireTimeoutMs: 1_500 } });
    ({ project, cookie } = await setUp(testApp));
  });
  afterAll(async () => {
    await testApp?.close();
  });

  it('creates, saves and imports a design with one connection', async () => {
    const server = testApp.app.getHttpServer();
    const created = await request(server)
      .post(`/api/projects/${project.id}/designs`)
      .set('Cookie', cookie)
      .send({ name: 'Pool of one', from: TEMPLATE });
    expect(created.status).toBe(201);
    const design = created.body as DesignDetail;
    const document = await firstRevision(server, cookie, project.id, design.id);
    const saved = await request(server)
      .post(`/api/projects/${project.id}/designs/${design.id}/revisions`)
      .set('Cookie', cookie)
      .send(saveBody(document, 'same document again'));
    expect(saved.status).toBe(201);
    const imported = await request(server)
      .post(`/api/projects/${project.id}/designs/import`)
      .set('Cookie', cookie)
      .send({ format: 'ladderwright-design', formatVersion: 1, design: document });
    expect(imported.status).toBe(201);
  });

  it('answers 503 busy with Retry-After while the only connection stays taken, then recovers', async () => {
    const server = testApp.app.getHttpServer();
    // Hold the pool's only connection for 2.5 s, longer than the 1.5 s acquire timeout.
    const held = testApp.sequelize.transaction(async (transaction) => {
      await testApp.sequelize.query('SELECT pg_sleep(2.5)', { transaction });
    });
    await new Promise((done) => setTimeout(done, 100));
    const busy = await request(server).get(`/api/projects/${project.id}/designs`).set('Cookie', cookie);
    expect(busy.status).toBe(503);
    expect(busy.body.code).toBe('busy');
    expect(busy.headers['retry-after']).toBe('1');
    await held;
    const after = await request(server).get(`/api/projects/${project.id}/designs`).set('Cookie', cookie);
    expect(after.status).toBe(200);
  });
});

describe('a burst of 50 saves and creations beside a bystander', () => {
  let testApp: TestApp;
  let project: TestProject;
  let engineer: TestUser;
  let cookie: string;
  let baseUrl: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ engineer, project, cookie } = await setUp(testApp));
    // One listening socket for every request (supertest would otherwise listen once per request).
    await testApp.app.listen(0, '127.0.0.1');
    baseUrl = `http://127.0.0.1:${(testApp.app.getHttpServer().address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await testApp?.close();
  });

  it('answers all 50 with success and the bystander within 1 s (default pool of 10)', async () => {
    const designs = await Promise.all(
      Array.from({ length: 25 }, (_, i) =>
        createDesign(testApp, project.id, engineer.id, { name: `Burst ${i}`, from: TEMPLATE }),
      ),
    );
    const document = await firstRevision(baseUrl, cookie, project.id, designs[0]?.id ?? '');
    const requests = [
      ...designs.map((design) => ({
        path: `/api/projects/${project.id}/designs/${design.id}/revisions`,
        body: saveBody(document, 'burst save'),
      })),
      ...Array.from({ length: 25 }, (_, i) => ({
        path: `/api/projects/${project.id}/designs`,
        body: { name: `Burst new ${i}`, from: TEMPLATE },
      })),
    ];
    const outcome = await runBurstClient({ baseUrl, cookie, requests, bystanderPath: `/api/projects/${project.id}` });
    // Before, 26 of 30 creations got 503 (the pool deadlocked on itself) and the bystander waited out the
    // acquire timeout (10 s); then every burst request's project lookup queued in the pool ahead of the
    // bystander's three queries (0.6–2.7 s on a loaded machine). The client runs in its own process: in this
    // one it would share the server's event loop and open one connection per turn of it.
    expect(outcome.statuses).toEqual(Array.from({ length: 50 }, () => 201));
    expect(outcome.bystanderStatus).toBe(200);
    expect(outcome.bystanderMs).toBeLessThan(1_000);
  });
});
