import request from 'supertest';
import { Sequelize } from 'sequelize-typescript';
import type { SimulationBatch } from '@ladderwright/shared/api';
import { monteCarloDesigns } from '@ladderwright/shared/sizing';
import { createApp } from '../src/app.module';
import { SimulationJobModel } from '../src/simulations/simulation-job.model';
import { SimulationRunnerService } from '../src/simulations/simulation-runner.service';
import { biasDoubler as doubler } from './fixtures/simulations/bias-doubler';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp, testEnv } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

/**
 * Long enough (a few seconds each; 0.6–2 s at 1,500 cycles on a lightly loaded machine) that the second
 * instance, which looks at the queue once a second, finds members while the first instance's worker is busy:
 * the instance that queues the batch wakes its own worker at once, and with runs shorter than the poll it took
 * all six in one CI run.
 */
const MEMBER_RUN = { cycles: 6000, maxStepPerPeriod: 100 };
const SMALL_RUN = { cycles: 30, maxStepPerPeriod: 40 };
const LONG_RUN = { cycles: 20000, maxStepPerPeriod: 2000 };

// Two app instances on one database, each with one simulation worker: the setting of several instances behind a
// load balancer on one PostgreSQL. Requests go to the first; members run wherever a worker takes them.
describe('simulation batches across instances', () => {
  let first: TestApp;
  let second: Awaited<ReturnType<typeof createApp>>;
  const http = () => request(first.app.getHttpServer());
  let engineer: TestUser;
  let reviewer: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  const cookies = new Map<string, string>();
  const as = (user: TestUser) => cookies.get(user.email) ?? '';
  const base = () => `/api/projects/${project.id}/simulation-batches`;

  async function startBatch(body: object, user = engineer): Promise<request.Response> {
    return http().post(base()).set('Cookie', as(user)).send(body);
  }

  async function waitForEnd(batchId: string, timeoutMs: number): Promise<SimulationBatch> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const response = await http().get(`${base()}/${batchId}`).set('Cookie', as(engineer));
      expect(response.status).toBe(200);
      const batch = response.body as SimulationBatch;
      if (batch.status !== 'queued' && batch.status !== 'running') return batch;
      if (Date.now() > deadline) throw new Error(`batch ${batchId} still ${batch.status} at ${batch.progressPct} %`);
      await new Promise((done) => setTimeout(done, 200));
    }
  }

  beforeAll(async () => {
    first = await createTestApp({ env: { simulationWorkers: 1, simulationMaxActivePerUser: 1 } });
    // The second instance: same database, its own worker pool, started as any instance is (no extra set-up).
    second = await createApp(testEnv({ simulationWorkers: 1, simulationMaxActivePerUser: 1 }), { logger: false });
    await second.init();
    engineer = await createUser(first, { role: 'engineer' });
    reviewer = await createUser(first, { role: 'engineer' });
    outsider = await createUser(first, { role: 'engineer' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: reviewer.id, role: 'reviewer' },
    ]);
    for (const user of [engineer, reviewer, outsider])
      cookies.set(user.email, await signIn(first, user.email, user.password));
  });
  afterAll(async () => {
    await second.close();
    await first.close();
  });

  it('runs a Monte Carlo batch as member jobs taken by the workers of both instances', async () => {
    const seed = 42;
    const started = await startBatch({
      simulationKind: 'startup',
      document: doubler(),
      options: MEMBER_RUN,
      monteCarlo: { trials: 6, seed },
    });
    expect(started.status).toBe(202);
    expect(started.body).toEqual({ batchId: expect.any(String), status: 'running', memberCount: 6 });

    const batch = await waitForEnd(started.body.batchId, 240_000);
    expect(batch.status).toBe('succeeded');
    expect(batch.kind).toBe('monte-carlo');
    expect(batch.progressPct).toBe(100);
    expect(batch.membersEnded).toBe(6);
    expect(batch.members.map((member) => member.status)).toEqual(Array(6).fill('succeeded'));
    // The members are the seeded draws: the same seed gives the same capacitors.
    expect(batch.members.map((member) => member.variant)).toEqual(
      monteCarloDesigns(doubler(), 6, seed).map((member) => member.variant),
    );
    const outputs = batch.members.map((member) => member.summary!.outputMeanV!);
    expect(new Set(outputs).size).toBe(6);
    const spread = batch.spread!.outputMeanV!;
    expect(spread.count).toBe(6);
    expect(spread.min).toBe(Math.min(...outputs));
    expect(spread.max).toBe(Math.max(...outputs));
    expect(spread.mean).toBeCloseTo(outputs.reduce((sum, x) => sum + x, 0) / 6, 9);

    const members = await SimulationJobModel.findAll({ where: { parentJobId: started.body.batchId } });
    const instances = new Set(members.map((member) => member.runBy));
    expect(instances.size).toBe(2);
    // Members simulate variants, so none stands for a revision's figures.
    expect(members.every((member) => member.designId === null && member.revisionNumber === null)).toBe(true);
  }, 260_000);

  it('sweeps a number of the design: a larger load current gives a lower output (the ladder droop)', async () => {
    // Output falls with load current, V = V_no-load − I·R_out (common practice, no source).
    const started = await startBatch({
      simulationKind: 'startup',
      document: doubler(),
      options: SMALL_RUN,
      sweep: { path: 'load.currentA', values: [1e-6, 50e-6, 200e-6] },
    });
    expect(started.status).toBe(202);
    const batch = await waitForEnd(started.body.batchId, 60_000);
    expect(batch.status).toBe('succeeded');
    expect(batch.kind).toBe('sweep');
    expect(batch.members.map((member) => member.variant)).toEqual([
      { 'load.currentA': 1e-6 },
      { 'load.currentA': 50e-6 },
      { 'load.currentA': 200e-6 },
    ]);
    const outputs = batch.members.map((member) => Math.abs(member.summary!.outputMeanV!));
    expect(outputs[0]).toBeGreaterThan(outputs[1]!);
    expect(outputs[1]).toBeGreaterThan(outputs[2]!);
  }, 70_000);

  it('counts a running batch once against the quota, however many members it has', async () => {
    const started = await startBatch({
      simulationKind: 'full',
      document: doubler(),
      options: LONG_RUN,
      monteCarlo: { trials: 3, seed: 1 },
    });
    expect(started.status).toBe(202);
    // The person's quota is one job: the batch takes it, so a single job waits.
    const single = await http()
      .post(`/api/projects/${project.id}/simulations`)
      .set('Cookie', as(engineer))
      .send({ kind: 'startup', document: doubler(), options: SMALL_RUN });
    expect(single.status).toBe(429);

    const cancelled = await http().post(`${base()}/${started.body.batchId}/cancel`).set('Cookie', as(engineer));
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.status).toBe('cancelled');
    expect(cancelled.body.members.map((member: { status: string }) => member.status)).toEqual(
      Array(3).fill('cancelled'),
    );
    const afterCancel = await http()
      .post(`/api/projects/${project.id}/simulations`)
      .set('Cookie', as(engineer))
      .send({ kind: 'startup', document: doubler(), options: SMALL_RUN });
    expect(afterCancel.status).toBe(202);
    // Let it end so that it holds no quota and no worker for the next case.
    const deadline = Date.now() + 20_000;
    for (;;) {
      const job = await SimulationJobModel.findByPk(afterCancel.body.jobId as string);
      if (job?.status === 'succeeded' || Date.now() > deadline) break;
      await new Promise((done) => setTimeout(done, 100));
    }
  }, 30_000);

  it.each([
    [{ sweep: { path: 'load.currentA', values: [1e-6] }, monteCarlo: { trials: 2, seed: 1 } }, 'sweep'],
    [{}, 'sweep'],
    [{ sweep: { path: 'multiplier.topology', values: [1] } }, 'sweep.path'],
    [{ sweep: { path: 'load.currentA', values: [1e-6, -1] } }, 'sweep.values[1]'],
    [{ sweep: { path: 'load.currentA', values: [] } }, 'sweep.values'],
    [{ monteCarlo: { trials: 0, seed: 1 } }, 'monteCarlo.trials'],
    [{ monteCarlo: { trials: 257, seed: 1 } }, 'monteCarlo.trials'],
    [{ monteCarlo: { trials: 2, seed: 1 }, simulationKind: 'everything' }, 'simulationKind'],
  ])('refuses %j with a 400 naming %s', async (extra, field) => {
    const response = await startBatch({ simulationKind: 'startup', document: doubler(), options: SMALL_RUN, ...extra });
    expect(response.status).toBe(400);
    expect(JSON.stringify(response.body)).toContain(field);
  });

  it('answers 404 to a non-member and 403 to a reviewer, and 404 for a batch of another project', async () => {
    const body = {
      simulationKind: 'startup',
      document: doubler(),
      options: SMALL_RUN,
      monteCarlo: { trials: 2, seed: 1 },
    };
    expect((await startBatch(body, outsider)).status).toBe(404);
    expect((await startBatch(body, reviewer)).status).toBe(403);
    const other = await createProject([{ userId: outsider.id, role: 'engineer' }]);
    const unknown = await http()
      .get(`/api/projects/${other.id}/simulation-batches/00000000-0000-4000-8000-000000000000`)
      .set('Cookie', as(outsider));
    expect(unknown.status).toBe(404);
  });

  it('ends a batch whose last member was abandoned by a dead instance', async () => {
    const sequelize = first.app.get(Sequelize);
    const batch = await SimulationJobModel.create({
      projectId: project.id,
      requestedBy: engineer.id,
      kind: 'batch',
      status: 'running',
      input: { document: doubler(), options: {} },
    });
    const member = await SimulationJobModel.create({
      projectId: project.id,
      requestedBy: engineer.id,
      kind: 'startup',
      status: 'running',
      input: { document: doubler(), options: {} },
      parentJobId: batch.id,
      memberIndex: 0,
    });
    await sequelize.query(
      `UPDATE simulation_jobs SET heartbeat_at = now() - interval '1 hour', started_at = now() - interval '1 hour'
       WHERE id = :id`,
      { replacements: { id: member.id } },
    );
    await first.app.get(SimulationRunnerService).reconcile();
    await member.reload();
    await batch.reload();
    expect(member.errorCode).toBe('interrupted');
    expect(batch.status).toBe('failed');
    expect(batch.errorCode).toBe('members_failed');
  });
});
