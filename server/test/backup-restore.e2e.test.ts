import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import request from 'supertest';
import { createProject } from './factories/create-project';
import { createUser } from './factories/create-user';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { apiRouteTable } from './utils/route-table';
import { signIn } from './utils/sign-in';

const repoDir = resolve(__dirname, '..', '..');
const restoredDatabase = 'ladderwright_restored_test';

function run(script: string, args: string[], env: NodeJS.ProcessEnv = process.env): string {
  return execFileSync('bash', [resolve(repoDir, script), ...args], { env, encoding: 'utf8', timeout: 60_000 });
}

/** Every read the backup must reproduce: path -> exact response text. */
async function readAll(testApp: TestApp, cookie: string, paths: string[]): Promise<Map<string, string>> {
  const bodies = new Map<string, string>();
  for (const path of paths) {
    const response = await request(testApp.app.getHttpServer()).get(path).set('Cookie', cookie);
    expect(response.status).toBe(200);
    bodies.set(path, response.text);
  }
  return bodies;
}

describe('backup and restore (scripts/backup/dump.sh, restore.sh)', () => {
  const workDir = mkdtempSync(join(tmpdir(), 'lw-backup-'));
  afterAll(() => rmSync(workDir, { recursive: true, force: true }));

  it('restores into a new database that a second app serves byte for byte the same', async () => {
    const source = await createTestApp();
    let restored: TestApp | undefined;
    try {
      const lead = await createUser(source, { role: 'lead', displayName: 'Lead <b>Ø</b> "quoted"' });
      const engineer = await createUser(source, { role: 'engineer' });
      const project = await createProject(
        [
          { userId: lead.id, role: 'lead' },
          { userId: engineer.id, role: 'engineer' },
        ],
        { name: 'Detector tube bias <i>backup</i>' },
      );
      const cookie = await signIn(source, lead.email, lead.password);
      const server = source.app.getHttpServer();
      const paths = ['/api/projects', `/api/projects/${project.id}`, `/api/projects/${project.id}/members`];

      const routes = apiRouteTable(source.app).map((route) => `${route.method} ${route.path}`);
      if (routes.includes('POST /api/projects/:projectId/designs') && routes.includes('GET /api/design-templates')) {
        const templates = (await request(server).get('/api/design-templates').set('Cookie', cookie)).body as {
          id: string;
        }[];
        expect(templates.length).toBeGreaterThan(0);
        for (const template of templates.slice(0, 3)) {
          const created = await request(server)
            .post(`/api/projects/${project.id}/designs`)
            .set('Cookie', cookie)
            .send({ name: `From ${template.id}`, from: { kind: 'template', templateId: template.id } });
          expect(created.status).toBe(201);
          const designId = created.body.id as string;
          paths.push(
            `/api/projects/${project.id}/designs/${designId}`,
            `/api/projects/${project.id}/designs/${designId}/revisions`,
            `/api/projects/${project.id}/designs/${designId}/revisions/1`,
          );
        }
        paths.push(`/api/projects/${project.id}/designs`);
      }
      const before = await readAll(source, cookie, paths);

      const archive = join(workDir, 'ladderwright.dump');
      run('scripts/backup/dump.sh', [source.env.databaseUrl, archive]);
      expect(statSync(archive).size).toBeGreaterThan(1000);

      const url = new URL(source.env.databaseUrl);
      const pgEnv = { ...process.env, LW_PG_PORT: url.port || '5432' };
      run('docker-free-pg/pg.sh', ['dropdb', restoredDatabase], pgEnv);
      run('docker-free-pg/pg.sh', ['createdb', restoredDatabase], pgEnv);
      url.pathname = `/${restoredDatabase}`;
      run('scripts/backup/restore.sh', [url.toString(), archive]);

      // No migration and no truncation: the second app serves the restored database as it is.
      restored = await createTestApp({ env: { databaseUrl: url.toString() }, prepareDatabase: false });
      const after = await readAll(restored, cookie, paths);
      for (const path of paths) expect({ path, body: after.get(path) }).toEqual({ path, body: before.get(path) });
      expect(after.size).toBe(before.size);
    } finally {
      await restored?.close();
      await source.close();
    }
  }, 90_000);

  it('refuses to restore from a missing archive with a clear message and a non-zero exit', () => {
    expect(() => run('scripts/backup/restore.sh', [restoredDatabase, join(workDir, 'nothing.dump')])).toThrow(
      /no archive at/,
    );
  });
});
