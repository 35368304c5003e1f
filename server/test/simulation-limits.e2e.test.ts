import request from 'supertest';
import type { SimulationJob } from '@ladderwright/shared/api';
import { SimulationRunnerService } from '../src/simulations/simulation-runner.service';
import { biasDoubler as doubler } from './fixtures/simulations/bias-doubler';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

const SMALL_RUN = { cycles: 30, maxStepPerPeriod: 40 };
/** Minutes of work: still running when the time limit or the test stops it. */
const LONG_RUN = { cycles: 20000, maxStepPerPeriod: 2000 };

async function jobRow(testApp: TestApp, id: string) {
  const [row] = await testApp.sequelize.query<{
    status: string;
    error_code: string | null;
    heartbeat_at: Date | null;
    queue_job_id: string | null;
  }>('SELECT status, error_code, heartbeat_at, queue_job_id FROM simulation_jobs WHERE id = :id', {
    replacements: { id },
    type: 'SELECT' as never,
  });
  return row;
}

// Quotas and limits are this server's choices (DEVELOPERS.md, Background work): common practice, no source.
describe('simulation jobs: quotas, size, fair order, start-up reconciliation (this instance only queues)', () => {
  let testApp: TestApp;
  let alice: TestUser;
  let bob: TestUser;
  let carol: TestUser;
  let busy: TestProject;
  let quiet: TestProject;
  const cookies = new Map<string, string>();
  const start = (user: TestUser, projectId: string, body: object) =>
    request(testApp.app.getHttpServer())
      .post(`/api/projects/${projectId}/simulations`)
      .set('Cookie', cookies.get(user.email) ?? '')
      .send(body);

  beforeAll(async () => {
    testApp = await createTestApp({
      env: {
        simulationWorkers: 0,
        simulationMaxActivePerUser: 2,
        simulationMaxActivePerProject: 3,
        simulationMaxWork: 10_000_000,
      },
    });
    [alice, bob, carol] = await Promise.all([createUser(testApp), createUser(testApp), createUser(testApp)]);
    busy = await createProject([
      { userId: alice.id, role: 'engineer' },
      { userId: bob.id, role: 'engineer' },
    ]);
    quiet = await createProject([{ userId: carol.id, role: 'engineer' }]);
    for (const user of [alice, bob, carol]) cookies.set(user.email, await signIn(testApp, user.email, user.password));
  });
  afterAll(async () => testApp.close());

  it('refuses a run over the size limit with 400 naming options.cycles, and one without cycles naming options', async () => {
    // 2 cells × 20000 cycles × 2000 steps = 8e7 cell-steps, over the 1e7 of this app.
    const big = await start(alice, busy.id, { kind: 'startup', document: doubler(), options: LONG_RUN });
    expect(big.status).toBe(400);
    expect(big.body.field).toBe('options.cycles');
    expect(big.body.message).toMatch(/8\.00e\+7 cell-steps/);
    const untilSteady = await start(alice, busy.id, {
      kind: 'startup',
      document: doubler(),
      options: { maxStepPerPeriod: 400 },
    });
    expect(untilSteady.status).toBe(400);
    expect(untilSteady.body.field).toBe('options');
  });

  const jobIds: string[] = [];

  it('keeps a person to 2 and a project to 3 queued or running jobs (429 with Retry-After)', async () => {
    for (let i = 0; i < 2; i += 1) {
      const response = await start(alice, busy.id, { kind: 'startup', document: doubler(), options: SMALL_RUN });
      expect(response.status).toBe(202);
      jobIds.push(response.body.jobId as string);
    }
    const third = await start(alice, busy.id, { kind: 'startup', document: doubler(), options: SMALL_RUN });
    expect(third.status).toBe(429);
    expect(third.body.message).toMatch(/the most one person may have/);
    expect(Number(third.headers['retry-after'])).toBeGreaterThan(0);

    const bobs = await start(bob, busy.id, { kind: 'startup', document: doubler(), options: SMALL_RUN });
    expect(bobs.status).toBe(202);
    jobIds.push(bobs.body.jobId as string);
    const projectFull = await start(bob, busy.id, { kind: 'startup', document: doubler(), options: SMALL_RUN });
    expect(projectFull.status).toBe(429);
    expect(projectFull.body.message).toMatch(/the most one project may have/);

    // Another project is not held back by this one.
    const carols = await start(carol, quiet.id, { kind: 'startup', document: doubler(), options: SMALL_RUN });
    expect(carols.status).toBe(202);
    jobIds.push(carols.body.jobId as string);

    // A cancelled job frees its place.
    const cancel = await request(testApp.app.getHttpServer())
      .post(`/api/projects/${busy.id}/simulations/${jobIds[0]}/cancel`)
      .set('Cookie', cookies.get(alice.email) ?? '');
    expect((cancel.body as SimulationJob).status).toBe('cancelled');
    const again = await start(alice, busy.id, { kind: 'startup', document: doubler(), options: SMALL_RUN });
    expect(again.status).toBe(202);
  });

  it("queues a project's first job ahead of another project's third (priority falls with the project's waiting jobs)", async () => {
    const priorities: number[] = [];
    for (const id of jobIds) {
      const row = await jobRow(testApp, id);
      const [queued] = await testApp.sequelize.query<{ priority: number }>(
        'SELECT priority FROM pgboss.job WHERE id = :id',
        { replacements: { id: row?.queue_job_id }, type: 'SELECT' as never },
      );
      priorities.push(queued?.priority ?? Number.NaN);
    }
    // alice 1st (busy had 0 waiting), alice 2nd (1 waiting), bob (2 waiting), carol (quiet had 0 waiting).
    expect(priorities).toEqual([0, -1, -2, 0]);
  });

  it('ends a job left "running" by a dead instance as interrupted, and leaves a beating one alone', async () => {
    const [abandoned, alive] = [jobIds[1] ?? '', jobIds[3] ?? ''];
    await testApp.sequelize.query(
      `UPDATE simulation_jobs SET status = 'running', started_at = now() - interval '1 hour',
         heartbeat_at = now() - interval '1 hour' WHERE id = :abandoned`,
      { replacements: { abandoned } },
    );
    await testApp.sequelize.query(
      "UPDATE simulation_jobs SET status = 'running', started_at = now(), heartbeat_at = now() WHERE id = :alive",
      { replacements: { alive } },
    );
    expect(await testApp.app.get(SimulationRunnerService).reconcile()).toBe(1);
    expect(await jobRow(testApp, abandoned)).toMatchObject({ status: 'failed', error_code: 'interrupted' });
    expect(await jobRow(testApp, alive)).toMatchObject({ status: 'running' });
  });
});

