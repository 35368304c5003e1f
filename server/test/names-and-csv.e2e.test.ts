import Papa from 'papaparse';
import request from 'supertest';
import { createProject, type TestProject } from './factories/create-project';
import { createUser, type TestUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

describe('blank names and spreadsheet-safe CSV exports', () => {
  let testApp: TestApp;
  let lead: TestUser;
  let admin: TestUser;
  let project: TestProject;
  const cookies = new Map<string, string>();
  const http = () => request(testApp.app.getHttpServer());
  const as = (user: TestUser) => cookies.get(user.email) ?? '';

  beforeAll(async () => {
    testApp = await createTestApp();
    lead = await createUser(testApp, { role: 'lead' });
    admin = await createUser(testApp, { role: 'admin' });
    project = await createProject([{ userId: lead.id, role: 'lead' }]);
    for (const user of [lead, admin]) cookies.set(user.email, await signIn(testApp, user.email, user.password));
  });
  afterAll(async () => testApp.close());

  it.each([
    ['POST /api/projects name', '/api/projects', 'lead', { name: '   ', productLine: 'Ionizers' }, 'name'],
    ['POST /api/projects productLine', '/api/projects', 'lead', { name: 'Bar', productLine: ' \t ' }, 'productLine'],
    [
      'POST /api/users displayName',
      '/api/users',
      'admin',
      { email: 'blank@northfold.test', displayName: '    ', role: 'engineer', password: 'Bench-check-42' },
      'displayName',
    ],
  ] as const)('refuses %s of only spaces with 400 naming the field', async (_title, url, who, body, field) => {
    const response = await http()
      .post(url)
      .set('Cookie', as(who === 'admin' ? admin : lead))
      .send(body);
    expect(response.status).toBe(400);
    expect(response.body.field).toBe(field);
    expect(response.body.message).toMatch(/must not be blank/);
  });

  it('refuses a design name of only spaces with 400 naming name', async () => {
    const response = await http()
      .post(`/api/projects/${project.id}/designs`)
      .set('Cookie', as(lead))
      .send({ name: '   ', from: { kind: 'template', templateId: 'detectorBias' } });
    expect(response.status).toBe(400);
    expect(response.body.field).toBe('name');
  });

  // OWASP "CSV Injection": a cell must not start, or restart after a ; that other locales split on, as a formula.
  it('exports parts whose descriptions hide formulas behind ; or full-width signs as text', async () => {
    const csv = [
      'code,kind,description,valueSi,ratedVoltageV,unitCost',
      'NF-C1,capacitor,"x;=HYPERLINK(""http://example.test"")",10n,3kV,0.35',
      'NF-C2,capacitor,\uFF1D1+1,10n,3kV,0.35',
      'NF-C3,capacitor," @SUM(A1)",10n,3kV,0.35',
    ].join('\r\n');
    const imported = await http()
      .post(`/api/projects/${project.id}/parts/import?dryRun=false`)
      .set('Cookie', as(lead))
      .attach('file', Buffer.from(csv), { filename: 'shelf.csv', contentType: 'text/csv' });
    expect(imported.status).toBe(200);
    const exported = await http().get(`/api/projects/${project.id}/parts/export.csv`).set('Cookie', as(lead));
    expect(exported.status).toBe(200);
    const lines = exported.text.split('\r\n');
    // The 18 empty cells after the size are the magnetics columns, which a capacitor leaves empty.
    const magnetics = ','.repeat(18);
    expect(lines).toContain(`NF-C1,capacitor,"x;'=HYPERLINK(""http://example.test"")",1e-8,,3000,,,,0.35,${magnetics}`);
    expect(lines).toContain(`NF-C2,capacitor,'\uFF1D1+1,1e-8,,3000,,,,0.35,${magnetics}`);
    // Split on ; as a spreadsheet in such a locale would: no cell starts as a formula.
    for (const delimiter of [',', ';']) {
      const cells = Papa.parse<string[]>(exported.text, { delimiter }).data.flat();
      expect(cells.filter((cell) => /^\s*[=+@\uFF1D\uFF0B\uFF20]/u.test(cell))).toEqual([]);
    }
  });

  it('exports the audit log with a sign-in e-mail that is a formula as text', async () => {
    await http().post('/api/auth/sign-in').send({ email: '=cmd|calc@northfold.test', password: 'Wrong-password-1' });
    const exported = await http()
      .get('/api/audit/export.csv')
      .query({ action: 'auth.sign_in_failed' })
      .set('Cookie', as(admin));
    expect(exported.status).toBe(200);
    expect(exported.text).toContain("'=cmd|calc@northfold.test");
    expect(exported.text).not.toMatch(/(^|,)=cmd/m);
  });
});
