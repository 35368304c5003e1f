import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { SimulationJob, WaveformTrace } from '@ladderwright/shared/api';
import { buildCircuit } from '@ladderwright/shared/circuits';
import { simulateTransient } from '@ladderwright/shared/sim';
import { type Design, designExamples } from '@ladderwright/shared/designs';
import { biasDoubler as doubler } from './fixtures/simulations/bias-doubler';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

const SMALL_RUN = { cycles: 30, maxStepPerPeriod: 40 };
/** 600 000 time steps: a few seconds of work, several 100 ms polls while it runs. */
const MEDIUM_RUN = { cycles: 6000, maxStepPerPeriod: 100 };
/** Millions of time steps: minutes of work, so it is certainly still running when cancelled. */
const LONG_RUN = { cycles: 20000, maxStepPerPeriod: 2000 };

// Statuses follow the permission table (shared/src/auth/permissions.ts): non-member 404, role without
// design.write 403; common practice, no source.
describe('simulations', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let reviewer: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  let otherProject: TestProject;
  const cookies = new Map<string, string>();
  const as = (user: TestUser) => cookies.get(user.email) ?? '';
  const base = () => `/api/projects/${project.id}/simulations`;

  async function start(body: object, user = engineer, projectId = project.id): Promise<request.Response> {
    return http().post(`/api/projects/${projectId}/simulations`).set('Cookie', as(user)).send(body);
  }

  /** Polls the job until it leaves queued/running (or the deadline passes); returns every state seen. */
  async function waitForEnd(jobId: string, timeoutMs = 20_000): Promise<{ job: SimulationJob; seenPct: number[] }> {
    const deadline = Date.now() + timeoutMs;
    const seenPct: number[] = [];
    for (;;) {
      const response = await http().get(`${base()}/${jobId}`).set('Cookie', as(engineer));
      expect(response.status).toBe(200);
      const job = response.body as SimulationJob;
      seenPct.push(job.progressPct);
      if (job.status !== 'queued' && job.status !== 'running') return { job, seenPct };
      if (Date.now() > deadline) throw new Error(`job ${jobId} still ${job.status} at ${job.progressPct} %`);
      await new Promise((done) => setTimeout(done, 100));
    }
  }

  async function waitForStatus(
    jobId: string,
    status: SimulationJob['status'],
    timeoutMs = 15_000,
  ): Promise<SimulationJob> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const job = (await http().get(`${base()}/${jobId}`).set('Cookie', as(engineer))).body as SimulationJob;
      if (job.status === status) return job;
      if (Date.now() > deadline) throw new Error(`job ${jobId} is ${job.status}, waited for ${status}`);
      await new Promise((done) => setTimeout(done, 50));
    }
  }

  beforeAll(async () => {
    testApp = await createTestApp({ env: { simulationWorkers: 1, simulationFaultKinds: true } });
    engineer = await createUser(testApp, { role: 'engineer' });
    reviewer = await createUser(testApp, { role: 'engineer' });
    outsider = await createUser(testApp, { role: 'engineer' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: reviewer.id, role: 'reviewer' },
    ]);
    otherProject = await createProject([{ userId: outsider.id, role: 'engineer' }]);
    for (const user of [engineer, reviewer, outsider])
      cookies.set(user.email, await signIn(testApp, user.email, user.password));
  });
  afterAll(async () => testApp.close());

  describe('running a job', () => {
    it('runs a small start-up job to success with progress, summary figures and peak-keeping Waveforms', async () => {
      const design = doubler();
      const started = await start({ kind: 'startup', document: design, options: SMALL_RUN });
      expect(started.status).toBe(202);
      expect(started.body).toEqual({ jobId: expect.any(String), status: 'queued' });

      const { job, seenPct } = await waitForEnd(started.body.jobId);
      expect(job.status).toBe('succeeded');
      expect(job.progressPct).toBe(100);
      expect(seenPct).toEqual([...seenPct].sort((a, b) => a - b));
      expect(job.error).toBeUndefined();
      const summary = job.result!.summary;
      expect(summary.cyclesSimulated).toBe(30);
      expect(summary.method).toBe('transient');
      // An unloaded-ish doubler on a 320 V peak secondary settles below 2 × 320 V; it must have charged well up.
      expect(summary.outputMeanV).toBeGreaterThan(100);
      expect(summary.outputMeanV).toBeLessThan(640);
      expect(summary.ripplePeakToPeakV).toBeGreaterThanOrEqual(0);
      expect(summary.dischargeTimeS).toBeNull();

      // Independent full-resolution trace of the ladder top through the shared simulator's plain transient.
      const periodS = 1 / 30e3;
      const raw = simulateTransient(buildCircuit(design), {
        stopTimeS: 30 * periodS,
        maxStepS: periodS / 40,
        probes: ['top'],
      });
      const rawTop = Array.from(raw.signals.top!);
      const startup = job.result!.waveforms.find((w: WaveformTrace) => w.phase === 'startup')!;
      expect(startup.timeS).toHaveLength(startup.values.length);
      expect(startup.values.length).toBeLessThan(rawTop.length);
      // Peaks kept: the plotted extremes are the raw extremes. Tolerance 0.1 % of the peak because the job
      // steps to every cycle end and the plain transient does not, so their step sequences differ slightly.
      const peakV = Math.max(...rawTop);
      expect(Math.abs(Math.max(...startup.values) - peakV)).toBeLessThan(1e-3 * peakV);
      expect(Math.abs(Math.min(...startup.values) - Math.min(...rawTop))).toBeLessThan(1e-3 * peakV);
      expect(job.result!.waveforms.map((w: WaveformTrace) => w.phase)).toEqual(['startup', 'steady-state']);
    });

    it('shows progress strictly between 0 and 100 while a longer job runs, rising to 100 when it succeeds', async () => {
      const started = await start({ kind: 'startup', document: doubler(), options: MEDIUM_RUN });
      expect(started.status).toBe(202);
      const { job, seenPct } = await waitForEnd(started.body.jobId, 60_000);
      expect(job.status).toBe('succeeded');
      expect(job.progressPct).toBe(100);
      expect(job.result!.summary.cyclesSimulated).toBe(6000);
      const intermediate = seenPct.filter((pct) => pct > 0 && pct < 100);
      expect(intermediate.length).toBeGreaterThan(0);
      expect(seenPct).toEqual([...seenPct].sort((a, b) => a - b));
      // Written in steps of 5 % (the runner's throttle), so every intermediate value is a multiple of 5.
      expect(intermediate.every((pct) => pct % 5 === 0)).toBe(true);
    }, 70_000);

    it('cancels a long running job: cancelled, no result, and progress stops', async () => {
      const started = await start({ kind: 'full', document: doubler(), options: LONG_RUN });
      expect(started.status).toBe(202);
      await waitForStatus(started.body.jobId, 'running');
      const cancelled = await http().post(`${base()}/${started.body.jobId}/cancel`).set('Cookie', as(engineer));
      expect(cancelled.status).toBe(200);
      expect(cancelled.body.status).toBe('cancelled');
      expect(cancelled.body.result).toBeUndefined();
      await new Promise((done) => setTimeout(done, 1200));
      const later = (await http().get(`${base()}/${started.body.jobId}`).set('Cookie', as(engineer)))
        .body as SimulationJob;
      expect(later.status).toBe('cancelled');
      expect(later.result).toBeUndefined();
      expect(later.progressPct).toBe(cancelled.body.progressPct);
    });

    it('cancels a queued job before it runs', async () => {
      const blocker = await start({ kind: 'full', document: doubler(), options: LONG_RUN });
      const queued = await start({ kind: 'startup', document: doubler(), options: SMALL_RUN });
      const cancelled = await http().post(`${base()}/${queued.body.jobId}/cancel`).set('Cookie', as(engineer));
      expect(cancelled.body.status).toBe('cancelled');
      await http().post(`${base()}/${blocker.body.jobId}/cancel`).set('Cookie', as(engineer));
      await new Promise((done) => setTimeout(done, 1500));
      const job = (await http().get(`${base()}/${queued.body.jobId}`).set('Cookie', as(engineer)))
        .body as SimulationJob;
      expect(job.status).toBe('cancelled');
      expect(job.startedAt).toBeNull();
    });

    it.each([
      ['fault-throw', /worker threw/],
      ['fault-exit', /exited with code/],
    ])(
      'fails only the job whose worker %s, with a clear error, and the next job still succeeds',
      async (kind, message) => {
        const failing = await start({ kind, document: doubler() });
        expect(failing.status).toBe(202);
        const { job } = await waitForEnd(failing.body.jobId);
        expect(job.status).toBe('failed');
        expect(job.error).toEqual({ code: 'worker_failed', message: expect.stringMatching(message) });
        expect(job.result).toBeUndefined();

        const next = await start({ kind: 'steady-state', document: doubler(), options: { cycles: 10 } });
        const after = await waitForEnd(next.body.jobId);
        expect(after.job.status).toBe('succeeded');
        expect(after.job.result!.summary.ripplePeakToPeakV).toEqual(expect.any(Number));
      },
    );

    it('fails a job whose design the simulator refuses, naming the reason', async () => {
      // A blocking-oscillator driver feeds half-wave ladders only (shared build-driver-circuit.ts).
      const driven = structuredClone(designExamples.surfaceChargeTester) as Design;
      driven.multiplier.cellCount = 1;
      driven.multiplier.topology = 'full-wave';
      driven.multiplier.capacitors = [0, 1, 2].map(() => ({
        ...designExamples.surfaceChargeTester.multiplier.capacitors[0]!,
      }));
      const started = await start({ kind: 'startup', document: driven, options: { cycles: 5 } });
      expect(started.status).toBe(202);
      const { job } = await waitForEnd(started.body.jobId);
      expect(job.status).toBe('failed');
      expect(job.error!.message).toMatch(/half-wave/);
    });
  });

  describe('a stored revision', () => {
    it('simulates revision 1 of a design of the project, recording design and revision on the job', async () => {
      const design = await createDesign(testApp, project.id, engineer.id, {
        name: 'Stored doubler',
        from: { kind: 'document', document: doubler() },
      });
      const started = await start({ kind: 'startup', designId: design.id, revisionNumber: 1, options: SMALL_RUN });
      expect(started.status).toBe(202);
      const { job } = await waitForEnd(started.body.jobId);
      expect(job.status).toBe('succeeded');
      expect(job.designId).toBe(design.id);
      expect(job.revisionNumber).toBe(1);
      // The same document sent inline gives the same figures: the run used the stored revision's document.
      const inline = await waitForEnd(
        (await start({ kind: 'startup', document: doubler(), options: SMALL_RUN })).body.jobId,
      );
      expect(inline.job.designId).toBeNull();
      expect(job.result!.summary.outputMeanV).toBe(inline.job.result!.summary.outputMeanV);
      expect(job.result!.summary.cyclesSimulated).toBe(30);
    });

    it('returns 404 naming designId for a design of another project or an unknown design', async () => {
      const foreign = await createDesign(testApp, otherProject.id, outsider.id);
      for (const designId of [foreign.id, randomUUID()]) {
        const response = await start({ kind: 'startup', designId, revisionNumber: 1 });
        expect(response.status).toBe(404);
        expect(response.body.field).toBe('designId');
      }
    });

    it('returns 404 naming the revision when the design has no such revision', async () => {
      const design = await createDesign(testApp, project.id, engineer.id);
      const response = await start({ kind: 'startup', designId: design.id, revisionNumber: 99 });
      expect(response.status).toBe(404);
      expect(response.body.field).toBe('revisionNumber');
      expect(response.body.message).toMatch(/Revision 99 not found/);
    });
  });

  describe('access', () => {
    it('returns 401 without a session', async () => {
      expect((await http().post(base()).send({ kind: 'startup', document: doubler() })).status).toBe(401);
      expect((await http().get(`${base()}/${randomUUID()}`)).status).toBe(401);
    });

    it('returns 404 to a non-member starting, reading or cancelling', async () => {
      const own = await start({ kind: 'startup', document: doubler(), options: { cycles: 2 } });
      expect((await start({ kind: 'startup', document: doubler() }, outsider)).status).toBe(404);
      expect((await http().get(`${base()}/${own.body.jobId}`).set('Cookie', as(outsider))).status).toBe(404);
      expect((await http().post(`${base()}/${own.body.jobId}/cancel`).set('Cookie', as(outsider))).status).toBe(404);
    });

    it('returns 403 to a reviewer starting or cancelling, but lets the reviewer read', async () => {
      const own = await start({ kind: 'startup', document: doubler(), options: { cycles: 2 } });
      const refused = await start({ kind: 'startup', document: doubler() }, reviewer);
      expect(refused.status).toBe(403);
      expect(refused.body.code).toBe('forbidden');
      expect((await http().post(`${base()}/${own.body.jobId}/cancel`).set('Cookie', as(reviewer))).status).toBe(403);
      const read = await http().get(`${base()}/${own.body.jobId}`).set('Cookie', as(reviewer));
      expect(read.status).toBe(200);
      expect(read.body.id).toBe(own.body.jobId);
    });

    it('returns 404 for a job of another project, a random id and a malformed id', async () => {
      const foreign = await start(
        { kind: 'startup', document: doubler(), options: { cycles: 2 } },
        outsider,
        otherProject.id,
      );
      expect(foreign.status).toBe(202);
      const viaOurProject = await http().get(`${base()}/${foreign.body.jobId}`).set('Cookie', as(engineer));
      expect(viaOurProject.status).toBe(404);
      expect(viaOurProject.body.field).toBe('jobId');
      expect((await http().get(`${base()}/${randomUUID()}`).set('Cookie', as(engineer))).status).toBe(404);
      expect((await http().get(`${base()}/not-a-uuid`).set('Cookie', as(engineer))).status).toBe(404);
    });
  });

  describe('bad input', () => {
    it.each([
      ['kind', { document: doubler() }],
      ['kind', { kind: 'ripple', document: doubler() }],
      ['document', { kind: 'startup' }],
      ['document', { kind: 'startup', document: 'not a design' }],
      [
        'document.multiplier.cellCount',
        { kind: 'startup', document: { ...doubler(), multiplier: { ...doubler().multiplier, cellCount: 0 } } },
      ],
      ['options.cycles', { kind: 'startup', document: doubler(), options: { cycles: 0 } }],
      ['options.cycles', { kind: 'startup', document: doubler(), options: { cycles: 2.5 } }],
      ['options.maxStepPerPeriod', { kind: 'startup', document: doubler(), options: { maxStepPerPeriod: 2 } }],
      ['options.maxStepPerPeriod', { kind: 'startup', document: doubler(), options: { maxStepPerPeriod: 'fine' } }],
      ['designId', { kind: 'startup', designId: 'nope', revisionNumber: 1 }],
      ['document', { kind: 'startup', document: doubler(), designId: randomUUID(), revisionNumber: 1 }],
      ['revisionNumber', { kind: 'startup', designId: randomUUID() }],
      ['designId', { kind: 'startup', revisionNumber: 1 }],
    ])('returns 400 naming %s', async (field, body) => {
      const response = await start(body);
      expect(response.status).toBe(400);
      expect(response.body.field).toBe(field);
      expect(response.body.message).toEqual(expect.any(String));
    });
  });
});