describe('simulation jobs: heartbeat and run-time limit (this instance runs jobs)', () => {
  it('beats while it runs and stops a run over SIMULATION_MAX_RUN_S as failed time_limit', async () => {
    const testApp = await createTestApp({
      env: { simulationWorkers: 1, simulationMaxRunS: 2, simulationHeartbeatMs: 200 },
    });
    try {
      const user = await createUser(testApp);
      const project = await createProject([{ userId: user.id, role: 'engineer' }]);
      const cookie = await signIn(testApp, user.email, user.password);
      const started = await request(testApp.app.getHttpServer())
        .post(`/api/projects/${project.id}/simulations`)
        .set('Cookie', cookie)
        .send({ kind: 'full', document: doubler(), options: LONG_RUN });
      expect(started.status).toBe(202);
      const id = started.body.jobId as string;
      const beats = new Set<number>();
      const deadline = Date.now() + 15_000;
      let row = await jobRow(testApp, id);
      while (row?.status !== 'failed' && Date.now() < deadline) {
        if (row?.status === 'running' && row.heartbeat_at) beats.add(new Date(row.heartbeat_at).getTime());
        await new Promise((done) => setTimeout(done, 100));
        row = await jobRow(testApp, id);
      }
      expect(row).toMatchObject({ status: 'failed', error_code: 'time_limit' });
      expect(beats.size).toBeGreaterThan(2);
    } finally {
      await testApp.close();
    }
  });
});
