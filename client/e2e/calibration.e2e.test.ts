import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { predictedLoadCurve } from '@ladderwright/shared/bench';
import {
  baseUrl,
  copySeededDesign,
  SEEDED_TESTER,
  launchJourneyBrowser,
  openJourneyPage,
  screenshotDir,
  signInAsDemo,
} from './journey';

let browser: Browser;
let context: BrowserContext;
let page: Page;
let pageErrors: string[];

describe('calibration journey', () => {
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

  it('uploads a sweep, calibrates the transistor gain and starts a revision from the calibrated model', async () => {
    await signInAsDemo(page, 'engineer@northfold.test');
    // A copy of the tester's seeded first revision: the bench run and the revision started from the calibrated
    // model go to the copy, so the demo design other journeys open keeps its revisions.
    const { projectId, designId } = await copySeededDesign(page, SEEDED_TESTER, 'Tester for calibration');
    const project = { id: projectId };
    const design = { id: designId };
    const latest = 1;
    const revisionUrl = `${baseUrl}/api/projects/${project.id}/designs/${design.id}/revisions/${latest}`;
    const revision = (await (await page.request.get(revisionUrl)).json()) as { report: unknown };
    // A sweep 3 % below the predicted output-vs-load curve at its first six points (a prototype that
    // delivers less than drawn); the fit then moves the gain to explain it.
    // The curve the page compares with (the tester is a driver design: its joint driver–ladder curve).
    const rows = predictedLoadCurve(revision.report).slice(0, 6);
    const csv = [
      'current (uA),voltage (V)',
      ...rows.map((p) => `${(p.x * 1e6).toPrecision(10)},${(p.y * 0.97).toPrecision(10)}`),
    ].join('\n');

    const benchPath = `/projects/${project.id}/designs/${design.id}/revisions/${latest}/bench-runs`;
    await page.evaluate((path) => {
      window.history.pushState({}, '', path);
      window.dispatchEvent(new PopStateEvent('popstate'));
    }, benchPath);
    await page.getByRole('heading', { name: /Bench runs · revision/ }).waitFor();
    const form = page.getByRole('form', { name: 'Upload a bench run' });
    await form.getByLabel('Title').fill('Prototype 3 sweep');
    await form
      .locator('input[type="file"]')
      .first()
      .setInputFiles({ name: 'sweep.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await form.getByRole('button', { name: 'Upload and compare' }).click();
    await page.getByLabel('Bench overlay').waitFor();

    const panel = page.getByLabel('Calibrate', { exact: true });
    await panel.getByLabel('Fit Transistor current gain hFE').check();
    await panel.getByLabel('Fit Prototype 3 sweep as').click();
    await page.getByRole('option', { name: 'load sweep (estimate)' }).click();
    await panel.getByRole('button', { name: 'Run calibration' }).click();
    const result = panel.getByLabel('Calibration result');
    await result.waitFor({ timeout: 60_000 });
    const fitted = panel.getByRole('table', { name: 'Fitted parameters' });
    await expect(fitted.textContent()).resolves.toContain('Transistor current gain hFE');
    // A load sweep's interval is the Jacobian's, and the table says so.
    await expect(fitted.textContent()).resolves.toContain('Jacobian, linearized');
    await expect(panel.getByRole('table', { name: 'Residual per run' }).textContent()).resolves.toContain(
      'Prototype 3 sweep',
    );
    await result.locator('.recharts-surface').first().waitFor();
    await page.screenshot({ path: resolve(screenshotDir, 'calibration-result.png'), fullPage: true });

    // The step is taken at the viewport the page was laid out in; the 1024 × 768 look comes afterwards, on a page
    // of its own, so no click ever follows a viewport change.
    const startRevision = panel.getByRole('button', { name: 'Start revision from calibrated model' });
    await expect.poll(() => startRevision.isEnabled()).toBe(true);
    await startRevision.click();
    await page.waitForURL(new RegExp(`/designs/${design.id}\\?rev=${latest + 1}$`));
    await page.screenshot({ path: resolve(screenshotDir, 'calibration-new-revision.png') });

    // Back on the Bench runs of the calibrated revision, the panel shows its newest calibration and the revision
    // started from it.
    const narrow = await context.newPage();
    narrow.on('pageerror', (error) => pageErrors.push(error.message));
    await narrow.setViewportSize({ width: 1024, height: 768 });
    await narrow.goto(`${baseUrl}${benchPath}`);
    const narrowPanel = narrow.getByLabel('Calibrate', { exact: true });
    const started = narrowPanel.getByText(`Revision ${latest + 1} was started from this calibration.`);
    await started.waitFor();
    await expect(
      narrowPanel.getByRole('button', { name: 'Start revision from calibrated model' }).isDisabled(),
    ).resolves.toBe(true);
    await narrowPanel.getByRole('table', { name: 'Fitted parameters' }).scrollIntoViewIfNeeded();
    await narrow.screenshot({ path: resolve(screenshotDir, 'calibration-result-1024.png') });
    await narrow.close();

    const saved = (await (
      await page.request.get(`${baseUrl}/api/projects/${project.id}/designs/${design.id}/revisions/${latest + 1}`)
    ).json()) as { changeNote: string };
    expect(saved.changeNote).toContain("bench runs 'Prototype 3 sweep'");
    expect(saved.changeNote).toContain('Transistor current gain hFE');
    expect(pageErrors).toEqual([]);
  });
});
