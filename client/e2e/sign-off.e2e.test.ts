import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  baseUrl,
  launchJourneyBrowser,
  openJourneyPage,
  screenshotDir,
  signInAsDemo,
  type JourneyPage,
} from './journey';

const designName = `Sign-off journey ${Date.now().toString(36)}`;

let browser: Browser;
const people: JourneyPage[] = [];

async function signedIn(email: string): Promise<JourneyPage> {
  const person = await openJourneyPage(
    browser,
    { viewport: { width: 1440, height: 1000 }, acceptDownloads: true },
    /401|409/,
  );
  await signInAsDemo(person.page, email);
  people.push(person);
  return person;
}

async function shot(page: Page, name: string): Promise<void> {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: resolve(screenshotDir, name), fullPage: true });
}

async function stateOf(page: Page): Promise<string> {
  return ((await page.locator('[data-sign-off-state]').textContent()) ?? '').trim();
}

async function expectState(page: Page, state: string): Promise<void> {
  await expect.poll(() => stateOf(page), { timeout: 10_000 }).toBe(state);
}

/** Clicks the download button, checks the file is a PDF and returns its text (pdftotext). */
async function downloadedPdfText(page: Page, buttonName: string, fileName: string): Promise<string> {
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: buttonName, exact: true }).click(),
  ]);
  const pdfPath = resolve(screenshotDir, fileName);
  await download.saveAs(pdfPath);
  expect(readFileSync(pdfPath).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  return execFileSync('pdftotext', ['-layout', pdfPath, '-']).toString('utf8');
}

/** The Inbox row of this journey's design at `revisionNumber` in the group under `heading`. */
async function inboxRow(page: Page, heading: string, revisionNumber: number) {
  await page.goto(`${baseUrl}/inbox`);
  await page.getByRole('heading', { name: heading }).waitFor();
  return page
    .getByRole('table', { name: heading })
    .getByRole('row')
    .filter({ hasText: designName })
    .filter({ has: page.getByRole('cell', { name: `r${revisionNumber}`, exact: true }) });
}

