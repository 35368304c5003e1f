import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchJourneyBrowser, openJourneyPage, screenshotDir, signInAsDemo } from './journey';

let browser: Browser;
let context: BrowserContext;
let page: Page;
let pageErrors: string[];

async function bomTotal(current: Page): Promise<string> {
  const row = current.getByRole('region', { name: 'BOM cost' }).getByRole('row', { name: /Ladder total/ });
  return ((await row.getByRole('cell').last().textContent()) ?? '').trim();
}

describe('Parts shelf on the Workbench', () => {
  beforeAll(async () => {
    browser = await launchJourneyBrowser();
    ({
      context,
      page,
      errors: pageErrors,
    } = await openJourneyPage(browser, { viewport: { width: 1440, height: 900 } }));
  });
  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('picks a shelf capacitor for C1, shows its code and the new BOM cost, and opens the Bench runs', async () => {
    await signInAsDemo(page, 'engineer@northfold.test');

    // The demo ionizer bar: 14 × NF-C222-2K (0.18 each on the demo shelf).
    await page.getByRole('main').getByRole('link', { name: 'Cleanroom ionizer bar' }).click();
    await page.getByRole('heading', { name: 'Designs', level: 2 }).waitFor();
    await page
      .getByRole('main')
      .getByRole('link', { name: /ionizer/i })
      .first()
      .click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();

    await page.getByRole('tab', { name: 'BOM cost' }).click();
    const before = await bomTotal(page);
    expect(Number(before)).toBeGreaterThan(0);

    // Pick NF-C103-3K (10 nF, 3 kV, 0.39) for C1 with the keyboard: type, arrow down, Enter.
    const c1 = page.locator('input[aria-label="C1 part code"]');
    await c1.click();
    await c1.press('ControlOrMeta+a');
    await c1.pressSequentially('NF-C103-3');
    await page.getByRole('option', { name: /NF-C103-3K/ }).waitFor();
    await c1.press('ArrowDown');
    await c1.press('Enter');
    await expect(c1.inputValue()).resolves.toBe('NF-C103-3K');
    await expect(page.getByLabel('C1 capacitance').inputValue()).resolves.toBe('10 nF');

    // One capacitor moves from 0.18 to 0.39: the total rises by 0.21 (worked by hand).
    const bom = page.getByRole('region', { name: 'BOM cost' });
    await bom.getByRole('cell', { name: 'NF-C103-3K' }).waitFor();
    await expect
      .poll(async () => Number(await bomTotal(page)), { timeout: 10_000 })
      .toBeCloseTo(Number(before) + 0.21, 6);
    await page.screenshot({ path: resolve(screenshotDir, 'parts-wiring-01-bom.png'), fullPage: true });

    await page.getByRole('link', { name: /^Bench runs of r\d+$/ }).click();
    await page.getByRole('heading', { name: /^Bench runs · revision \d+$/, level: 1 }).waitFor();
    expect(new URL(page.url()).pathname).toMatch(/\/revisions\/\d+\/bench-runs$/);
    expect(pageErrors).toEqual([]);
  });
});
