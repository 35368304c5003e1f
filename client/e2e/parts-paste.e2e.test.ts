import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, launchJourneyBrowser, openJourneyPage, screenshotDir, signInAsDemo } from './journey';

let browser: Browser;

describe.each([
  { width: 1440, height: 900 },
  { width: 1024, height: 768 },
])('pasting spreadsheet cells on the Parts shelf at $width×$height', (viewport) => {
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  beforeAll(async () => {
    browser ??= await launchJourneyBrowser();
    ({ context, page, errors: pageErrors } = await openJourneyPage(browser, { viewport }));
    await signInAsDemo(page, 'lead@northfold.test');
  });
  afterAll(async () => {
    await context?.close();
  });

  it('fills the form from one row and previews several rows as parts, then adds them', async () => {
    const projects = (await (await page.request.get(`${baseUrl}/api/projects`)).json()) as { id: string }[];
    const project = projects[0];
    if (!project) throw new Error('no demo project');
    await page.goto(`${baseUrl}/projects/${project.id}/parts`);
    const form = page.getByRole('form', { name: 'Add a part' });
    await form.waitFor();
    const paste = (label: string, text: string) =>
      form.getByLabel(label, { exact: true }).evaluate((input, pasted) => {
        const data = new DataTransfer();
        data.setData('text/plain', pasted);
        input.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
      }, text);

    await paste('Code', 'NF-C472-6K\tHV disc, 6 kV\t4n7\t10%\t6 kV\n');
    await expect(form.getByLabel('Capacitance').inputValue()).resolves.toBe('4n7');
    await expect(form.getByLabel('Rated voltage').inputValue()).resolves.toBe('6 kV');

    const suffix = viewport.width;
    await form.getByLabel('Unit cost').fill('0.42');
    await paste('Code', `NF-C101-${suffix}\nNF-C102-${suffix}\nNF-C103-${suffix}\n`);
    await form.getByText('3 rows pasted as 3 parts').waitFor();
    const preview = page.getByRole('table', { name: 'Import preview' });
    await preview.waitFor();
    expect(await preview.getByRole('row').count()).toBe(4);
    await preview.scrollIntoViewIfNeeded();
    await page.screenshot({ path: resolve(screenshotDir, `parts-paste-${suffix}.png`) });
    await page.getByRole('button', { name: /^Import 3 parts/ }).click();
    await page.getByText('Imported 3 parts.').waitFor();
    const shelf = (await (await page.request.get(`${baseUrl}/api/projects/${project.id}/parts`)).json()) as {
      items?: { code: string; unitCost: number }[];
    };
    const items = shelf.items ?? (shelf as unknown as { code: string; unitCost: number }[]);
    expect(items.filter((part) => part.code.endsWith(`-${suffix}`)).map((part) => part.unitCost)).toEqual([
      0.42, 0.42, 0.42,
    ]);
    expect(pageErrors).toEqual([]);
  });
});

afterAll(async () => {
  await browser?.close();
});
