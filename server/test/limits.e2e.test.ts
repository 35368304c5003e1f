import request from 'supertest';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

/**
 * Limits of the domain and requests that used to freeze, crash or 500 the server. Each case has a bounded
 * time (the test timeout): before the limits, the large ladders below held the event loop for seconds to
 * minutes or ran the process out of memory.
 */
const BOUNDED_MS = 15_000;

/** A valid half-wave ladder of `cells` cells on a pulse secondary, from the ionizer demo. */
function pulseLadder(cells: number): Design {
  const design = structuredClone(designExamples.ionizerBar);
  const capacitor = design.multiplier.capacitors[0]!;
  design.drive = {
    kind: 'pulse',
    forwardPeakV: 600,
    flybackPeakV: 200,
    frequencyHz: 20_000,
    dutyCycle: 0.3,
    sourceResistanceOhm: 10,
  };
  design.multiplier = { ...design.multiplier, topology: 'half-wave', cellCount: cells };
  design.multiplier.capacitors = Array.from({ length: cells }, () => ({ ...capacitor }));
  return design;
}

describe('limits of the domain on every entry; no request freezes, crashes or 500s the server', () => {
  let testApp: TestApp;
  let lead: TestUser;
  let project: TestProject;
  let session: string;
  let designId: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    lead = await createUser(testApp, { role: 'lead' });
    project = await createProject([{ userId: lead.id, role: 'lead' }]);
    session = await signIn(testApp, lead.email, lead.password);
    designId = (await createDesign(testApp, project.id, lead.id)).id;
  });
  afterAll(async () => {
    await testApp?.close();
  });

  const http = () => request(testApp.app.getHttpServer());
  const projectPath = () => `/api/projects/${project.id}`;

  describe('a bleeder string of 1e9 resistors (once: heap out of memory) is a 400 on every entry', () => {
    const hostile = (): Design => {
      const design = structuredClone(designExamples.ionizerBar);
      design.outputNetwork.bleeder = { count: 1e9, valueOhm: 1e9, ratedPowerW: 0.5, limitingVoltageV: 2500 };
      return design;
    };
    const expectRefused = (response: request.Response, field: string) => {
      expect(response.status).toBe(400);
      expect(response.body.issues).toEqual(
        expect.arrayContaining([{ path: field, message: 'must not exceed 1000 (a limit of the domain)' }]),
      );
    };

    it(
      'on evaluate',
      async () => {
        const response = await http()
          .post('/api/analysis/evaluate')
          .set('Cookie', session)
          .send({ document: hostile() });
        expectRefused(response, 'document.outputNetwork.bleeder.count');
      },
      BOUNDED_MS,
    );

    it(
      'on save, create and import',
      async () => {
        const save = await http()
          .post(`${projectPath()}/designs/${designId}/revisions`)
          .set('Cookie', session)
          .send({ document: hostile(), baseRevisionNumber: 1, changeNote: 'more bleeders' });
        expectRefused(save, 'document.outputNetwork.bleeder.count');
        const create = await http()
          .post(`${projectPath()}/designs`)
          .set('Cookie', session)
          .send({ name: 'Huge bleeder', from: { kind: 'document', document: hostile() } });
        expectRefused(create, 'from.document.outputNetwork.bleeder.count');
        const imported = await http().post(`${projectPath()}/designs/import`).set('Cookie', session).send(hostile());
        expectRefused(imported, 'outputNetwork.bleeder.count');
      },
      BOUNDED_MS,
    );
  });

  it(
    'refuses a 2,000-cell ladder (once: minutes of event-loop time) naming the cell count',
    async () => {
      const response = await http()
        .post('/api/analysis/evaluate')
        .set('Cookie', session)
        .send({ document: pulseLadder(2000) });
      expect(response.status).toBe(400);
      expect(response.body.issues).toEqual(
        expect.arrayContaining([
          { path: 'document.multiplier.cellCount', message: 'must not exceed 400 (a limit of the domain)' },
        ]),
      );
    },
    BOUNDED_MS,
  );

  it(
    'answers health while the largest pulse ladder is evaluated, off the request thread',
    async () => {
      let evaluatedAt = 0;
      const evaluation = http()
        .post('/api/analysis/evaluate')
        .set('Cookie', session)
        .send({ document: pulseLadder(400) })
        .then((response) => {
          evaluatedAt = performance.now();
          return response;
        });
      // Engine work on the request thread would hold this timer, and the health request, until it ended.
      await new Promise((resolve) => setTimeout(resolve, 50));
      const health = await http().get('/api/health');
      const healthAt = performance.now();
      expect(health.status).toBe(200);
      const evaluated = await evaluation;
      expect(evaluated.status).toBe(200);
      expect(Math.abs(evaluated.body.report.outputMeanV)).toBeGreaterThan(0);
      expect(healthAt).toBeLessThan(evaluatedAt);
    },
    BOUNDED_MS,
  );

  describe('values that used to give 500 give 400 naming the field', () => {
    it('NUL and an unpaired surrogate in names and notes', async () => {
      const nul = await http()
        .post('/api/projects')
        .set('Cookie', session)
        .send({ name: 'Ion\u0000izers', productLine: 'x' });
      expect(nul.status).toBe(400);
      expect(nul.body).toMatchObject({ field: 'name', message: expect.stringContaining('U+0000') });
      const document = structuredClone(designExamples.detectorBias);
      document.notes = 'bias \ud800 note';
      const lone = await http()
        .post(`${projectPath()}/designs`)
        .set('Cookie', session)
        .send({ name: 'Lone surrogate', from: { kind: 'document', document } });
      expect(lone.status).toBe(400);
      expect(lone.body).toMatchObject({ field: 'from.document.notes', message: expect.stringContaining('surrogate') });
    });

    it('an unpaired surrogate in an e-mail at sign-in', async () => {
      const response = await http().post('/api/auth/sign-in').send({ email: 'a\udc00@northfold.test', password: 'x' });
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('email');
    });

    it(
      'a body nested 10,000 deep',
      async () => {
        const deep = `${'{"a":'.repeat(10_000)}1${'}'.repeat(10_000)}`;
        const response = await http()
          .post('/api/analysis/evaluate')
          .set('Cookie', session)
          .set('Content-Type', 'application/json')
          .send(`{"document":${deep}}`);
        expect(response.status).toBe(400);
        expect(response.body.field).toMatch(/^document(\.a)+$/);
        expect(response.body.message).toContain('nests deeper than 32 levels');
      },
      BOUNDED_MS,
    );

    it('page=1e20 on the design list', async () => {
      const response = await http().get(`${projectPath()}/designs?page=1e20`).set('Cookie', session);
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('page');
    });

    it('a cell chemistry "__proto__", a curve {"length": 3} and 1e5 bleeder resistors', async () => {
      const document = structuredClone(designExamples.surfaceChargeTester) as unknown as {
        drive: { driver: { supply: Record<string, unknown> } };
        outputNetwork: { bleeder: Record<string, unknown> };
      };
      document.drive.driver.supply.chemistry = '__proto__';
      document.drive.driver.supply.curve = { length: 3 };
      document.outputNetwork.bleeder = { count: 1e5, valueOhm: 1e7, ratedPowerW: 0.25, limitingVoltageV: 500 };
      const response = await http().post('/api/analysis/evaluate').set('Cookie', session).send({ document });
      expect(response.status).toBe(400);
      expect((response.body.issues as { path: string }[]).map((issue) => issue.path).sort()).toEqual([
        'document.drive.driver.supply.chemistry',
        'document.drive.driver.supply.curve',
        'document.outputNetwork.bleeder.count',
      ]);
    });

    it('an unknown key in a design document, named', async () => {
      const document = { ...structuredClone(designExamples.detectorBias), colour: 'red' };
      const response = await http().post('/api/analysis/evaluate').set('Cookie', session).send({ document });
      expect(response.status).toBe(400);
      expect(response.body.issues).toEqual([
        { path: 'document.colour', message: expect.stringContaining('unknown key') },
      ]);
    });
  });

  describe('bench data and part files are bounded, and so are their error lists', () => {
    it('refuses a bench data file of 330,000 rows naming the data file', async () => {
      const csv = `current (uA),voltage (V)\n${Array.from({ length: 330_000 }, (_, i) => `${i % 100},${1000 - (i % 100)}`).join('\n')}`;
      const response = await http()
        .post(`${projectPath()}/designs/${designId}/revisions/1/bench-runs`)
        .set('Cookie', session)
        .field('kind', 'load-sweep')
        .attach('data', Buffer.from(csv), { filename: 'sweep.csv', contentType: 'text/csv' });
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ field: 'data', message: expect.stringContaining('20000 data rows') });
    });

    it('answers a parts CSV of commas with a short error, and caps a long error list with a count', async () => {
      const commas = ','.repeat(512 * 1024 - 1);
      const refused = await http()
        .post(`${projectPath()}/parts/import?dryRun=true`)
        .set('Cookie', session)
        .attach('file', Buffer.from(commas), { filename: 'parts.csv', contentType: 'text/csv' });
      expect(refused.status).toBe(400);
      expect(JSON.stringify(refused.body).length).toBeLessThan(2_000);
      const rows = Array.from({ length: 300 }, (_, i) => `NF-BAD-${i},capacitor,,,,,,,,oops,`);
      const csv = `code,kind,description,valueSi,tolerance,ratedVoltageV,ratedCurrentA,ratedSurgeCurrentA,ratedPowerW,unitCost,sizeMm\n${rows.join('\n')}`;
      const preview = await http()
        .post(`${projectPath()}/parts/import?dryRun=true`)
        .set('Cookie', session)
        .attach('file', Buffer.from(csv), { filename: 'parts.csv', contentType: 'text/csv' });
      expect(preview.status).toBe(200);
      expect(preview.body.errors).toHaveLength(101);
      expect(preview.body.errors[100].message).toMatch(/^and \d+ more problems not listed$/);
    });

    it('refuses a part description of 500 kB naming it', async () => {
      const response = await http()
        .post(`${projectPath()}/parts`)
        .set('Cookie', session)
        .send({
          code: 'NF-C103-3K',
          kind: 'capacitor',
          description: 'x'.repeat(500_000),
          valueSi: '10n',
          ratedVoltageV: '3k',
          unitCost: 1,
        });
      expect(response.status).toBe(400);
      expect(response.body.issues).toEqual(
        expect.arrayContaining([{ path: 'description', message: 'description must be at most 500 characters' }]),
      );
    });
  });
});

describe('the engine time budget', () => {
  let testApp: TestApp;
  let session: string;

  beforeAll(async () => {
    testApp = await createTestApp({ env: { engineBudgetMs: 1 } });
    const lead = await createUser(testApp, { role: 'lead' });
    session = await signIn(testApp, lead.email, lead.password);
  });
  afterAll(async () => {
    await testApp?.close();
  });

  it(
    'refuses engine work past the budget with a 422 that names the budget',
    async () => {
      const response = await request(testApp.app.getHttpServer())
        .post('/api/analysis/evaluate')
        .set('Cookie', session)
        .send({ document: pulseLadder(400) });
      expect(response.status).toBe(422);
      expect(response.body).toMatchObject({
        code: 'budget_exceeded',
        message: expect.stringContaining('budget of 1 ms'),
      });
    },
    BOUNDED_MS,
  );
});
