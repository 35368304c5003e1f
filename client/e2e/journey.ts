import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Browser, BrowserContext, BrowserContextOptions, Page } from 'playwright-core';
import { inject } from 'vitest';
import { launchChromium } from './launch-chromium';

/** The built server started by global-setup.ts. */
export const baseUrl = inject('baseUrl');
export const screenshotDir = resolve(import.meta.dirname, '..', 'test-results');
/** Every seeded demo account (engineer, reviewer, lead, admin @northfold.test) shares this password. */
export const demoPassword = 'Northfold-demo-1';

export interface JourneyPage {
  context: BrowserContext;
  page: Page;
  /** Uncaught page errors and console errors not matched by the ignored pattern. */
  errors: string[];
}

/** Makes sure the screenshot folder exists, then launches chromium. */
export function launchJourneyBrowser(): Promise<Browser> {
  mkdirSync(screenshotDir, { recursive: true });
  return launchChromium();
}

/**
 * Opens a page in a fresh light-scheme context and collects its errors. The session check answers 401
 * before sign-in: the browser logs that as a failed resource, by design, so the default pattern skips it.
 */
export async function openJourneyPage(
  browser: Browser,
  contextOptions: BrowserContextOptions,
  ignoredConsoleErrors: RegExp = /401/,
): Promise<JourneyPage> {
  const context = await browser.newContext({ colorScheme: 'light', ...contextOptions });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error' && !ignoredConsoleErrors.test(message.text())) errors.push(message.text());
  });
  return { context, page, errors };
}

/** Fills and submits the sign-in form already open on `page`. */
export async function submitSignIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: false }).first().fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Opens sign-in, signs in as a demo account and waits for the Projects page. */
export async function signInAsDemo(page: Page, email: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await submitSignIn(page, email, demoPassword);
  await page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();
}

/** The seeded driver design, in a demo project of the same name. */
export const SEEDED_TESTER = 'Handheld surface-charge tester';

/**
 * A new design in the demo project `projectName` made from revision 1 of its seeded design `designName`, so
 * that a journey that adds bench runs or revisions leaves the seeded design other journeys open as it was.
 * Needs a signed-in engineer on `page`.
 */
export async function copySeededDesign(
  page: Page,
  designName: string,
  copyName: string,
  projectName = designName,
): Promise<{ projectId: string; designId: string }> {
  const projects = (await (await page.request.get(`${baseUrl}/api/projects`)).json()) as { id: string; name: string }[];
  const project = projects.find((candidate) => candidate.name === projectName);
  if (!project) throw new Error(`no demo project ${projectName}`);
  const designs = (await (await page.request.get(`${baseUrl}/api/projects/${project.id}/designs`)).json()) as {
    items: { id: string; name: string }[];
  };
  const seeded = designs.items.find((candidate) => candidate.name === designName);
  if (!seeded) throw new Error(`no demo design ${designName}`);
  const first = (await (
    await page.request.get(`${baseUrl}/api/projects/${project.id}/designs/${seeded.id}/revisions/1`)
  ).json()) as { document: unknown };
  const created = await page.request.post(`${baseUrl}/api/projects/${project.id}/designs`, {
    data: { name: copyName, from: { kind: 'document', document: first.document } },
  });
  if (created.status() !== 201) throw new Error(`copying ${designName} answered ${created.status()}`);
  return { projectId: project.id, designId: ((await created.json()) as { id: string }).id };
}
