import request from 'supertest';
import type { SimulationJob, WaveformTrace } from '@ladderwright/shared/api';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { biasDoubler } from './fixtures/simulations/bias-doubler';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

/** Points of a trace at most: the worker's 500 min/max buckets keep two samples each. */
const MAX_POINTS = 1000;

describe('simulation discharge traces', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let project: TestProject;
  let cookie = '';

  async function run(body: object): Promise<SimulationJob> {
    const started = await http().post(`/api/projects/${project.id}/simulations`).set('Cookie', cookie).send(body);
    expect(started.status).toBe(202);
    const deadline = Date.now() + 60_000;
    for (;;) {
      const job = (
        await http().get(`/api/projects/${project.id}/simulations/${started.body.jobId}`).set('Cookie', cookie)
      ).body as SimulationJob;
      if (job.status !== 'queued' && job.status !== 'running') return job;
      if (Date.now() > deadline) throw new Error(`job still ${job.status}`);
      await new Promise((done) => setTimeout(done, 100));
    }
  }

  beforeAll(async () => {
    testApp = await createTestApp({ env: { simulationWorkers: 1 } });
    engineer = await createUser(testApp, { role: 'engineer' });
    project = await createProject([{ userId: engineer.id, role: 'engineer' }]);
    cookie = await signIn(testApp, engineer.email, engineer.password);
  });
  afterAll(async () => testApp.close());

  it('gives one trace per capacitor, each from its steady value down to the safe level at the discharge time', async () => {
    const design = biasDoubler();
    const job = await run({ kind: 'discharge', document: design, options: { maxStepPerPeriod: 100 } });
    expect(job.status).toBe('succeeded');
    const { summary, waveforms } = job.result!;
    // The design's rule '60V-5s' discharges to 60 V (NFPA 79 6.5.1, REFERENCES.md §4, read).
    expect(summary.safeVoltageV).toBe(60);
    expect(summary.dischargeTimeS).toBeGreaterThan(0);
    const discharge = waveforms.filter((w: WaveformTrace) => w.phase === 'discharge');
    expect(discharge.map((w) => w.name)).toEqual(['V(top)', 'V(C1)', 'V(C2)']);

    // Steady capacitor voltages from the engine's node voltages (an independent method: the charge-transfer
    // model): C1 spans the winding end s to n1, C2 the ladder top to ground.
    const nodes = analyzeDesign(design).analysis.nodes;
    const meanOf = (id: string) => nodes.find((n) => n.id === id)!.meanV;
    const steadyV: Record<string, number> = { 'V(C1)': meanOf('n1') - meanOf('s'), 'V(C2)': meanOf('top') };
    for (const trace of discharge) {
      expect(trace.timeS).toHaveLength(trace.values.length);
      expect(trace.values.length).toBeLessThanOrEqual(MAX_POINTS);
      expect(trace.timeS[0]).toBe(0);
      const expectedStartV = steadyV[trace.name];
      if (expectedStartV !== undefined) {
        // 2 %: the engine's mean is within 0.5 % of the simulator's on doublers (shared engine-vs-simulator
        // test) and the switch-off instant sits somewhere in a ripple of well under 1 %.
        expect(Math.abs(trace.values[0]! / expectedStartV - 1)).toBeLessThan(0.02);
      }
      // Every trace ends on the step that took the output through the safe level: at or just after the
      // reported time (the crossing is interpolated inside that last step), below the level.
      const endS = trace.timeS[trace.timeS.length - 1]!;
      expect(endS).toBeGreaterThanOrEqual(summary.dischargeTimeS!);
      expect(endS).toBeLessThan(summary.dischargeTimeS! * 1.01);
      // The output is below the level; C1 feeds the top through D2 once the top has fallen below it, so it
      // ends one forward drop above the top: allowed 1 V (Shockley n·Vt·ln(1 + I/Is) at microamps is ~0.6 V).
      const diodeDropV = trace.name === 'V(top)' ? 0 : 1;
      expect(Math.abs(trace.values[trace.values.length - 1]!)).toBeLessThan(summary.safeVoltageV! + diodeDropV);
    }
  }, 90_000);

  it('gives no discharge traces and no safe level for a start-up job', async () => {
    const job = await run({ kind: 'startup', document: biasDoubler(), options: { cycles: 30, maxStepPerPeriod: 40 } });
    expect(job.status).toBe('succeeded');
    expect(job.result!.summary.safeVoltageV).toBeNull();
    expect(job.result!.summary.dischargeTimeS).toBeNull();
    expect(job.result!.waveforms.filter((w: WaveformTrace) => w.phase === 'discharge')).toEqual([]);
  });
});
