import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { baseUrl, launchJourneyBrowser, openJourneyPage, screenshotDir, signInAsDemo } from './journey';

let browser: Browser;
let context: BrowserContext;
let page: Page;
let pageErrors: string[];

async function figureValue(current: Page, key: string): Promise<string> {
  return ((await current.locator(`[data-figure="${key}"] [data-value]`).textContent()) ?? '').trim();
}

async function regulationPath(current: Page): Promise<string> {
  const path = current.getByRole('figure', { name: 'Output vs load current' }).locator('path.recharts-line-curve');
  await path.waitFor();
  return (await path.getAttribute('d')) ?? '';
}

async function createFromTemplate(current: Page, name: string): Promise<void> {
  await current.getByRole('button', { name: 'New design' }).click();
  await current.getByPlaceholder('Pick a template').click();
  await current.getByRole('option', { name: /Detector tube bias/ }).click();
  await current.getByLabel('Design name').fill(name);
  await current.getByRole('button', { name: 'Create design' }).click();
  await current.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();
}

async function shot(current: Page, name: string): Promise<void> {
  await current.screenshot({ path: resolve(screenshotDir, name), fullPage: true });
}

describe('workbench journey', () => {
  beforeAll(async () => {
    browser = await launchJourneyBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  beforeEach(async () => {
    ({
      context,
      page,
      errors: pageErrors,
    } = await openJourneyPage(browser, { viewport: { width: 1440, height: 900 } }));
  });
  afterEach(async () => {
    await context?.close();
  });

  it('creates a design from a template, edits a capacitor, saves, compares and simulates', async () => {
    await signInAsDemo(page, 'engineer@northfold.test');
    await page.getByRole('main').getByRole('listitem').first().getByRole('link').click();
    await page.getByRole('heading', { name: 'Designs', level: 2 }).waitFor();
    await shot(page, 'workbench-01-designs.png');

    // New design from the detector-bias template (a tripler: quick to simulate).
    await createFromTemplate(page, 'Journey bias supply');
    expect(new URL(page.url()).pathname).toMatch(/^\/projects\/[^/]+\/designs\/[^/]+$/);
    // The address pins the open revision.
    expect(new URL(page.url()).searchParams.get('rev')).toBe('1');
    await expect(page.getByRole('note', { name: 'High-voltage caution' }).textContent()).resolves.toContain(
      'High voltage can kill.',
    );
    await page.getByText('server result of r1').waitFor();
    const outputBefore = await figureValue(page, 'output');
    const rippleBefore = await figureValue(page, 'ripple');
    const pathBefore = await regulationPath(page);
    expect(outputBefore).toMatch(/V$/);
    await shot(page, 'workbench-02-template.png');

    // Type a capacitor with a prefix: the normalized value shows and the live figures follow.
    const c1 = page.getByLabel('C1 capacitance');
    await c1.fill('1n5');
    await page.getByText('= 1.5 nF').first().waitFor();
    await page.getByText('live preview (unsaved edits)').waitFor();
    await expect.poll(() => figureValue(page, 'ripple'), { timeout: 10_000 }).not.toBe(rippleBefore);
    await expect.poll(() => regulationPath(page), { timeout: 10_000 }).not.toBe(pathBefore);
    await shot(page, 'workbench-03-edited.png');

    // Save revision 2; the page shows the server's result for it.
    await page.getByLabel('Change note').fill('C1 down to 1.5 nF');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await page.waitForURL((url) => url.searchParams.get('rev') === '2');
    await page.getByText('server result of r2').waitFor();
    await page.getByText('Saved as r2').waitFor();

    // Compare r1 with r2.
    await page.getByRole('tab', { name: 'History' }).click();
    const inputs = page.getByRole('table', { name: /Inputs that differ/ });
    await inputs.waitFor();
    expect(await inputs.textContent()).toContain('C1 capacitance');
    // Values and deltas carry units (the field name's suffix), not raw SI numbers.
    expect(await inputs.textContent()).toContain('1.5 nF');
    expect(await inputs.textContent()).not.toMatch(/\de-\d/);
    expect(await page.getByRole('table', { name: 'Results' }).textContent()).toMatch(/r1.*r2/);
    await shot(page, 'workbench-04-compare.png');

    // Checks read without colour.
    await page.getByRole('tab', { name: 'Checks' }).click();
    const checks = page.getByRole('table', { name: 'Checks' });
    await checks.waitFor();
    expect(await checks.textContent()).toMatch(
      /(pass|marginal|fail) · (\d+(\.\d)? % (below|over) the limit|[\d.]+× the limit|at the limit)/,
    );

    // Simulate: progress, then waveforms.
    await page.getByRole('tab', { name: 'Waveforms' }).click();
    const started = page.waitForRequest(
      (request) => request.method() === 'POST' && /\/simulations$/.test(request.url()),
    );
    await page.getByRole('button', { name: 'Start simulation' }).click();
    // No unsaved edits: the stored revision is simulated by reference, not re-sent.
    const startBody = (await started).postDataJSON() as Record<string, unknown>;
    expect(startBody).toMatchObject({ kind: 'full', revisionNumber: 2 });
    expect(typeof startBody.designId).toBe('string');
    expect(startBody).not.toHaveProperty('document');
    await page.getByText(/^Simulation (queued|running): \d+ %$/).waitFor({ timeout: 10_000 });
    await shot(page, 'workbench-05-simulating.png');
    await page
      .getByRole('figure', { name: 'Start-up' })
      .locator('path.recharts-line-curve')
      .waitFor({ timeout: 120_000 });
    await page.getByRole('figure', { name: 'Discharge' }).locator('path.recharts-line-curve').first().waitFor();
    await shot(page, 'workbench-06-waveforms.png');
    // The finished run is the revision's current simulation: the headline figures now come from it and say so.
    await page.getByText('server result of r2 · figures from simulation').waitFor();
    const output = page.getByRole('listitem', { name: 'Output (mean, loaded)' });
    await expect(output.getAttribute('data-source')).resolves.toBe('simulation');
    await output.getByText('from simulation').waitFor();
    await page.getByRole('tab', { name: 'Checks' }).click();
    await page.getByText(/rests on the stored simulation of this revision|Every check rests on the estimate/).waitFor();
    await page.getByRole('tab', { name: 'Waveforms' }).click();
    await page.getByText(/The headline figures come from the full simulation of r2 that finished/).waitFor();
    await shot(page, 'workbench-07-from-simulation.png');
    expect(pageErrors).toEqual([]);
  }, 200_000);

  it('keeps the edits of a save that lost the race and saves them on top of the latest revision', async () => {
    await signInAsDemo(page, 'engineer@northfold.test');
    await page.getByRole('main').getByRole('listitem').first().getByRole('link').click();
    await page.getByRole('heading', { name: 'Designs', level: 2 }).waitFor();
    await createFromTemplate(page, 'Journey race supply');
    const designHref = new URL(page.url()).pathname;

    // A second page (same session) opens the same design, still at r1.
    const other = await context.newPage();
    const otherErrors: string[] = [];
    other.on('pageerror', (error) => otherErrors.push(error.message));
    other.on('console', (message) => {
      // The refused save is a 409 the browser reports on the console; it is the point of this journey.
      if (message.type() === 'error' && !/\b(401|409)\b/.test(message.text())) otherErrors.push(message.text());
    });
    await other.goto(`${baseUrl}${designHref}`);
    await other.getByText('server result of r1').waitFor();
    expect(new URL(other.url()).searchParams.get('rev')).toBe('1');

    // The first page saves r2.
    await page.getByLabel('C1 capacitance').fill('1n5');
    await page.getByText('live preview (unsaved edits)').waitFor();
    await page.getByLabel('Change note').fill('C1 down to 1.5 nF');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await page.waitForURL((url) => url.searchParams.get('rev') === '2');

    // The second page edits C2 and saves on r1: refused, edits kept, changed fields named.
    await other.getByLabel('C2 capacitance').fill('2n2');
    await other.getByText('live preview (unsaved edits)').waitFor();
    await other.getByLabel('Change note').fill('C2 up to 2.2 nF');
    await other.getByRole('button', { name: 'Save revision' }).click();
    const alert = other.getByRole('alert').filter({ hasText: 'Someone saved r2 meanwhile' });
    await alert.waitFor();
    expect(await alert.textContent()).toContain('C1 capacitance');
    // Still the typed value (shown normalized since the field lost focus to Save).
    expect(await other.getByLabel('C2 capacitance').inputValue()).toBe('2.2 nF');
    expect(new URL(other.url()).searchParams.get('rev')).toBe('1');
    await shot(other, 'workbench-07-stale-save.png');

    await alert.getByRole('button', { name: 'Keep my edits, save on top of r2' }).click();
    await other.getByRole('button', { name: 'Save revision' }).click();
    await other.waitForURL((url) => url.searchParams.get('rev') === '3');
    await other.getByText('server result of r3').waitFor();
    expect(await other.getByLabel('C2 capacitance').inputValue()).toBe('2.2 nF');
    expect(pageErrors).toEqual([]);
    expect(otherErrors).toEqual([]);
  }, 120_000);

  it('proposes ladders on the Sizer and starts a design from one', async () => {
    await signInAsDemo(page, 'engineer@northfold.test');
    await page.getByRole('main').getByRole('listitem').first().getByRole('link').click();
    await page.getByRole('link', { name: 'Open the Sizer' }).click();
    await page.getByRole('heading', { name: 'Sizer', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Find ladders' }).click();
    const table = page.getByRole('table', { name: 'Sizer candidates' });
    await table.waitFor({ timeout: 60_000 });
    await shot(page, 'workbench-08-sizer.png');
    await page.getByRole('button', { name: 'Start a design from candidate 1', exact: true }).click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();
    expect(await page.getByLabel('Name', { exact: true }).inputValue()).toMatch(/^Sizer: /);
    expect(pageErrors).toEqual([]);
  }, 120_000);

  it('shows a driver design’s Driver tab and previews a driver edit off the page’s thread', async () => {
    await signInAsDemo(page, 'engineer@northfold.test');
    await page.getByRole('main').getByRole('link', { name: 'Handheld surface-charge tester' }).first().click();
    await page.getByRole('heading', { name: 'Designs', level: 2 }).waitFor();
    await page.getByRole('main').getByRole('link', { name: 'Handheld surface-charge tester' }).first().click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();
    await page.getByRole('tab', { name: 'Driver' }).click();
    const curve = page.getByRole('figure', { name: 'Driver output vs load current' });
    await curve.locator('path.recharts-line-curve').waitFor();
    expect(await curve.locator('[data-driver="power-limit-onset"]').textContent()).toMatch(/Rated load/);
    await shot(page, 'workbench-09-driver.png');
    await curve.screenshot({ path: resolve(screenshotDir, 'workbench-09-driver-curve.png') });

    // Simulate the stored revision with a short cold start-up: the oscillator's own plots and frequency.
    await page.getByRole('tab', { name: 'Waveforms' }).click();
    await page.getByLabel('Start-up window').fill('1 ms');
    await page.getByText('= 1 ms').waitFor();
    const started = page.waitForRequest(
      (request) => request.method() === 'POST' && /\/simulations$/.test(request.url()),
    );
    await page.getByRole('button', { name: 'Start simulation' }).click();
    expect((await started).postDataJSON()).toMatchObject({ kind: 'full', options: { startUpWindowS: 1e-3 } });
    const collector = page.getByRole('figure', { name: 'Collector and secondary' });
    await collector.locator('path.recharts-line-curve').first().waitFor({ timeout: 90_000 });
    expect(await collector.locator('path.recharts-line-curve').count()).toBe(2);
    await page.getByRole('figure', { name: 'Primary current' }).locator('path.recharts-line-curve').waitFor();
    await page.getByRole('figure', { name: 'Start-up' }).locator('path.recharts-line-curve').waitFor();
    const frequency = page.getByText('Oscillation frequency').locator('xpath=following-sibling::*[1]');
    expect((await frequency.textContent())?.trim()).toMatch(/^\d[\d.]* [kM]?Hz$/);
    await shot(page, 'workbench-11-driver-waveforms.png');
    await page.getByRole('tab', { name: 'Driver' }).click();

    // A driver edit goes through the live-analysis worker and comes back as a preview.
    const before = await figureValue(page, 'output');
    await page.getByLabel('Secondary turns').fill('1000');
    await page.getByText('live preview (unsaved edits)').waitFor();
    await expect.poll(() => figureValue(page, 'output'), { timeout: 10_000 }).not.toBe(before);
    await page.getByLabel('Primary inductance').fill('0 H');
    await page.getByText('must be greater than zero').first().waitFor();
    await shot(page, 'workbench-10-driver-issue.png');
    expect(pageErrors).toEqual([]);
  }, 180_000);
});
