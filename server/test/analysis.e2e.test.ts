import request from 'supertest';
import { designDocumentSchema, designExamples } from '@ladderwright/shared/designs';
import { ENGINE_VERSION } from '@ladderwright/shared/multiplier';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

describe('analysis, design schema and templates', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let reviewer: TestUser;
  let cookie: string;

  beforeAll(async () => {
    testApp = await createTestApp();
    reviewer = await createUser(testApp, { role: 'reviewer' });
    cookie = await signIn(testApp, reviewer.email, reviewer.password);
  });
  afterAll(async () => testApp.close());

  describe('POST /api/analysis/evaluate', () => {
    it("returns the engine's report for an unsaved document, to any signed-in account", async () => {
      const response = await http()
        .post('/api/analysis/evaluate')
        .set('Cookie', cookie)
        .send({ document: designExamples.detectorBias });
      expect(response.status).toBe(200);
      expect(response.body.engineVersion).toBe(ENGINE_VERSION);
      expect(response.body.report.designName).toBe('Detector tube bias, 900 V');
      // A tripler on a 320 V peak secondary: the no-load output lies below the ideal 3 × 320 V = 960 V.
      expect(response.body.report.noLoadOutputV).toBeGreaterThan(800);
      expect(response.body.report.noLoadOutputV).toBeLessThanOrEqual(960);
      expect(Array.isArray(response.body.report.checks)).toBe(true);
      // The rule texts once, by key: the tripler's three capacitors share each stress rule.
      const checks = response.body.report.checks as { ruleKey: string }[];
      expect(checks.every((check) => response.body.report.checkRules[check.ruleKey] !== undefined)).toBe(true);
      expect(Object.keys(response.body.report.checkRules).length).toBeLessThan(checks.length);
    });

    it('returns 400 naming every offending field under document', async () => {
      const document = structuredClone(designExamples.detectorBias) as unknown as {
        multiplier: { capacitors: { valueF: unknown }[] };
        drive: { frequencyHz: unknown };
      };
      document.multiplier.capacitors[1]!.valueF = -1;
      document.drive.frequencyHz = 'fast';
      const response = await http().post('/api/analysis/evaluate').set('Cookie', cookie).send({ document });
      expect(response.status).toBe(400);
      expect(response.body.code).toBe('invalid_design');
      const paths = response.body.issues.map((issue: { path: string }) => issue.path);
      expect(paths).toEqual(
        expect.arrayContaining(['document.multiplier.capacitors[1].valueF', 'document.drive.frequencyHz']),
      );
      expect(response.body.field).toBe(paths[0]);
    });

    it('returns 400 naming document when it is missing', async () => {
      const response = await http().post('/api/analysis/evaluate').set('Cookie', cookie).send({});
      expect(response.status).toBe(400);
      expect(response.body.field).toBe('document');
      expect(response.body.message).toBe('document is required');
    });

    it('returns 400 naming schemaVersion for a document of another version', async () => {
      const document = { ...designExamples.detectorBias, schemaVersion: 2 };
      const response = await http().post('/api/analysis/evaluate').set('Cookie', cookie).send({ document });
      expect(response.status).toBe(400);
      expect(response.body).toMatchObject({ code: 'unsupported_version', field: 'document.schemaVersion' });
    });

    it('returns 401 without a session', async () => {
      const response = await http().post('/api/analysis/evaluate').send({ document: designExamples.detectorBias });
      expect(response.status).toBe(401);
    });
  });

  describe('GET /api/design-schema and /api/design-templates', () => {
    it('serves the design document JSON Schema', async () => {
      const response = await http().get('/api/design-schema').set('Cookie', cookie);
      expect(response.status).toBe(200);
      expect(response.body).toEqual(JSON.parse(JSON.stringify(designDocumentSchema)));
    });

    it('serves the four demo templates with id, name, summary and a valid document', async () => {
      const response = await http().get('/api/design-templates').set('Cookie', cookie);
      expect(response.status).toBe(200);
      expect(response.body.map((template: { id: string }) => template.id).sort()).toEqual([
        'detectorBias',
        'ionizerBar',
        'precipitatorCell',
        'surfaceChargeTester',
      ]);
      const detector = response.body.find((template: { id: string }) => template.id === 'detectorBias');
      expect(detector).toEqual({
        id: 'detectorBias',
        name: designExamples.detectorBias.name,
        summary: designExamples.detectorBias.notes,
        document: designExamples.detectorBias,
      });
    });

    it.each(['/api/design-schema', '/api/design-templates'])('returns 401 for %s without a session', async (path) => {
      expect((await http().get(path)).status).toBe(401);
    });
  });

  describe('API docs', () => {
    it('includes the design document schema as a component that the evaluate body refers to', async () => {
      const response = await http().get('/api/docs-json');
      expect(response.status).toBe(200);
      const schemas = response.body.components.schemas;
      expect(schemas.DesignDocument.required).toEqual(designDocumentSchema.required);
      const refs = JSON.stringify(schemas.DesignDocument).match(/#\/components\/schemas\/[A-Za-z_]+/g) ?? [];
      expect(refs.length).toBeGreaterThan(0);
      for (const ref of refs) expect(schemas[ref.replace('#/components/schemas/', '')]).toBeDefined();
      expect(JSON.stringify(schemas.EvaluateDesignDto)).toContain('#/components/schemas/DesignDocument');
      const listDesigns = response.body.paths['/api/projects/{projectId}/designs'].get;
      const parameterNames = listDesigns.parameters.map((parameter: { name: string }) => parameter.name);
      expect(parameterNames).toEqual(
        expect.arrayContaining(['projectId', 'q', 'state', 'ownerId', 'sort', 'order', 'page', 'pageSize']),
      );
      const saveRevision = response.body.paths['/api/projects/{projectId}/designs/{designId}/revisions'].post;
      expect(saveRevision.parameters.map((parameter: { name: string }) => parameter.name)).toEqual(
        expect.arrayContaining(['projectId', 'designId']),
      );
      expect(Object.keys(response.body.paths)).toEqual(
        expect.arrayContaining([
          '/api/projects/{projectId}/designs',
          '/api/projects/{projectId}/designs/{designId}/revisions',
        ]),
      );
    });
  });
});
