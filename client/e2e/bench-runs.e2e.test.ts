import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { predictedLoadCurve, type CurvePoint } from '@ladderwright/shared/bench';
import { baseUrl, launchJourneyBrowser, openJourneyPage, screenshotDir, signInAsDemo } from './journey';

let browser: Browser;
let context: BrowserContext;
let page: Page;
let pageErrors: string[];

describe('bench runs journey', () => {
  beforeAll(async () => {
    browser = await launchJourneyBrowser();
    ({
      context,
      page,
      errors: pageErrors,
    } = await openJourneyPage(browser, { viewport: { width: 1280, height: 900 } }));
  });
  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it('uploads a load sweep 2 % above the prediction and shows the overlay and a pass with 60 % margin', async () => {
    await signInAsDemo(page, 'engineer@northfold.test');

    // A seeded design and its latest revision, found through the API with the browser's session.
    const projects = (await (await page.request.get(`${baseUrl}/api/projects`)).json()) as {
      id: string;
      name: string;
    }[];
    const project = projects.find((candidate) => candidate.name === 'Detector tube bias') ?? projects[0];
    if (!project) throw new Error('no demo project');
    const designs = (await (await page.request.get(`${baseUrl}/api/projects/${project.id}/designs`)).json()) as {
      items: { id: string; latestRevisionNumber: number }[];
    };
    const design = designs.items[0];
    if (!design) throw new Error('no demo design');
    const revisionUrl = `${baseUrl}/api/projects/${project.id}/designs/${design.id}/revisions/${design.latestRevisionNumber}`;
    const revision = (await (await page.request.get(revisionUrl)).json()) as { report: unknown };
    // The curve the page compares with: a driver design's joint driver–ladder curve, else the regulation curve.
    const curve = predictedLoadCurve(revision.report);

    // Measured = 1.02 × predicted at five curve points: deviation +2 % each; against ±5 % the margin is
    // (0.05 − 0.02)/0.05 = 60 % (worked by hand), a pass.
    const rows = [2, 4, 6, 8, 10].map((i) => curve[i] as CurvePoint);
    const csv = [
      'current (uA),voltage (V)',
      ...rows.map((p) => `${(p.x * 1e6).toPrecision(12)},${(p.y * 1.02).toPrecision(12)}`),
    ].join('\n');

    // In-app navigation (the router's history), as a link from the Workbench would do it.
    const benchPath = `/projects/${project.id}/designs/${design.id}/revisions/${design.latestRevisionNumber}/bench-runs`;
    await page.evaluate((path) => {
      window.history.pushState({}, '', path);
      window.dispatchEvent(new PopStateEvent('popstate'));
    }, benchPath);
    await page.getByRole('heading', { name: /Bench runs · revision/ }).waitFor();
    // Other journeys may have uploaded to this revision before: count the runs already listed.
    const runsTable = page.getByRole('table', { name: 'Bench runs of this revision' });
    await page.getByText('No bench runs for this revision yet.').or(runsTable).first().waitFor();
    const rowsBefore = (await runsTable.count()) > 0 ? await runsTable.getByRole('row').count() : 1;
    const form = page.getByRole('form', { name: 'Upload a bench run' });
    await form
      .locator('input[type="file"]')
      .first()
      .setInputFiles({ name: 'sweep.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await form.getByRole('button', { name: 'Upload and compare' }).click();

    const overlay = page.getByLabel('Bench overlay');
    await overlay.waitFor();
    await expect(overlay.getByLabel('pass, margin 60.0 %').textContent()).resolves.toContain('pass · margin 60.0 %');
    const deviations = page.getByRole('table', { name: 'Deviation per point' }).getByRole('row');
    expect(await deviations.count()).toBe(6);
    await expect(deviations.nth(1).textContent()).resolves.toContain('2.00 %');
    // The chart library loads with the first chart shown.
    await overlay.locator('.recharts-surface').first().waitFor();
    await expect(runsTable.textContent()).resolves.toContain('load sweep');
    await page.screenshot({ path: resolve(screenshotDir, 'bench-runs-overlay.png'), fullPage: true });

    // A bad file is refused with the line and column named, and nothing is added to the list.
    await form
      .locator('input[type="file"]')
      .first()
      .setInputFiles({
        name: 'bad.csv',
        mimeType: 'text/csv',
        buffer: Buffer.from('current (uA),voltage (V)\n10,abc\n20,900\n'),
      });
    await form.getByRole('button', { name: 'Upload and compare' }).click();
    await page.getByText("line 2, column voltage (V): 'abc' is not a number").first().waitFor();
    expect(await runsTable.getByRole('row').count()).toBe(rowsBefore + 1);
    expect(pageErrors.filter((text) => !text.includes('400'))).toEqual([]);
  });
});
