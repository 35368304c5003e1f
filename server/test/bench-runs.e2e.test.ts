import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import type { DesignDetail } from '@ladderwright/shared/api';
import { BenchRunEventModel } from '../src/bench-runs/bench-run-event.model';
import { BenchRunModel } from '../src/bench-runs/bench-run.model';
import { RevisionModel } from '../src/revisions/revision.model';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies } from './utils/sign-in';

const fixture = (name: string) => readFileSync(join(__dirname, 'fixtures', 'bench-runs', name));

// Hand-checked prediction (worked by hand, no outside source): regulation line 1000 V at no load to
// 800 V at 200 µA, mean 900 V and ripple 10 V at the operating load. Revision 2 carries it as its report.
const HAND_REPORT = {
  outputMeanV: -900,
  ripplePeakToPeakV: 10,
  analysis: { loadCurrentA: 100e-6 },
  curves: {
    regulation: [
      { x: 0, y: 1000 },
      { x: 100e-6, y: 900 },
      { x: 200e-6, y: 800 },
    ],
  },
};

describe('bench runs', () => {
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
  const runsUrl = (revision = 2) => `/api/projects/${project.id}/designs/${design.id}/revisions/${revision}/bench-runs`;
  const upload = (
    kind: string,
    data: Buffer | null,
    options: { revision?: number; user?: TestUser; tolerance?: string; name?: string } = {},
  ) => {
    const call = http()
      .post(runsUrl(options.revision))
      .set('Cookie', as(options.user ?? engineer))
      .field('kind', kind)
      .field('title', 'Prototype 2 on the bench');
    if (options.tolerance) call.field('tolerance', options.tolerance);
    if (data) call.attach('data', data, { filename: options.name ?? 'sweep.csv', contentType: 'text/csv' });
    return call;
  };

  beforeAll(async () => {
    dataDir = mkdtempSync(join(tmpdir(), 'lw-bench-'));
    testApp = await createTestApp({ env: { dataDir } });
    engineer = await createUser(testApp, { role: 'engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer' });
    outsider = await createUser(testApp, { role: 'engineer' });
    project = await createProject([
      { userId: engineer.id, role: 'engineer' },
      { userId: reviewer.id, role: 'reviewer' },
    ]);
    await createProject([{ userId: outsider.id, role: 'engineer' }]);
    design = await createDesign(testApp, project.id, engineer.id);
    const first = await RevisionModel.findOne({ where: { designId: design.id, number: 1 } });
    if (!first) throw new Error('revision 1 missing');
    await RevisionModel.create({
      designId: design.id,
      number: 2,
      document: first.document,
      report: HAND_REPORT as unknown as RevisionModel['report'],
      engineVersion: first.engineVersion,
      authorId: engineer.id,
      changeNote: 'hand-checked prediction',
      baseRevisionNumber: 1,
    });
    await cookies.signIn(testApp, [engineer, reviewer, outsider]);
  });
  afterAll(async () => {
    await testApp.close();
    rmSync(dataDir, { recursive: true, force: true });
  });

  describe('upload and comparison', () => {
    let runId = '';

    it('compares a load sweep with the hand-checked prediction, point by point', async () => {
      const response = await upload('load-sweep', fixture('ok/load-sweep.csv'), { tolerance: '5%' });
      expect(response.status).toBe(201);
      runId = response.body.id;
      const { comparison } = response.body;
      // (940 − 950)/950 = −0.0105263; (830 − 850)/850 = −0.0235294; 250 µA lies beyond the curve.
      expect(comparison.points.map((p: { predictedV: number | null }) => p.predictedV)).toEqual([950, 850, null]);
      expect(comparison.points[0].deviation).toBeCloseTo(-0.0105263158, 9);
      expect(comparison.points[1].deviation).toBeCloseTo(-0.0235294118, 9);
      expect(response.body).toMatchObject({ kind: 'load-sweep', tolerance: 0.05, pointCount: 3, verdict: 'pass' });
      // (0.05 − 0.0235294)/0.05·100 = 52.94 %.
      expect(response.body.marginPct).toBeCloseTo(52.9411765, 6);
      expect(response.body.points[0].x).toBeCloseTo(50e-6, 15);
    });

    it('stores the data file under its SHA-256 in the data folder', async () => {
      const sha256 = createHash('sha256').update(fixture('ok/load-sweep.csv')).digest('hex');
      const detail = await http().get(`${runsUrl()}/${runId}`).set('Cookie', as(reviewer));
      expect(detail.body.files).toEqual([
        expect.objectContaining({
          role: 'data',
          originalName: 'sweep.csv',
          sha256,
          sizeBytes: fixture('ok/load-sweep.csv').length,
        }),
      ]);
      expect(readdirSync(join(dataDir, 'uploads', sha256.slice(0, 2)))).toContain(sha256);
    });

    it('gives a marginal verdict against a tighter tolerance', async () => {
      const response = await upload('load-sweep', fixture('ok/load-sweep.csv'), { tolerance: '0.025' });
      expect(response.body.verdict).toBe('marginal');
      expect(response.body.marginPct).toBeCloseTo(5.8823529, 6);
    });

    it('compares a capture with metadata lines and kV/ms units on mean and ripple', async () => {
      const response = await upload('scope-capture', fixture('ok/scope-capture.csv'), { name: 'scope.csv' });
      expect(response.status).toBe(201);
      expect(response.body.metadata).toEqual(['Instrument, bench scope 2', 'Probe, 1000:1 HV probe']);
      // Triangle 895 -> 905 -> 895 V over 2 ms: mean 900 V, ripple 10 V, both as predicted.
      const [mean, ripple] = response.body.comparison.figures;
      expect(mean.measured).toBeCloseTo(900, 9);
      expect(ripple.measured).toBeCloseTo(10, 9);
      expect(response.body.verdict).toBe('pass');
      expect(response.body.tolerance).toBe(0.05);
    });

    it('accepts a PNG photo checked by its first bytes and serves it back', async () => {
      const response = await upload('load-sweep', fixture('ok/load-sweep.csv')).attach(
        'photos',
        fixture('ok/bench-photo.png'),
        {
          filename: 'bench.png',
          contentType: 'image/png',
        },
      );
      expect(response.status).toBe(201);
      const photo = response.body.files.find((file: { role: string }) => file.role === 'photo');
      expect(photo).toMatchObject({ contentType: 'image/png', originalName: 'bench.png' });
      const served = await http().get(`${runsUrl()}/${response.body.id}/files/${photo.id}`).set('Cookie', as(reviewer));
      expect(served.status).toBe(200);
      expect(served.headers['content-type']).toBe('image/png');
    });

    it('compares against the engine report of a real revision', async () => {
      const response = await upload('load-sweep', fixture('ok/load-sweep.csv'), { revision: 1 });
      expect(response.status).toBe(201);
      expect(response.body.comparison.predictedCurve.length).toBeGreaterThan(2);
      expect(['pass', 'marginal', 'fail']).toContain(response.body.verdict);
    });

    it('lists the runs of a revision, newest first, for any member', async () => {
      const response = await http().get(runsUrl()).set('Cookie', as(reviewer));
      expect(response.status).toBe(200);
      expect(response.body).toHaveLength(4);
      expect(response.body[3]).toMatchObject({ id: runId, verdict: 'pass', uploadedByName: engineer.displayName });
      expect(response.body[3].points).toBeUndefined();
    });
  });

  describe('bad input', () => {
    it('names the line and column of bad numbers', async () => {
      const response = await upload('scope-capture', fixture('not-ok/bad-numbers.csv'));
      expect(response.status).toBe(400);
      expect(response.body.issues.map((issue: { path: string }) => issue.path)).toEqual([
        'line 3, column V (V)',
        'line 4, column V (V)',
      ]);
    });

    it('refuses a unit that does not fit the column', async () => {
      const response = await upload('load-sweep', fixture('not-ok/bad-unit.csv'));
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('line 1, column current [uW]');
      expect(response.body.message).toContain("unit 'uW' is not a current unit");
    });

    it('refuses a file without the needed columns', async () => {
      const response = await upload('load-sweep', fixture('not-ok/missing-columns.csv'));
      expect(response.status).toBe(400);
      expect(response.body.message).toContain('No header row with current and voltage');
    });

    it('refuses a photo whose bytes are not PNG or JPEG', async () => {
      const response = await upload('load-sweep', fixture('ok/load-sweep.csv')).attach(
        'photos',
        fixture('not-ok/photo-not-image.png'),
        {
          filename: 'fake.png',
          contentType: 'image/png',
        },
      );
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('photos[0]');
      expect(response.body.message).toContain('not a PNG or JPEG image');
    });

    it('refuses a data file that is not CSV text', async () => {
      const response = await upload('load-sweep', fixture('ok/bench-photo.png'), { name: 'sweep.png' });
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('data');
    });

    it('returns 413 for a file over the limit', async () => {
      const big = Buffer.concat([Buffer.from('time,voltage\n'), Buffer.alloc(4 * 1024 * 1024 + 10, '1')]);
      const response = await upload('scope-capture', big);
      expect(response.status).toBe(413);
      expect(response.body.message).toContain('4 MB');
    });

    it('requires the data file, a known kind and a sensible tolerance', async () => {
      expect((await upload('load-sweep', null)).body).toMatchObject({ statusCode: 400, field: 'data' });
      expect((await upload('spectrum', fixture('ok/load-sweep.csv'))).body).toMatchObject({
        statusCode: 400,
        field: 'kind',
      });
      expect((await upload('load-sweep', fixture('ok/load-sweep.csv'), { tolerance: '150%' })).body).toMatchObject({
        statusCode: 400,
        field: 'tolerance',
      });
    });

    it('returns the same 404 for a revision that does not exist and for a malformed number', async () => {
      expect((await upload('load-sweep', fixture('ok/load-sweep.csv'), { revision: 9 })).status).toBe(404);
      const malformed = await http()
        .get(`/api/projects/${project.id}/designs/${design.id}/revisions/two/bench-runs`)
        .set('Cookie', as(engineer));
      expect(malformed.status).toBe(404);
      expect(malformed.body).toMatchObject({ field: 'revisionNumber', message: 'Revision two not found' });
    });

    it('returns 403 for a reviewer upload and 404 for a non-member', async () => {
      expect((await upload('load-sweep', fixture('ok/load-sweep.csv'), { user: reviewer })).status).toBe(403);
      expect((await upload('load-sweep', fixture('ok/load-sweep.csv'), { user: outsider })).status).toBe(404);
    });
  });

  describe('delete', () => {
    it('soft-deletes a run, keeps its rows and bytes, and records who deleted what', async () => {
      const created = await upload('load-sweep', fixture('ok/load-sweep.csv'));
      const id = created.body.id;
      expect((await http().delete(`${runsUrl()}/${id}`).set('Cookie', as(reviewer))).status).toBe(403);
      expect((await http().delete(`${runsUrl()}/${id}`).set('Cookie', as(engineer))).status).toBe(204);
      expect((await http().get(`${runsUrl()}/${id}`).set('Cookie', as(engineer))).status).toBe(404);
      const listed = (await http().get(runsUrl()).set('Cookie', as(engineer))).body.map(
        (run: { id: string }) => run.id,
      );
      expect(listed).not.toContain(id);
      const row = await BenchRunModel.findByPk(id);
      expect(row?.deletedBy).toBe(engineer.id);
      expect(row?.deletedAt).toBeInstanceOf(Date);
      const events = await BenchRunEventModel.findAll({ where: { benchRunId: id }, order: [['createdAt', 'ASC']] });
      expect(events.map((event) => [event.action, event.actorId])).toEqual([
        ['uploaded', engineer.id],
        ['deleted', engineer.id],
      ]);
      expect(events[1]?.detail).toMatchObject({ kind: 'load-sweep', files: [{ name: 'sweep.csv' }] });
      expect((await http().delete(`${runsUrl()}/${id}`).set('Cookie', as(engineer))).status).toBe(404);
    });
  });
});
