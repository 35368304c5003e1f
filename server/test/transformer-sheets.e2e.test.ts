import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import type { DesignDetail } from '@ladderwright/shared/api';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import { demoTransformerSection } from '@ladderwright/shared/transformer';
import { formatQuantity } from '@ladderwright/shared/units';
import { createDesign } from './factories/create-design';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { SessionCookies } from './utils/sign-in';

/** Collects a binary response body (supertest buffers only text by default). */
function binary(response: request.Response, done: (error: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  response.on('data', (chunk: Buffer) => chunks.push(chunk));
  response.on('end', () => done(null, Buffer.concat(chunks)));
}

/** The PDF's text as poppler's pdftotext reads it (an outside reader of what the supplier gets). */
function pdfText(pdf: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'lw-transformer-sheet-'));
  writeFileSync(join(dir, 'sheet.pdf'), pdf);
  return execFileSync('pdftotext', ['-layout', join(dir, 'sheet.pdf'), '-'], { encoding: 'utf8' });
}

/** The demo handheld tester with its transformer designed from the demo E25 core. */
function designedTester(): Design {
  const document = structuredClone(designExamples.surfaceChargeTester);
  if (document.drive.kind !== 'driver') throw new Error('the tester has a driver stage');
  document.drive.driver.transformerChoice = 'designed';
  document.drive.driver.transformerDesign = structuredClone(demoTransformerSection);
  return document;
}

// Permissions as the supply's spec sheet (shared/src/auth/permissions.ts: specSheet.export lead,
// specSheet.exportDraft engineer and lead); NOT RELEASED until released: common practice, no source.
describe('transformer sheets', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());
  let engineer: TestUser;
  let reviewer: TestUser;
  let lead: TestUser;
  let project: TestProject;
  let designed: DesignDetail;
  let given: DesignDetail;
  const cookies = new SessionCookies();
  const { as } = cookies;
  const base = (design: { id: string }) => `/api/projects/${project.id}/designs/${design.id}/revisions/1`;
  const sheet = (design: { id: string }, user: TestUser) =>
    http()
      .get(`${base(design)}/transformer-sheet.pdf`)
      .set('Cookie', as(user))
      .buffer(true)
      .parse(binary);

  beforeAll(async () => {
    testApp = await createTestApp();
    engineer = await createUser(testApp, { role: 'engineer', displayName: 'Edda Engineer' });
    reviewer = await createUser(testApp, { role: 'reviewer' });
    lead = await createUser(testApp, { role: 'lead' });
    project = await createProject(
      [
        { userId: engineer.id, role: 'engineer' },
        { userId: reviewer.id, role: 'reviewer' },
        { userId: lead.id, role: 'lead' },
      ],
      { name: 'Field instruments' },
    );
    await cookies.signIn(testApp, [engineer, reviewer, lead]);
    designed = await createDesign(testApp, project.id, engineer.id, {
      name: 'Tester with a designed transformer',
      from: { kind: 'document', document: designedTester() },
    });
    given = await createDesign(testApp, project.id, engineer.id, {
      name: 'Tester with given numbers',
      from: { kind: 'template', templateId: 'surfaceChargeTester' },
    });
  });
  afterAll(async () => testApp.close());

  it('gives the supplier the winding schedule, inductances, leakage, resistances, core, gap and hipot', async () => {
    const response = await sheet(designed, engineer);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    expect(response.headers['content-disposition']).toContain('-r1-transformer-sheet-not-released.pdf');
    const text = pdfText(response.body as Buffer);
    // The figures the engine computes for the same document, printed as the sheet formats them.
    const report = analyzeDesign(designedTester()).transformer;
    if (!report) throw new Error('a designed transformer has a transformer report');
    const primary = report.windings.find((w) => w.role === 'primary');
    if (!primary) throw new Error('the report has a primary');
    for (const expected of [
      'Transformer sheet',
      'Tester with a designed transformer',
      'NOT RELEASED',
      'Winding schedule, from the core outward',
      'Core E25 ferrite grade A',
      'Wire 0.05 mm grade 2',
      '2400',
      '6 (dot)–8',
      formatQuantity(primary.inductanceH, 'H', 3),
      '±10 %',
      'Leakage inductance',
      `max ${formatQuantity(report.leakagePrimarySecondaryH * 1.5, 'H', 3)}`,
      'DC resistance',
      formatQuantity(report.hipotTestVoltageV, 'V', 3),
      'IEC 60664-1',
      'HIGH VOLTAGE CAN KILL',
      'local codes and licensed practice govern',
    ]) {
      expect(text).toContain(expected);
    }
  });

  it('names what each of its Checks checks, so two checks of the core read apart', async () => {
    const text = pdfText((await sheet(designed, engineer)).body as Buffer);
    // The rows' subjects take the shared result labels (shared/src/designs/field-labels.ts).
    for (const subject of ['core, peak flux density', 'core, temperature rise', 'windings, window fill']) {
      expect(text).toContain(subject);
    }
    expect(text).not.toMatch(/^\s*core\s{2,}/m);
    // Gap and tolerance practice: Power Integrations, application note AN-18 (7/96), p. 12.
    expect(text).toContain('spacers of half this');
    expect(text).toContain('±10 % to ±15 %');
  });

  it('returns 404 naming the section for a revision that gives its transformer as numbers', async () => {
    const response = await http()
      .get(`${base(given)}/transformer-sheet.pdf`)
      .set('Cookie', as(engineer));
    expect(response.status).toBe(404);
    expect(response.body.field).toBe('transformerDesign');
    expect(response.body.message).toContain('design it from a core');
  });

  it('returns 403 when a reviewer asks for a draft transformer sheet', async () => {
    const response = await http()
      .get(`${base(designed)}/transformer-sheet.pdf`)
      .set('Cookie', as(reviewer));
    expect(response.status).toBe(403);
  });

  it('drops NOT RELEASED once the revision is released, and only a lead exports it then', async () => {
    for (const [user, command, body] of [
      [engineer, 'submit', { reviewerIds: [reviewer.id] }],
      [reviewer, 'approve', { note: 'Windings fine' }],
      [lead, 'release', {}],
    ] as const) {
      const response = await http()
        .post(`${base(designed)}/${command}`)
        .set('Cookie', as(user))
        .send({ ...body, override: { reason: 'Transformer checks reviewed on the bench prototype' } });
      expect(response.status).toBe(200);
    }
    expect((await sheet(designed, engineer)).status).toBe(403);
    const response = await sheet(designed, lead);
    expect(response.status).toBe(200);
    const text = pdfText(response.body as Buffer);
    expect(text).not.toContain('NOT RELEASED');
    expect(text).toContain('Released');
  });
});
