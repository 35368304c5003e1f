import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import type { Calibration, DesignDetail } from '@ladderwright/shared/api';
import { applyParameterValues, startUpSimulation } from '@ladderwright/shared/calibration';
import { RevisionModel } from '../src/revisions/revision.model';
import { CalibrationEvaluationsService } from '../src/simulations/calibration-evaluations.service';
import { SimulationPoolService } from '../src/simulations/simulation-pool.service';
import { SimulationQueueService } from '../src/simulations/simulation-queue.service';
import { SimulationRunnerService } from '../src/simulations/simulation-runner.service';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies } from './utils/sign-in';

// Two app instances against one database, each with one simulation worker: a start-up calibration started
// through the first runs its model runs on both instances' worker pools (rows of calibration_evaluations
// claimed by each instance). The start-up curve is the simulator's own at gain 80 (the fit's numerics are
// checked against ngspice in shared/test/calibration); here the spread, the cancel, the clean-up and an
// instance dying mid-run are under test. Heartbeats every 2 s: a model run whose instance stops beating is
// given back after 6 s.
const HEARTBEAT_MS = 2_000;

describe('calibration model runs across app instances', () => {
  let first: TestApp;
  let second: TestApp;
  let dataDir: string;
  let engineer: TestUser;
  let project: TestProject;
  let design: DesignDetail;
  let captureId = '';
  const cookies = new SessionCookies();
  const { as } = cookies;
  const http = () => request(first.app.getHttpServer());
  const revisionUrl = () => `/api/projects/${project.id}/designs/${design.id}/revisions/1`;

  /** Instances seen in the model-run rows, polled until the calibration ends. */
  async function waitWatchingInstances(id: string, timeoutMs: number): Promise<[Calibration, Set<string>]> {
    const seen = new Set<string>();
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const rows = await first.sequelize.query<{ instance_id: string }>(
        'SELECT DISTINCT instance_id FROM calibration_evaluations WHERE instance_id IS NOT NULL',
        { type: QueryTypes.SELECT },
      );
      for (const row of rows) seen.add(row.instance_id);
      const response = await http().get(`${revisionUrl()}/calibrations/${id}`).set('Cookie', as(engineer));
      const calibration = response.body as Calibration;
      if (calibration.status !== 'queued' && calibration.status !== 'running') return [calibration, seen];
      if (Date.now() > deadline) throw new Error(`calibration ${id} still ${calibration.status}`);
      await new Promise((done) => setTimeout(done, 50));
    }
  }

  /** Starts a fit of gain and cell resistance to the start-up run (two model runs a Jacobian). */
  async function startGainAndCellFit(): Promise<request.Response> {
    const start = await http()
      .post(`${revisionUrl()}/calibrations`)
      .set('Cookie', as(engineer))
      .send({
        parameters: [{ id: 'transistorGain' }, { id: 'cellInternalResistance' }],
        runs: [{ benchRunId: captureId, use: 'start-up' }],
      });
    expect(start.status).toBe(202);
    return start;
  }

  async function openRows(): Promise<number> {
    const [row] = await first.sequelize.query<{ count: string }>(
      'SELECT count(*) AS count FROM calibration_evaluations',
      { type: QueryTypes.SELECT },
    );
    return Number(row!.count);
  }

  beforeAll(async () => {
    dataDir = mkdtempSync(join(tmpdir(), 'lw-calibration-instances-'));
    const env = { dataDir, simulationWorkers: 1, simulationHeartbeatMs: HEARTBEAT_MS };
    first = await createTestApp({ env });
    second = await createTestApp({ env, prepareDatabase: false });
    engineer = await createUser(first, { role: 'engineer' });
    project = await createProject([{ userId: engineer.id, role: 'engineer' }]);
    design = await createDesign(first, project.id, engineer.id, {
      from: { kind: 'template', templateId: 'surfaceChargeTester' },
    });
    await cookies.signIn(first, [engineer]);
    const revision = await RevisionModel.findOne({ where: { designId: design.id, number: 1 } });
    const document = revision!.document;
    // The first 0.2 ms after the push-button: some six cycles of the tester's oscillator (about 31 µs each), so
    // that a model run lasts long enough (a second or so) for the other instance's poll (0.5 s) to find runs
    // of the same batch still waiting.
    const times = Array.from({ length: 8 }, (_, i) => ((i + 1) * 0.2e-3) / 8);
    const volts = startUpSimulation(applyParameterValues(document, ['transistorGain'], [80]), times);
    const csv = `time (us),voltage (V)\n${times.map((t, i) => `${(t * 1e6).toFixed(4)},${volts[i]!.toFixed(4)}`).join('\n')}\n`;
    const upload = await http()
      .post(`${revisionUrl()}/bench-runs`)
      .set('Cookie', as(engineer))
      .field('kind', 'scope-capture')
      .field('title', 'Push-button start')
      .attach('data', Buffer.from(csv), { filename: 'start.csv', contentType: 'text/csv' });
    expect(upload.status).toBe(201);
    captureId = upload.body.id as string;
  }, 180_000);
  afterAll(async () => {
    await second?.close();
    await first?.close();
    rmSync(dataDir, { recursive: true, force: true });
  });

  it("runs a start-up calibration's model runs on both instances' worker pools", async () => {
    const start = await startGainAndCellFit();
    const [done, instances] = await waitWatchingInstances(start.body.id as string, 240_000);
    expect(done.status).toBe('succeeded');
    expect(done.result!.residuals[0]!.rmsAfterV).toBeLessThan(done.result!.residuals[0]!.rmsBeforeV);
    expect([...instances].sort()).toEqual(
      [first, second].map((app) => app.app.get(CalibrationEvaluationsService).instanceId).sort(),
    );
    expect(await openRows()).toBe(0);
  }, 300_000);

  it('cancels a calibration whose model runs are queued on both instances, leaving no model run behind', async () => {
    const start = await http()
      .post(`${revisionUrl()}/calibrations`)
      .set('Cookie', as(engineer))
      .send({ parameters: [{ id: 'couplingCoefficient' }], runs: [{ benchRunId: captureId, use: 'start-up' }] });
    expect(start.status).toBe(202);
    const deadline = Date.now() + 60_000;
    while ((await openRows()) === 0 && Date.now() < deadline) await new Promise((done) => setTimeout(done, 50));
    const cancelled = await http()
      .post(`${revisionUrl()}/calibrations/${start.body.id}/cancel`)
      .set('Cookie', as(engineer))
      .send({});
    expect(cancelled.body.status).toBe('cancelled');
    const [later] = await waitWatchingInstances(start.body.id as string, 10_000);
    expect(later.status).toBe('cancelled');
    while ((await openRows()) > 0 && Date.now() < deadline) await new Promise((done) => setTimeout(done, 50));
    expect(await openRows()).toBe(0);
  }, 120_000);

  // Last in this file: it leaves one instance dead (the other, and the database, are closed in afterAll).
  it('gives a model run whose instance died mid-run to the other instance, and the calibration ends well', async () => {
    const start = await startGainAndCellFit();
    const id = start.body.id as string;
    const deadline = Date.now() + 120_000;
    const poll = () => new Promise((done) => setTimeout(done, 50));
    // The instance that runs the fit stays; the other one dies while it runs a model run.
    const runnerName = (app: TestApp) =>
      (app.app.get(SimulationRunnerService) as unknown as { instanceName: string }).instanceName;
    let fitter: TestApp | null = null;
    while (!fitter && Date.now() < deadline) {
      const [job] = await first.sequelize.query<{ run_by: string | null }>(
        `SELECT j.run_by FROM simulation_jobs j JOIN calibrations c ON c.simulation_job_id = j.id WHERE c.id = :id`,
        { replacements: { id }, type: QueryTypes.SELECT },
      );
      fitter = [first, second].find((app) => job?.run_by === runnerName(app)) ?? null;
      if (!fitter) await poll();
    }
    expect(fitter).not.toBeNull();
    const doomed = fitter === first ? second : first;
    const doomedId = doomed.app.get(CalibrationEvaluationsService).instanceId;
    let lostRunId: string | null = null;
    while (!lostRunId && Date.now() < deadline) {
      const [row] = await first.sequelize.query<{ id: string }>(
        `SELECT id FROM calibration_evaluations WHERE instance_id = :doomedId AND status = 'running'`,
        { replacements: { doomedId }, type: QueryTypes.SELECT },
      );
      lostRunId = row?.id ?? null;
      if (!lostRunId) await poll();
    }
    expect(lostRunId).not.toBeNull();
    // The instance dies: from now on it writes nothing (no heartbeat, no answer), its worker threads end and
    // its queue takes nothing more, as with a process killed mid-run.
    const silent = async () => undefined;
    Object.assign(doomed.app.get(CalibrationEvaluationsService), { beat: silent, finish: silent, execute: silent });
    await doomed.app.get(SimulationPoolService).onModuleDestroy();
    await doomed.app.get(SimulationQueueService).onModuleDestroy();

    // The lost run is given back (attempts 1) and taken by the instance left; the calibration succeeds long
    // before its time limit (SIMULATION_MAX_RUN_S, 600 s).
    let givenBack = false;
    let calibration: Calibration | null = null;
    const endBy = Date.now() + 240_000;
    while (Date.now() < endBy) {
      const [row] = await first.sequelize.query<{ attempts: number; instance_id: string | null }>(
        'SELECT attempts, instance_id FROM calibration_evaluations WHERE id = :lostRunId',
        { replacements: { lostRunId }, type: QueryTypes.SELECT },
      );
      if (row && row.attempts > 0) givenBack = true;
      const response = await http().get(`${revisionUrl()}/calibrations/${id}`).set('Cookie', as(engineer));
      calibration = response.body as Calibration;
      if (calibration.status !== 'queued' && calibration.status !== 'running') break;
      await poll();
    }
    expect(givenBack).toBe(true);
    expect(calibration?.status).toBe('succeeded');
    expect(await openRows()).toBe(0);
  }, 400_000);
});
