import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { createTestApp, type TestApp } from './utils/create-test-app';

// Same-origin hosting of the built client with client-side routing: issue 2 contract, common practice, no source.
describe('client hosting and API docs', () => {
  let testApp: TestApp;
  let clientDistDir: string;
  const http = () => request(testApp.app.getHttpServer());

  beforeAll(async () => {
    clientDistDir = mkdtempSync(join(tmpdir(), 'lw-client-'));
    mkdirSync(join(clientDistDir, 'assets'));
    writeFileSync(join(clientDistDir, 'index.html'), '<!doctype html><title>Ladderwright</title><div id="root"></div>');
    writeFileSync(join(clientDistDir, 'assets', 'app.js'), 'console.log("workbench");');
    // A file under api/ in the client folder must never answer an API path.
    mkdirSync(join(clientDistDir, 'api'));
    writeFileSync(join(clientDistDir, 'api', 'health.json'), '{"status":"from the file"}');
    testApp = await createTestApp({ env: { clientDistDir } });
  });
  afterAll(async () => {
    await testApp.close();
    rmSync(clientDistDir, { recursive: true, force: true });
  });

  it('serves index.html for a client route', async () => {
    const response = await http().get('/projects/some-id/workbench');
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toMatch(/text\/html/);
    expect(response.text).toContain('<div id="root">');
  });

  it('serves built assets as files', async () => {
    const response = await http().get('/assets/app.js');
    expect(response.status).toBe(200);
    expect(response.text).toContain('workbench');
  });

  it('answers a missing asset with 404, not the page', async () => {
    expect((await http().get('/assets/missing.js')).status).toBe(404);
  });

  it('answers an unknown API route with a JSON 404, not the page', async () => {
    const response = await http().get('/api/no-such-route');
    expect(response.status).toBe(404);
    expect(response.body).toMatchObject({ statusCode: 404, code: 'not_found' });
  });

  it('never looks up a static file for an /api path', async () => {
    const response = await http().get('/api/health.json');
    expect(response.status).toBe(404);
    expect(response.body).toMatchObject({ code: 'not_found' });
  });

  it('does not ask browsers to upgrade to https on plain loopback', async () => {
    const response = await http().get('/');
    expect(response.headers['content-security-policy']).not.toContain('upgrade-insecure-requests');
    expect(response.headers['strict-transport-security']).toBeUndefined();
  });

  it('publishes the OpenAPI document with the routes', async () => {
    const response = await http().get('/api/docs-json');
    expect(response.status).toBe(200);
    expect(Object.keys(response.body.paths)).toEqual(
      expect.arrayContaining([
        '/api/auth/sign-in',
        '/api/auth/me',
        '/api/users',
        '/api/projects',
        '/api/projects/{projectId}/members/{userId}',
        '/api/health',
      ]),
    );
  });

  // Last: a second app rebinds the models to its own connection, which closes with it.
  it('serves no API docs when API_DOCS is off', async () => {
    const closedDocs = await createTestApp({ env: { clientDistDir, apiDocs: false } });
    try {
      const response = await request(closedDocs.app.getHttpServer()).get('/api/docs-json');
      expect(response.status).toBe(404);
    } finally {
      await closedDocs.close();
    }
  });
});
