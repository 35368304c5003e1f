import { execFileSync } from 'node:child_process';
import { resolve } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  baseUrl,
  launchJourneyBrowser,
  openJourneyPage,
  screenshotDir,
  signInAsDemo,
  submitSignIn,
  type JourneyPage,
} from './journey';

const stamp = Date.now().toString(36);
const newcomer = {
  email: `newcomer-${stamp}@northfold.test`,
  name: `Nia Newcomer ${stamp}`,
  firstPassword: 'Northfold-first-1',
  resetPassword: 'Northfold-reset-2',
};
const OVERRIDE_REASON = 'Pilot lot only: C1 is fitted as a 1 kV part at assembly.';

let browser: Browser;
const people: JourneyPage[] = [];

async function open(width = 1440, height = 900, ignored: RegExp = /401|409/): Promise<JourneyPage> {
  const person = await openJourneyPage(browser, { viewport: { width, height }, acceptDownloads: true }, ignored);
  people.push(person);
  return person;
}

async function signedIn(email: string, width = 1440, height = 900): Promise<JourneyPage> {
  const person = await open(width, height);
  await signInAsDemo(person.page, email);
  return person;
}

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: resolve(screenshotDir, name), fullPage: true });
}

describe('team administration journeys', () => {
  beforeAll(async () => {
    browser = await launchJourneyBrowser();
  });
  afterAll(async () => {
    for (const person of people) await person.context.close();
    await browser?.close();
  });

  it('admin creates an account and resets its password with a one-time link', async () => {
    const admin = await signedIn('admin@northfold.test');
    const page = admin.page;
    await page.getByRole('link', { name: 'Admin' }).click();
    await page.getByRole('heading', { name: 'Accounts', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'New account' }).click();
    await page.getByLabel('E-mail').fill(newcomer.email);
    await page.getByLabel('Name').fill(newcomer.name);
    await page.getByLabel('First password').fill(newcomer.firstPassword);
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByLabel('Search').fill('newcomer-');
    const row = page.getByRole('table', { name: 'Accounts' }).getByRole('row').filter({ hasText: newcomer.email });
    await row.waitFor();
    await shot(page, 'team-01-accounts-1440.png');
    await page.setViewportSize({ width: 1024, height: 768 });
    await shot(page, 'team-01-accounts-1024.png');
    await page.setViewportSize({ width: 1440, height: 900 });

    await row.getByRole('button', { name: `Reset the password of ${newcomer.email}` }).click();
    await page.getByRole('button', { name: 'Show the link once' }).click();
    const link = (await page.getByLabel('One-time link').textContent())?.trim() ?? '';
    expect(link).toMatch(/\/reset-password\?token=[A-Za-z0-9_-]{43}$/);
    await shot(page, 'team-02-reset-link-1440.png');
    await page.getByRole('button', { name: 'Close' }).last().click();

    // The newcomer opens the link (on this server), sets a password and signs in with it.
    const person = await open(1024, 768);
    await person.page.goto(`${baseUrl}${new URL(link).pathname}${new URL(link).search}`);
    await person.page.getByLabel('New password', { exact: false }).first().fill(newcomer.resetPassword);
    await person.page.getByLabel('New password again').fill(newcomer.resetPassword);
    await person.page.getByRole('button', { name: 'Set the password' }).click();
    await person.page.getByText('Password set').waitFor();
    await shot(person.page, 'team-03-password-set-1024.png');
    await person.page.goto(`${baseUrl}/sign-in`);
    await submitSignIn(person.page, newcomer.email, newcomer.resetPassword);
    await person.page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();

    // The audit log shows the reset, filtered by action.
    await page.getByRole('tab', { name: 'Audit log' }).click();
    await page.getByRole('heading', { name: 'Audit log', level: 1 }).waitFor();
    await page.getByLabel('Who').fill('admin@');
    await expect
      .poll(() => page.getByRole('table', { name: 'Audit log' }).textContent(), { timeout: 10_000 })
      .toContain('user.password_reset');
    await shot(page, 'team-04-audit-log-1440.png');
    await page.setViewportSize({ width: 1024, height: 768 });
    await shot(page, 'team-05-audit-log-1024.png');
    for (const one of people) expect(one.errors).toEqual([]);
  }, 120_000);

  it('lead adds the account as a member, who then sees the project', async () => {
    const lead = await signedIn('lead@northfold.test');
    const page = lead.page;
    await page.getByRole('main').getByRole('link', { name: 'Detector tube bias' }).first().click();
    await page.getByRole('navigation', { name: 'Projects' }).getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { name: 'Members', level: 1 }).waitFor();
    await page.getByLabel('E-mail of the account').fill(newcomer.email);
    await page.getByRole('button', { name: 'Add', exact: true }).click();
    await page.getByRole('table', { name: 'Members' }).getByRole('row').filter({ hasText: newcomer.email }).waitFor();
    await shot(page, 'team-06-members-1440.png');
    await page.getByRole('navigation', { name: 'Projects' }).getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('heading', { name: 'Project settings', level: 1 }).waitFor();
    await shot(page, 'team-07-settings-1440.png');
    await page.setViewportSize({ width: 1024, height: 768 });
    await shot(page, 'team-08-settings-1024.png');

    const member = await open(1024, 768);
    await member.page.goto(`${baseUrl}/sign-in`);
    await submitSignIn(member.page, newcomer.email, newcomer.resetPassword);
    await member.page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();
    await member.page.getByRole('main').getByRole('link', { name: 'Detector tube bias' }).first().waitFor();
    await shot(member.page, 'team-09-member-sees-project-1024.png');
    for (const one of people) expect(one.errors).toEqual([]);
  }, 120_000);

  it('engineer asks for a member, the lead accepts from the Inbox, and the new member sees the project', async () => {
    const project = 'Range-hood precipitator cell';
    const engineer = await signedIn('engineer@northfold.test');
    let page = engineer.page;
    await page.getByRole('main').getByRole('link', { name: project }).first().click();
    await page.getByRole('navigation', { name: 'Projects' }).getByRole('link', { name: 'Members' }).click();
    await page.getByRole('heading', { name: 'Members', level: 1 }).waitFor();
    await page.getByRole('textbox', { name: /^E-mail/ }).fill(newcomer.email);
    await page.getByLabel('Note for the leads').fill('Takes over the bench tests of the cell from next week.');
    await page.getByRole('button', { name: 'Send request' }).click();
    const asked = page
      .getByRole('table', { name: 'Member requests' })
      .getByRole('row')
      .filter({ hasText: newcomer.email });
    await asked.waitFor();
    expect(await asked.textContent()).toContain('pending');
    await shot(page, 'team-12-member-request-sent-1440.png');
    await page.setViewportSize({ width: 1024, height: 768 });
    await shot(page, 'team-13-member-request-sent-1024.png');

    const lead = await signedIn('lead@northfold.test');
    page = lead.page;
    await page.getByRole('link', { name: /^Inbox, \d+ waiting$/ }).click();
    await page.getByRole('heading', { name: 'Member requests' }).waitFor();
    await shot(page, 'team-14-inbox-member-request-1440.png');
    await page.getByRole('table', { name: 'Member requests' }).getByRole('link', { name: newcomer.email }).click();
    await page.getByRole('heading', { name: 'Members', level: 1 }).waitFor();
    const pending = page
      .getByRole('table', { name: 'Member requests' })
      .getByRole('row')
      .filter({ hasText: newcomer.email });
    await shot(page, 'team-15-members-pending-1440.png');
    await pending.getByRole('button', { name: 'Accept' }).click();
    await page.getByRole('table', { name: 'Members' }).getByRole('row').filter({ hasText: newcomer.email }).waitFor();
    await expect.poll(() => pending.textContent(), { timeout: 10_000 }).toContain('accepted');
    await page.setViewportSize({ width: 1024, height: 768 });
    await shot(page, 'team-16-members-accepted-1024.png');

    const member = await open(1024, 768);
    await member.page.goto(`${baseUrl}/sign-in`);
    await submitSignIn(member.page, newcomer.email, newcomer.resetPassword);
    await member.page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();
    await member.page.getByRole('main').getByRole('link', { name: project }).first().waitFor();

    // The engineer sees the outcome of the request.
    await engineer.page.reload();
    const outcome = engineer.page
      .getByRole('table', { name: 'Member requests' })
      .getByRole('row')
      .filter({ hasText: newcomer.email });
    await expect.poll(() => outcome.textContent(), { timeout: 10_000 }).toContain('accepted by Northfold Lead');
    for (const one of people) expect(one.errors).toEqual([]);
  }, 120_000);

  it('blocks an engineer submitting a failing revision, then submits it with an override shown on the spec sheet', async () => {
    const engineer = await signedIn('engineer@northfold.test');
    const page = engineer.page;
    const designName = `Gate journey ${stamp}`;
    await page.getByRole('main').getByRole('link', { name: 'Detector tube bias' }).first().click();
    await page.getByRole('button', { name: 'New design' }).click();
    await page.getByPlaceholder('Pick a template').click();
    await page.getByRole('option', { name: /Detector tube bias/ }).click();
    await page.getByLabel('Design name').fill(designName);
    await page.getByRole('button', { name: 'Create design' }).click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();
    // A secondary peak far above the 630 V rating of C1 makes its voltage Check fail.
    await page.getByLabel('Secondary peak').fill('900');
    await page.getByText('live preview (unsaved edits)').waitFor();
    await page.getByLabel('Change note').fill('Secondary raised to 900 V peak');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await page.getByText('server result of r2').waitFor();
    await page.getByRole('link', { name: 'Sign-off of r2' }).click();
    await page.getByRole('heading', { name: `Sign-off · ${designName} r2`, level: 1 }).waitFor();

    const gates = page.getByRole('status').filter({ hasText: 'Gates closed' });
    await gates.waitFor();
    expect(await gates.textContent()).toMatch(/Checks? fails?:/);
    await page.getByRole('checkbox', { name: 'Northfold Reviewer (reviewer)' }).check();
    const submit = page.getByRole('button', { name: 'Submit for Sign-off' });
    expect(await submit.isDisabled()).toBe(true);
    await shot(page, 'team-10-gates-closed-1440.png');

    // The server refuses the same submit without an override: 409 gates_closed naming the failing Check.
    const apiPath = new URL(page.url()).pathname.replace('/projects/', '/api/projects/').replace(/\/sign-off$/, '');
    const refused = await page.evaluate(async (path) => {
      const signOff = (await (await fetch(`${path}/sign-off`)).json()) as {
        candidateReviewers: { userId: string }[];
      };
      const response = await fetch(`${path}/submit`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ reviewerIds: signOff.candidateReviewers.slice(0, 1).map((person) => person.userId) }),
      });
      return { status: response.status, body: (await response.json()) as { code: string; message: string } };
    }, apiPath);
    expect(refused.status).toBe(409);
    expect(refused.body.code).toBe('gates_closed');
    expect(refused.body.message).toMatch(/Cannot submit while: \d+ Checks? fails?/);

    await page.getByRole('checkbox', { name: /Record an override/ }).check();
    await page.getByLabel('Override reason').fill(OVERRIDE_REASON);
    await submit.click();
    await page.getByRole('list', { name: 'Overrides' }).waitFor();
    expect(await page.getByRole('list', { name: 'Overrides' }).textContent()).toContain(OVERRIDE_REASON);
    await page.setViewportSize({ width: 1024, height: 768 });
    await shot(page, 'team-11-override-recorded-1024.png');

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download Spec sheet (PDF, NOT RELEASED)', exact: true }).click(),
    ]);
    const pdfPath = resolve(screenshotDir, 'team-override-sheet.pdf');
    await download.saveAs(pdfPath);
    const text = execFileSync('pdftotext', ['-layout', pdfPath, '-']).toString('utf8');
    expect(text).toContain('OVERRIDE (submit)');
    expect(text.replace(/\s+/g, ' ')).toContain(OVERRIDE_REASON);
    expect(text).toMatch(/coverage/);
    for (const one of people) expect(one.errors).toEqual([]);
  }, 180_000);
});
