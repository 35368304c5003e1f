import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';

const baseUrl = inject('baseUrl');
const screenshotDir = resolve(import.meta.dirname, '..', 'test-results');
const demoPassword = 'Northfold-demo-1';
const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

let browser: Browser;
let context: BrowserContext;
let page: Page;
let pageErrors: string[];

async function signIn(current: Page): Promise<void> {
  await current.goto(`${baseUrl}/sign-in`);
  await current.getByLabel('E-mail').fill('engineer@northfold.test');
  await current.getByLabel('Password', { exact: false }).first().fill(demoPassword);
  await current.getByRole('button', { name: 'Sign in' }).click();
  await current.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();
}

async function figureValue(current: Page, key: string): Promise<string> {
  return ((await current.locator(`[data-figure="${key}"] [data-value]`).textContent()) ?? '').trim();
}

async function regulationPath(current: Page): Promise<string> {
  const path = current.getByRole('figure', { name: 'Output vs load current' }).locator('path.recharts-line-curve');
  await path.waitFor();
  return (await path.getAttribute('d')) ?? '';
}

async function shot(current: Page, name: string): Promise<void> {
  await current.screenshot({ path: resolve(screenshotDir, name), fullPage: true });
}

describe('workbench journey', () => {
  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: chromiumArgs });
  });
  afterAll(async () => {
    await browser?.close();
  });
  beforeEach(async () => {
    context = await browser.newContext({ viewport: { width: 1440, height: 900 }, colorScheme: 'light' });
    page = await context.newPage();
    pageErrors = [];
    page.on('pageerror', (error) => pageErrors.push(error.message));
    page.on('console', (message) => {
      if (message.type() === 'error' && !message.text().includes('401')) pageErrors.push(message.text());
    });
  });
  afterEach(async () => {
    await context?.close();
  });

  it('creates a design from a template, edits a capacitor, saves, compares and simulates', async () => {
    await signIn(page);
    await page.getByRole('main').getByRole('listitem').first().getByRole('link').click();
    await page.getByRole('heading', { name: 'Designs', level: 2 }).waitFor();
    await shot(page, 'workbench-01-designs.png');

    // New design from the detector-bias template (a tripler: quick to simulate).
    await page.getByRole('button', { name: 'New design' }).click();
    await page.getByPlaceholder('Pick a template').click();
    await page.getByRole('option', { name: /Detector tube bias/ }).click();
    await page.getByLabel('Design name').fill('Journey bias supply');
    await page.getByRole('button', { name: 'Create design' }).click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();
    expect(new URL(page.url()).pathname).toMatch(/^\/projects\/[^/]+\/designs\/[^/]+$/);
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
    await page.getByText('server result of r2').waitFor();
    expect(new URL(page.url()).searchParams.get('rev')).toBe('2');

    // Compare r1 with r2.
    await page.getByRole('tab', { name: 'History' }).click();
    const inputs = page.getByRole('table', { name: /Inputs that differ/ });
    await inputs.waitFor();
    expect(await inputs.textContent()).toContain('multiplier.capacitors[0].valueF');
    expect(await page.getByRole('table', { name: 'Results' }).textContent()).toMatch(/r1.*r2/);
    await shot(page, 'workbench-04-compare.png');

    // Checks read without colour.
    await page.getByRole('tab', { name: 'Checks' }).click();
    const checks = page.getByRole('table', { name: 'Checks' });
    await checks.waitFor();
    expect(await checks.textContent()).toMatch(/(pass|marginal|fail) [+−±]\d+\.\d %/);

    // Simulate: progress, then waveforms.
    await page.getByRole('tab', { name: 'Waveforms' }).click();
    await page.getByRole('button', { name: 'Start simulation' }).click();
    await page.getByText(/^Simulation (queued|running): \d+ %$/).waitFor({ timeout: 10_000 });
    await shot(page, 'workbench-05-simulating.png');
    await page
      .getByRole('figure', { name: 'Start-up' })
      .locator('path.recharts-line-curve')
      .waitFor({ timeout: 120_000 });
    await page.getByRole('figure', { name: 'Discharge' }).locator('path.recharts-line-curve').first().waitFor();
    await shot(page, 'workbench-06-waveforms.png');
    expect(pageErrors).toEqual([]);
  }, 200_000);

  it('proposes ladders on the Sizer and starts a design from one', async () => {
    await signIn(page);
    await page.getByRole('main').getByRole('listitem').first().getByRole('link').click();
    await page.getByRole('link', { name: 'Open the Sizer' }).click();
    await page.getByRole('heading', { name: 'Sizer', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Find ladders' }).click();
    const table = page.getByRole('table', { name: 'Sizer candidates' });
    await table.waitFor({ timeout: 60_000 });
    await shot(page, 'workbench-07-sizer.png');
    await page.getByRole('button', { name: 'Start a design from candidate 1', exact: true }).click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();
    expect(await page.getByLabel('Name', { exact: true }).inputValue()).toMatch(/^Sizer: /);
    expect(pageErrors).toEqual([]);
  }, 120_000);
});
