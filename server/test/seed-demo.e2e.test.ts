import request from 'supertest';
import { DEMO_PASSWORD, DEMO_PROJECTS, DEMO_USERS, seedDemo } from '../src/database/seed-demo';
import { DEMO_DESIGN_RECORD_COUNT } from '../src/designs/seed-demo-designs';
import { DEMO_PARTS_PER_PROJECT } from '../src/parts/seed-demo-parts';
import { PasswordHasherService } from '../src/users/password-hasher.service';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { signIn } from './utils/sign-in';

// The demo scenario is NAMING.md's Northfold Instruments (invented); counts follow from it.
describe('demo seed', () => {
  let testApp: TestApp;
  const http = () => request(testApp.app.getHttpServer());

  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(async () => testApp.close());

  it('creates the accounts, one project per product line and the memberships, and adds nothing the second time', async () => {
    const hasher = testApp.app.get(PasswordHasherService);
    const memberships = DEMO_PROJECTS.reduce((sum, project) => sum + project.members.length, 0);
    expect(await seedDemo(hasher)).toBe(
      DEMO_USERS.length +
        DEMO_PROJECTS.length +
        memberships +
        DEMO_DESIGN_RECORD_COUNT +
        DEMO_PARTS_PER_PROJECT * DEMO_PROJECTS.length,
    );
    expect(await seedDemo(hasher)).toBe(0);
  });

  it('lets each demo account sign in with the demo password', async () => {
    for (const user of DEMO_USERS) {
      expect(await signIn(testApp, user.email, DEMO_PASSWORD)).toMatch(/^lw_session=/);
    }
  });

  it('puts the core team in all four projects and the field engineer in one only', async () => {
    const engineer = await signIn(testApp, 'engineer@northfold.test', DEMO_PASSWORD);
    const engineerProjects = await http().get('/api/projects').set('Cookie', engineer);
    expect(engineerProjects.body).toHaveLength(4);
    const lead = await signIn(testApp, 'lead@northfold.test', DEMO_PASSWORD);
    const leadProjects = await http().get('/api/projects').set('Cookie', lead);
    expect(new Set(leadProjects.body.map((p: { myRole: string }) => p.myRole))).toEqual(new Set(['lead']));
    const field = await signIn(testApp, 'field-engineer@northfold.test', DEMO_PASSWORD);
    const fieldProjects = await http().get('/api/projects').set('Cookie', field);
    expect(fieldProjects.body.map((p: { name: string }) => p.name)).toEqual(['Handheld surface-charge tester']);
  });

  it('records the Sign-off steps of each seeded state: the reviewer may decide the submitted one', async () => {
    const reviewer = await signIn(testApp, 'reviewer@northfold.test', DEMO_PASSWORD);
    const projects = await http().get('/api/projects').set('Cookie', reviewer);
    const signOffOf = async (projectName: string) => {
      const project = projects.body.find((p: { name: string }) => p.name === projectName) as { id: string };
      const designs = await http().get(`/api/projects/${project.id}/designs`).set('Cookie', reviewer);
      const design = designs.body.items[0] as { id: string; latestRevisionNumber: number };
      const path = `/api/projects/${project.id}/designs/${design.id}/revisions/${design.latestRevisionNumber}/sign-off`;
      return (await http().get(path).set('Cookie', reviewer)).body;
    };
    const submitted = await signOffOf('Detector tube bias');
    expect(submitted.state).toBe('submitted');
    expect(submitted.reviewers.map((person: { email: string }) => person.email)).toEqual(['reviewer@northfold.test']);
    expect(submitted.availableCommands).toEqual(expect.arrayContaining(['approve', 'return']));
    const approved = await signOffOf('Handheld surface-charge tester');
    expect(approved.approvals.map((entry: { displayName: string }) => entry.displayName)).toEqual([
      'Northfold Reviewer',
    ]);
    const released = await signOffOf('Range-hood precipitator cell');
    expect(released.history.map((step: { command: string }) => step.command)).toEqual(['submit', 'approve', 'release']);
  });
});
