import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, launchJourneyBrowser, openJourneyPage, screenshotDir, signInAsDemo } from './journey';

let browser: Browser;
let context: BrowserContext | undefined;

const viewports = [
  { width: 1440, height: 900 },
  { width: 1024, height: 768 },
] as const;

async function figureValue(page: Page, key: string): Promise<string> {
  return ((await page.locator(`[data-figure="${key}"] [data-value]`).textContent()) ?? '').trim();
}

/** True when the whole element is inside the viewport, not hidden under the app header and caution. */
async function isFullyInView(page: Page, selector: string): Promise<boolean> {
  return page.evaluate((target) => {
    const element = document.querySelector(target);
    if (!element) return false;
    const box = element.getBoundingClientRect();
    return box.top >= 0 && box.left >= 0 && box.bottom <= window.innerHeight && box.right <= window.innerWidth;
  }, selector);
}

/** A new design from a demo template, created through the API with the page's session; its Workbench opened. */
async function openNewDesign(page: Page, templateId: string, name: string): Promise<void> {
  const api = page.context().request;
  const projects = (await (await api.get(`${baseUrl}/api/projects`)).json()) as Array<{ id: string }>;
  const projectId = projects[0]?.id ?? '';
  const created = await api.post(`${baseUrl}/api/projects/${projectId}/designs`, {
    data: { name, from: { kind: 'template', templateId } },
  });
  expect(created.status()).toBe(201);
  const design = (await created.json()) as { id: string };
  await page.goto(`${baseUrl}/projects/${projectId}/designs/${design.id}`);
  await page.getByText('server result of r1').waitFor();
}

/** Pastes `text` into the focused element as a spreadsheet's copy would arrive. */
async function pasteIntoFocused(page: Page, text: string): Promise<void> {
  await page.evaluate((pasted) => {
    const data = new DataTransfer();
    data.setData('text/plain', pasted);
    document.activeElement?.dispatchEvent(
      new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }),
    );
  }, text);
}

describe('Workbench editing', () => {
  beforeAll(async () => {
    browser = await launchJourneyBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  afterEach(async () => {
    await context?.close();
    context = undefined;
  });

  for (const viewport of viewports) {
    it(`at ${viewport.width}×${viewport.height} an edit shows in the Verdict strip without scrolling, and undoes and redoes`, async () => {
      const opened = await openJourneyPage(browser, { viewport });
      context = opened.context;
      const page = opened.page;
      await signInAsDemo(page, 'engineer@northfold.test');
      await openNewDesign(page, 'detectorBias', `Editing ${viewport.width}`);
      const rippleBefore = await figureValue(page, 'ripple');
      const c1 = page.getByLabel('C1 capacitance');
      const c1Before = await c1.inputValue();

      await c1.fill('1n5');
      await page.getByText('live preview (unsaved edits)').waitFor();
      await expect.poll(() => figureValue(page, 'ripple'), { timeout: 10_000 }).not.toBe(rippleBefore);
      const rippleAfter = await figureValue(page, 'ripple');
      // The strip is in view where the edit was made: nobody scrolled to see the new figures.
      expect(await isFullyInView(page, '[data-figure="ripple"]')).toBe(true);
      expect(await isFullyInView(page, '[data-figure="worst"]')).toBe(true);
      await page.screenshot({ path: resolve(screenshotDir, `workbench-edit-${viewport.width}.png`) });

      // Undo from the keyboard with focus still in the field: the design edit goes back, not only the text.
      await page.keyboard.press('Control+z');
      await page.getByText('server result of r1').waitFor();
      expect(await figureValue(page, 'ripple')).toBe(rippleBefore);
      expect(await c1.inputValue()).toBe(c1Before);
      await page.keyboard.press('Control+Shift+z');
      await expect.poll(() => figureValue(page, 'ripple'), { timeout: 10_000 }).toBe(rippleAfter);
      expect(await c1.inputValue()).toBe('1.5 nF');
      expect(opened.errors).toEqual([]);
    });
  }

  for (const viewport of viewports) {
    it(`at ${viewport.width}×${viewport.height} pastes a column of prefixed values into the capacitor table and refuses a bad one, naming it`, async () => {
      const opened = await openJourneyPage(browser, { viewport });
      context = opened.context;
      const page = opened.page;
      await signInAsDemo(page, 'engineer@northfold.test');
      await openNewDesign(page, 'detectorBias', `Pasted column ${viewport.width}`);

      await page.getByLabel('C1 capacitance').focus();
      await pasteIntoFocused(page, '4n7\r\n5.6 nF\r\n0.0068u\r\n');
      await page.getByText('Pasted 3 cells from C1.').waitFor();
      expect(await page.getByLabel('C1 capacitance').inputValue()).toBe('4.7 nF');
      expect(await page.getByLabel('C2 capacitance').inputValue()).toBe('5.6 nF');
      expect(await page.getByLabel('C3 capacitance').inputValue()).toBe('6.8 nF');
      await page.getByText('live preview (unsaved edits)').waitFor();

      await page.getByLabel('C2 rated voltage').focus();
      await pasteIntoFocused(page, '2 kV\n3 kQ');
      await page.getByText('Nothing pasted: C3 rated voltage: “3 kQ”', { exact: false }).waitFor();
      expect(await page.getByLabel('C2 rated voltage').inputValue()).not.toBe('2 kV');
      await page.screenshot({ path: resolve(screenshotDir, `workbench-paste-${viewport.width}.png`) });
      expect(opened.errors).toEqual([]);
    });
  }

  for (const viewport of viewports) {
    it(`at ${viewport.width}×${viewport.height} a reviewer sees the Workbench read-only`, async () => {
      const opened = await openJourneyPage(browser, { viewport });
      context = opened.context;
      const page = opened.page;
      await signInAsDemo(page, 'reviewer@northfold.test');
      const api = page.context().request;
      const projects = (await (await api.get(`${baseUrl}/api/projects`)).json()) as Array<{ id: string }>;
      const page1 = (await (await api.get(`${baseUrl}/api/projects/${projects[0]?.id}/designs`)).json()) as {
        items: Array<{ id: string }>;
      };
      await page.goto(`${baseUrl}/projects/${projects[0]?.id}/designs/${page1.items[0]?.id}`);
      await page.getByText(/server result of r\d+/).waitFor();
      await page.getByText('read-only (reviewer)').waitFor();

      const form = page.getByRole('region', { name: 'Design inputs' });
      const fields = form.locator('input, textarea, select');
      expect(await fields.count()).toBeGreaterThan(10);
      expect(await form.locator('input:enabled, textarea:enabled, select:enabled').count()).toBe(0);
      expect(await page.getByRole('button', { name: 'Save revision' }).count()).toBe(0);
      expect(await page.getByLabel('Change note').count()).toBe(0);
      // Sections still open and close, and the Form index still moves between them.
      await page.getByRole('navigation', { name: 'Form index' }).getByRole('button', { name: 'Targets' }).click();
      await page.screenshot({ path: resolve(screenshotDir, `workbench-reviewer-${viewport.width}.png`) });
      expect(opened.errors).toEqual([]);
    });
  }
});
