import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { baseUrl, demoPassword, launchJourneyBrowser, openJourneyPage, screenshotDir, submitSignIn } from './journey';

let browser: Browser;
let context: BrowserContext;
let page: Page;
let pageErrors: string[];

function pathOf(current: Page): string {
  return new URL(current.url()).pathname;
}

describe('sign-in journey', () => {
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
    } = await openJourneyPage(browser, { viewport: { width: 1280, height: 800 } }));
  });
  afterEach(async () => {
    await context?.close();
  });

  it('signs the demo engineer in, opens a project onto its Designs and signs out again', async () => {
    await page.goto(`${baseUrl}/`);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(pathOf(page)).toBe('/sign-in');
    await expect(page.getByRole('note', { name: 'High-voltage caution' }).textContent()).resolves.toContain(
      'High voltage can kill.',
    );
    await page.screenshot({ path: resolve(screenshotDir, 'sign-in-light.png') });

    await submitSignIn(page, 'engineer@northfold.test', demoPassword);
    await page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();
    expect(pathOf(page)).toBe('/');
    const projectCards = page.getByRole('main').getByRole('listitem');
    await projectCards.first().waitFor();
    expect(await projectCards.count()).toBeGreaterThan(0);
    await expect(page.getByRole('button', { name: /^Account: / }).textContent()).resolves.toContain('engineer');
    await page.screenshot({ path: resolve(screenshotDir, 'projects-light.png') });

    await page.reload();
    await projectCards.first().waitFor();
    expect(pathOf(page)).toBe('/');

    const firstProjectLink = projectCards.first().getByRole('link');
    const projectName = (await firstProjectLink.textContent())?.trim() ?? '';
    expect(projectName).not.toBe('');
    await firstProjectLink.click();
    await page.getByRole('heading', { name: projectName, level: 1 }).waitFor();
    expect(pathOf(page)).toMatch(/^\/projects\/[^/]+$/);
    await page.getByRole('heading', { name: 'Designs', level: 2 }).waitFor();
    const caution = (await page.getByRole('note', { name: 'High-voltage caution' }).textContent()) ?? '';
    expect(caution).toContain('High voltage can kill.');
    expect(caution).toContain('the applicable standard, local codes and licensed practice govern');
    await page.screenshot({ path: resolve(screenshotDir, 'designs-light.png') });

    await page.getByRole('button', { name: 'Switch to dark scheme' }).click();
    await expect(page.locator('html').getAttribute('data-mantine-color-scheme')).resolves.toBe('dark');
    await page.mouse.move(640, 700);
    await page.getByRole('tooltip').waitFor({ state: 'detached' });
    await page.screenshot({ path: resolve(screenshotDir, 'designs-dark.png') });
    await page.getByRole('button', { name: 'Switch to light scheme' }).click();

    await page.getByRole('button', { name: /^Account: / }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(pathOf(page)).toBe('/sign-in');

    // The session is really gone: a signed-in page sends the browser back to sign-in.
    await page.goto(`${baseUrl}/`);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(pathOf(page)).toBe('/sign-in');
    expect(pageErrors).toEqual([]);
  });

  it("shows the server's refusal for a wrong password and stays on sign-in", async () => {
    await page.goto(`${baseUrl}/sign-in`);
    await submitSignIn(page, 'reviewer@northfold.test', 'not-the-password');

    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(((await alert.textContent()) ?? '').length).toBeGreaterThan('Sign-in failed'.length);
    expect(pathOf(page)).toBe('/sign-in');
    expect(pageErrors).toEqual([]);
  });
});