describe('Sign-off journey', () => {
  beforeAll(async () => {
    browser = await launchJourneyBrowser();
  });
  afterAll(async () => {
    for (const person of people) await person.context.close();
    await browser?.close();
  });

  it('submits, returns with a comment, revises, approves, releases and downloads the Spec sheet', async () => {
    const engineer = await signedIn('engineer@northfold.test');
    const reviewer = await signedIn('reviewer@northfold.test');
    const lead = await signedIn('lead@northfold.test');
    const admin = await signedIn('admin@northfold.test');

    // Engineer: a new design from the detector-bias template, revision 1.
    let page = engineer.page;
    await page.getByRole('main').getByRole('link', { name: 'Detector tube bias' }).first().click();
    await page.getByRole('button', { name: 'New design' }).click();
    await page.getByPlaceholder('Pick a template').click();
    await page.getByRole('option', { name: /Detector tube bias/ }).click();
    await page.getByLabel('Design name').fill(designName);
    await page.getByRole('button', { name: 'Create design' }).click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();

    // Workbench -> Sign-off of r1; submit it to the reviewer.
    await page.getByRole('link', { name: 'Sign-off of r1' }).click();
    await page.getByRole('heading', { name: `Sign-off · ${designName} r1`, level: 1 }).waitFor();
    await expectState(page, 'draft');
    expect(await page.getByRole('note', { name: 'High-voltage caution' }).textContent()).toContain(
      'High voltage can kill.',
    );
    await page.getByRole('checkbox', { name: 'Northfold Reviewer (reviewer)' }).check();
    await page.getByLabel('Note').fill('First pass for the detector bias');
    await page.getByRole('button', { name: 'Submit for Sign-off' }).click();
    await expectState(page, 'submitted');
    await expect
      .poll(() => page.getByRole('table', { name: 'Sign-off history' }).textContent())
      .toMatch(/Northfold Engineer.*draft.*submitted.*First pass/);
    await shot(page, 'sign-off-01-submitted.png');
    const draftText = await downloadedPdfText(
      page,
      'Download Spec sheet (PDF, NOT RELEASED)',
      'sign-off-draft-sheet.pdf',
    );
    expect(draftText).toContain('NOT RELEASED');
    expect(draftText).toMatch(/revision 1 \(submitted\)/);

    // Reviewer: the Inbox shows r1 waiting; comment on C1 and return it.
    page = reviewer.page;
    const waiting = await inboxRow(page, 'Waiting for me', 1);
    await waiting.waitFor();
    expect(await waiting.textContent()).toContain('submitted');
    await shot(page, 'sign-off-02-inbox.png');
    await waiting.getByRole('link', { name: designName }).click();
    await expectState(page, 'submitted');
    await page.getByRole('button', { name: /^Checks: \d+ fail · \d+ marginal · \d+ pass$/ }).click();
    expect(await page.getByRole('table', { name: 'Checks' }).textContent()).toMatch(
      /(pass|marginal|fail) · (\d+ % (below|above) the (limit|minimum)|[\d.]+× the limit)/,
    );
    expect(await page.getByRole('button', { name: 'Submit for Sign-off' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Release', exact: true }).count()).toBe(0);
    await page.getByLabel('New comment').fill('C1 looks small for the ripple target; please check.');
    await page.getByLabel(/^Anchor/).selectOption('input:multiplier.capacitors[0].valueF');
    await page.getByRole('button', { name: 'Start thread' }).click();
    const thread = page.getByRole('article', { name: /C1 looks small/ });
    await thread.waitFor();
    expect(await thread.textContent()).toContain('input · C1 capacitance');
    const returnButton = page.getByRole('button', { name: 'Return with note' });
    expect(await returnButton.isDisabled()).toBe(true);
    await page.getByLabel('Note').fill('See the comment on C1');
    await returnButton.click();
    await expectState(page, 'returned');
    await shot(page, 'sign-off-03-returned.png');

    // Engineer: sees the thread, replies and resolves it, revises on the Workbench and submits r2.
    page = engineer.page;
    await page.reload();
    await expectState(page, 'returned');
    const engineerThread = page.getByRole('article', { name: /C1 looks small/ });
    await engineerThread.getByLabel('Reply').fill('Raised C1 in r2.');
    await engineerThread.getByRole('button', { name: 'Reply' }).click();
    await engineerThread.getByText('Raised C1 in r2.').waitFor();
    await engineerThread.getByRole('button', { name: 'Resolve' }).click();
    await engineerThread.getByText(/^resolved by Northfold Engineer$/).waitFor();
    await page.getByRole('link', { name: 'Open in the Workbench' }).click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();
    await page.getByLabel('C1 capacitance').fill('4n7');
    await page.getByText('live preview (unsaved edits)').waitFor();
    await page.getByLabel('Change note').fill('C1 up to 4.7 nF after review');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await page.getByText('server result of r2').waitFor();
    await page.getByRole('link', { name: 'Sign-off of r2' }).click();
    await expectState(page, 'draft');
    await page.getByRole('checkbox', { name: 'Northfold Reviewer (reviewer)' }).check();
    await page.getByRole('button', { name: 'Submit for Sign-off' }).click();
    await expectState(page, 'submitted');
    const mine = await inboxRow(page, 'Submitted by me', 1);
    expect(await mine.textContent()).toContain('returned');

    // Reviewer: r2 waits in the Inbox; approve it.
    page = reviewer.page;
    const waitingR2 = await inboxRow(page, 'Waiting for me', 2);
    await waitingR2.waitFor();
    await waitingR2.getByRole('link', { name: designName }).click();
    await expectState(page, 'submitted');
    await page.getByLabel('Note').fill('C1 fine now');
    await page.getByRole('button', { name: 'Approve', exact: true }).click();
    await expectState(page, 'approved');
    await expect
      .poll(() => page.getByRole('list', { name: 'Approvals' }).textContent())
      .toMatch(/approved by Northfold Reviewer on .*C1 fine now/);

    // Lead: release r2 and download its Spec sheet.
    page = lead.page;
    const signOffUrl = new URL(reviewer.page.url()).pathname;
    await page.goto(`${baseUrl}${signOffUrl}`);
    await expectState(page, 'approved');
    expect(await page.getByRole('button', { name: 'Approve', exact: true }).count()).toBe(0);
    await page.getByRole('button', { name: 'Release', exact: true }).click();
    await expectState(page, 'released');
    const text = await downloadedPdfText(page, 'Download Spec sheet (PDF)', 'sign-off-spec-sheet.pdf');
    expect(text).toContain(designName);
    expect(text).toMatch(/revision 2 \(released\)/);
    expect(text).toContain('High voltage can kill');
    expect(text).not.toContain('NOT RELEASED');
    await shot(page, 'sign-off-04-released.png');

    // Admin: the Outbox holds the mails of the journey.
    page = admin.page;
    await page.getByRole('link', { name: 'Outbox' }).click();
    await page.getByRole('heading', { name: 'Outbox', level: 1 }).waitFor();
    for (const subject of [
      `Review requested: ${designName}, revision 1`,
      `Returned for changes: ${designName}, revision 1`,
      `Review requested: ${designName}, revision 2`,
      `Approved: ${designName}, revision 2`,
      `Released: ${designName}, revision 2`,
    ]) {
      await expect
        .poll(
          async () => {
            await page.reload();
            await page.getByRole('heading', { name: 'Outbox', level: 1 }).waitFor();
            return page.getByText(subject, { exact: false }).count();
          },
          { timeout: 15_000 },
        )
        .toBeGreaterThan(0);
    }
    await shot(page, 'sign-off-05-outbox.png');

    for (const person of people) expect(person.errors).toEqual([]);
  }, 240_000);
});
