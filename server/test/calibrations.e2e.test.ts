import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import type { Calibration, DesignDetail } from '@ladderwright/shared/api';
import { applyParameterValues, loadSweepEstimate } from '@ladderwright/shared/calibration';
import { RevisionModel } from '../src/revisions/revision.model';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies } from './utils/sign-in';

// A load sweep of the demo handheld tester made by the engine's own estimate with the transistor gain at 80
// instead of the design's 100 (the fit's numerics are checked against ngspice in shared/test/calibration;
// here the job, its progress, cancel, bad data and the permissions are under test). Statuses follow
// shared/src/auth/permissions.ts (non-member 404, role without design.write 403); common practice, no source.
const CURRENTS_A = [0, 5e-6, 10e-6, 15e-6, 20e-6, 25e-6];

function sweepCsv(currentsA: number[], voltsV: number[], voltageUnit = 'V', factor = 1): Buffer {
  const rows = currentsA.map((a, i) => `${(a * 1e6).toFixed(3)},${(voltsV[i]! * factor).toFixed(4)}`);
  return Buffer.from(`current (uA),voltage (${voltageUnit})\n${rows.join('\n')}\n`);
}

describe('calibrations', () => {
  let testApp: TestApp;
  let dataDir: string;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let reviewer: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  let design: DesignDetail;
  const cookies = new SessionCookies();
  const { as } = cookies;
  const revisionUrl = () => `/api/projects/${project.id}/designs/${design.id}/revisions/1`;

  async function uploadSweep(data: Buffer, kind = 'load-sweep', title = 'Prototype sweep'): Promise<string> {
    const response = await http()
      .post(`${revisionUrl()}/bench-runs`)
      .set('Cookie', as(engineer))
      .field('kind', kind)
      .field('title', title)
      .attach('data', data, { filename: 'run.csv', contentType: 'text/csv' });
    expect(response.status).toBe(201);
    return response.body.id as string;
  }

  async function waitForEnd(id: string, timeoutMs = 60_000): Promise<Calibration> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const response = await http().get(`${revisionUrl()}/calibrations/${id}`).set('Cookie', as(engineer));
      expect(response.status).toBe(200);
      const calibration = response.body as Calibration;
      if (calibration.status !== 'queued' && calibration.status !== 'running') return calibration;
      if (Date.now() > deadline) throw new Error(`calibration ${id} still ${calibration.status}`);
      await new Promise((done) => setTimeout(done, 100));
    }
  }

  let sweepId = '';

  beforeAll(async () => {
    dataDir = mkdtempSync(join(tmpdir(), 'lw-calibration-'));
    testApp = await createTestApp({ env: { dataDir, simulationWorkers: 2 } });
    engineer = await createUser(testApp, { role: 'engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer' });
    outsider = await createUser(testApp, { role: 'engineer' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: reviewer.id, role: 'reviewer' },
    ]);
    await createProject([{ userId: outsider.id, role: 'engineer' }]);
    design = await createDesign(testApp, project.id, engineer.id, {
      from: { kind: 'template', templateId: 'surfaceChargeTester' },
    });
    await cookies.signIn(testApp, [engineer, reviewer, outsider]);
    const revision = await RevisionModel.findOne({ where: { designId: design.id, number: 1 } });
    const truth = applyParameterValues(revision!.document, ['transistorGain'], [80]);
    sweepId = await uploadSweep(sweepCsv(CURRENTS_A, loadSweepEstimate(truth, CURRENTS_A)));
  });
  afterAll(async () => {
    await testApp.close();
    rmSync(dataDir, { recursive: true, force: true });
  });

  it('lists the parameters the engine can fit for a driver design, with prior ranges', async () => {
    const response = await http().get(`${revisionUrl()}/calibrations/parameters`).set('Cookie', as(reviewer));
    expect(response.status).toBe(200);
    const ids = (response.body as { id: string }[]).map((p) => p.id);
    expect(ids).toEqual(expect.arrayContaining(['couplingCoefficient', 'transistorGain', 'cellInternalResistance']));
    expect(ids).not.toContain('driveSourceResistance');
  });

  it('runs a calibration as a job, recovers the gain and starts the next revision from it', async () => {
    const start = await http()
      .post(`${revisionUrl()}/calibrations`)
      .set('Cookie', as(engineer))
      .send({ parameters: [{ id: 'transistorGain' }], runs: [{ benchRunId: sweepId, use: 'load-sweep' }] });
    expect(start.status).toBe(202);
    expect(['queued', 'running']).toContain(start.body.status);
    const done = await waitForEnd(start.body.id as string);
    expect(done.status).toBe('succeeded');
    const gain = done.result!.parameters[0]!;
    // The sweep came from the same estimate at 80: the fit lands on it (to 1 %, the finite-difference steps).
    expect(Math.abs(gain.value / 80 - 1)).toBeLessThan(0.01);
    expect(done.result!.residuals[0]!.rmsAfterV).toBeLessThan(done.result!.residuals[0]!.rmsBeforeV);
    expect(done.input.runs[0]).toMatchObject({ benchRunId: sweepId, use: 'load-sweep', label: 'Prototype sweep' });

    const listed = await http().get(`${revisionUrl()}/calibrations`).set('Cookie', as(reviewer));
    expect(listed.body.map((c: Calibration) => c.id)).toContain(done.id);

    const revision = await http()
      .post(`${revisionUrl()}/calibrations/${done.id}/revision`)
      .set('Cookie', as(engineer))
      .send({});
    expect(revision.status).toBe(201);
    expect(revision.body.revisionNumber).toBe(2);
    expect(revision.body.changeNote).toContain("'Prototype sweep'");
    const saved = await RevisionModel.findOne({ where: { designId: design.id, number: 2 } });
    const driver = saved!.document.drive.kind === 'driver' ? saved!.document.drive.driver : null;
    expect(driver!.transistor.forwardBeta).toBeCloseTo(gain.value, 9);
    expect(saved!.changeNote).toBe(revision.body.changeNote);
    const after = await http().get(`${revisionUrl()}/calibrations/${done.id}`).set('Cookie', as(engineer));
    expect(after.body.draftRevisionNumber).toBe(2);

    // The spec sheet of the calibrated revision carries a line for the calibration (pdftotext reads it).
    const pdf = await http()
      .get(`${revisionUrl()}/spec-sheet.pdf`)
      .set('Cookie', as(engineer))
      .buffer(true)
      .parse((response, done) => {
        const chunks: Buffer[] = [];
        response.on('data', (chunk: Buffer) => chunks.push(chunk));
        response.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    const sheetPath = join(dataDir, 'sheet.pdf');
    writeFileSync(sheetPath, pdf.body as Buffer);
    const text = execFileSync('pdftotext', [sheetPath, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(text).toContain('against Prototype sweep, 95 % intervals: Transistor current gain hFE');
    // Each interval names its method: a load sweep's cost is smooth, so its interval is the Jacobian's.
    expect(text).toContain(', Jacobian, linearized)');
  });

  it('cancels a running start-up calibration', async () => {
    // A start-up curve is fitted with the simulator: tens of cold starts, long enough to cancel mid-run.
    const times = Array.from({ length: 12 }, (_, i) => (i * 8e-3) / 11);
    const capture = `time (ms),voltage (V)\n${times.map((t, i) => `${(t * 1e3).toFixed(4)},${(i * 250).toFixed(1)}`).join('\n')}\n`;
    const captureId = await uploadSweep(Buffer.from(capture), 'scope-capture', 'Push-button start');
    const start = await http()
      .post(`${revisionUrl()}/calibrations`)
      .set('Cookie', as(engineer))
      .send({ parameters: [{ id: 'couplingCoefficient' }], runs: [{ benchRunId: captureId, use: 'start-up' }] });
    expect(start.status).toBe(202);
    const cancelled = await http()
      .post(`${revisionUrl()}/calibrations/${start.body.id}/cancel`)
      .set('Cookie', as(engineer))
      .send({});
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.status).toBe('cancelled');
    const later = await waitForEnd(start.body.id as string, 10_000);
    expect(later.status).toBe('cancelled');
  });

  describe('bad data is a 400 naming the run and the column, and no job', () => {
    it('refuses a sweep whose voltages were written in kV under a V header', async () => {
      const revision = await RevisionModel.findOne({ where: { designId: design.id, number: 1 } });
      const id = await uploadSweep(
        sweepCsv(CURRENTS_A, loadSweepEstimate(revision!.document, CURRENTS_A), 'V', 1e-3),
        'load-sweep',
        'Sweep in kV',
      );
      const response = await http()
        .post(`${revisionUrl()}/calibrations`)
        .set('Cookie', as(engineer))
        .send({ parameters: [{ id: 'transistorGain' }], runs: [{ benchRunId: id, use: 'load-sweep' }] });
      expect(response.status).toBe(400);
      expect(response.body.message).toMatch(/^Bench run 'Sweep in kV', column voltage: .*check the voltage unit/);
    });

    it('refuses a run with too few points', async () => {
      const id = await uploadSweep(sweepCsv([0, 5e-6, 10e-6], [3400, 3300, 3200]), 'load-sweep', 'Three points');
      const response = await http()
        .post(`${revisionUrl()}/calibrations`)
        .set('Cookie', as(engineer))
        .send({ parameters: [{ id: 'transistorGain' }], runs: [{ benchRunId: id, use: 'load-sweep' }] });
      expect(response.status).toBe(400);
      expect(response.body.message).toMatch(/^Bench run 'Three points', column voltage: 3 point\(s\)/);
    });

    it('refuses a load sweep read as a start-up curve, naming the field', async () => {
      const response = await http()
        .post(`${revisionUrl()}/calibrations`)
        .set('Cookie', as(engineer))
        .send({ parameters: [{ id: 'transistorGain' }], runs: [{ benchRunId: sweepId, use: 'start-up' }] });
      expect(response.status).toBe(400);
      expect(JSON.stringify(response.body)).toContain('runs[0].use');
    });

    it('refuses a prior range outside the declared one', async () => {
      const response = await http()
        .post(`${revisionUrl()}/calibrations`)
        .set('Cookie', as(engineer))
        .send({
          parameters: [{ id: 'couplingCoefficient', prior: { min: 0.5, max: 1.2 } }],
          runs: [{ benchRunId: sweepId, use: 'load-sweep' }],
        });
      expect(response.status).toBe(400);
      expect(JSON.stringify(response.body)).toContain('parameters[0].prior');
    });
  });

  describe('authorization', () => {
    const body = () => ({ parameters: [{ id: 'transistorGain' }], runs: [{ benchRunId: sweepId, use: 'load-sweep' }] });

    it('answers 404 to a non-member, for reads and starts', async () => {
      expect((await http().get(`${revisionUrl()}/calibrations`).set('Cookie', as(outsider))).status).toBe(404);
      expect((await http().post(`${revisionUrl()}/calibrations`).set('Cookie', as(outsider)).send(body())).status).toBe(
        404,
      );
    });

    it('answers 403 to a reviewer starting a calibration', async () => {
      expect((await http().post(`${revisionUrl()}/calibrations`).set('Cookie', as(reviewer)).send(body())).status).toBe(
        403,
      );
    });

    it('answers 401 without a session', async () => {
      expect((await http().get(`${revisionUrl()}/calibrations`)).status).toBe(401);
    });
  });
});
