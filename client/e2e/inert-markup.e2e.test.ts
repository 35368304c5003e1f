import type { APIRequestContext, Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, demoPassword } from './journey';
import { launchChromium } from './launch-chromium';

/** Names and notes typed as markup: React must render them as text, so none of it may run or load. */
const MARKUP_NAME = '<img src=x onerror=alert(1)>';
const MARKUP_NOTE = '<script>alert(2)</script>';

let browser: Browser;
let context: BrowserContext;
let page: Page;
const dialogs: string[] = [];
let projectId = '';
let designId = '';

async function postJson<T>(api: APIRequestContext, path: string, data: object, status: number): Promise<T> {
  const response = await api.post(`${baseUrl}${path}`, { data });
  expect(response.status(), `${path}: ${await response.text()}`).toBe(status);
  return (await response.json()) as T;
}

/** Waits until the page has nothing left to load, then a little longer for an error handler that would fire. */
async function settle(current: Page): Promise<void> {
  await current.waitForLoadState('networkidle');
  await current.waitForTimeout(300);
}

/** No element anywhere in the page came from the typed markup. */
async function expectNoInjectedElements(current: Page): Promise<void> {
  expect(await current.locator('img[src="x"]').count()).toBe(0);
  const injectedScripts = await current.evaluate(
    () => Array.from(document.scripts).filter((script) => script.textContent?.includes('alert(')).length,
  );
  expect(injectedScripts).toBe(0);
}

describe('markup typed into names and notes stays inert', () => {
  beforeAll(async () => {
    browser = await launchChromium();
    context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    page = await context.newPage();
    page.on('dialog', (dialog) => {
      dialogs.push(`${dialog.type()}: ${dialog.message()}`);
      void dialog.dismiss();
    });

    // The context's request client shares the browser's cookies: signing in here signs the page in.
    const api = context.request;
    await postJson(api, '/api/auth/sign-in', { email: 'lead@northfold.test', password: demoPassword }, 200);
    const project = await postJson<{ id: string }>(
      api,
      '/api/projects',
      { name: MARKUP_NAME, productLine: 'Inert markup check', description: MARKUP_NOTE },
      201,
    );
    projectId = project.id;
    const design = await postJson<{ id: string }>(
      api,
      `/api/projects/${projectId}/designs`,
      { name: MARKUP_NAME, from: { kind: 'template', templateId: 'detectorBias' } },
      201,
    );
    designId = design.id;
    const first = await api.get(`${baseUrl}/api/projects/${projectId}/designs/${designId}/revisions/1`);
    expect(first.status()).toBe(200);
    const { document } = (await first.json()) as { document: object };
    await postJson(
      api,
      `/api/projects/${projectId}/designs/${designId}/revisions`,
      { baseRevisionNumber: 1, document, changeNote: MARKUP_NOTE },
      201,
    );
  });
  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('shows the project name and description literally on the Projects page', async () => {
    await page.goto(`${baseUrl}/`);
    const title = page.locator(`[id="project-${projectId}-name"]`);
    await title.waitFor();
    await settle(page);
    expect(await title.textContent()).toBe(MARKUP_NAME);
    expect(await page.getByText(MARKUP_NOTE, { exact: true }).textContent()).toBe(MARKUP_NOTE);
    await expectNoInjectedElements(page);
    expect(dialogs).toEqual([]);
  });

  it('shows the project and design names literally on the Designs page', async () => {
    await page.goto(`${baseUrl}/projects/${projectId}`);
    const heading = page.getByRole('heading', { level: 1 });
    await heading.waitFor();
    await page.getByRole('heading', { name: 'Designs', level: 2 }).waitFor();
    await page.getByRole('link', { name: MARKUP_NAME, exact: true }).waitFor();
    await settle(page);
    expect(await heading.textContent()).toBe(MARKUP_NAME);
    expect(await page.getByRole('link', { name: MARKUP_NAME, exact: true }).textContent()).toBe(MARKUP_NAME);
    expect(await page.title()).toContain(MARKUP_NAME);
    await expectNoInjectedElements(page);
    expect(dialogs).toEqual([]);
  });

  it('shows the design name and the change note literally on the Workbench', async () => {
    await page.goto(`${baseUrl}/projects/${projectId}/designs/${designId}`);
    // The open revision's line under the Workbench heading: "“<note>” · by <author>, <date> · engine <version>".
    const revisionLine = page.getByText(`“${MARKUP_NOTE}” · by `, { exact: false });
    await revisionLine.waitFor();
    expect(await revisionLine.textContent()).toMatch(
      /^“<script>alert\(2\)<\/script>” · by Northfold Lead, \d{1,2} \w+ \d{4}, \d{2}:\d{2} · engine /,
    );
    await page.getByRole('tab', { name: 'History' }).click();
    const noteCell = page.getByRole('cell', { name: MARKUP_NOTE, exact: true });
    await noteCell.waitFor();
    await settle(page);
    expect(await noteCell.textContent()).toBe(MARKUP_NOTE);
    // The breadcrumbs name the project, then the design: both the typed markup, as text.
    const names = await page.getByText(MARKUP_NAME, { exact: true }).allTextContents();
    expect(names.length).toBeGreaterThanOrEqual(2);
    expect(names.every((text) => text === MARKUP_NAME)).toBe(true);
    expect(await page.title()).toContain(MARKUP_NAME);
    await expectNoInjectedElements(page);
    expect(dialogs).toEqual([]);
  });
});
