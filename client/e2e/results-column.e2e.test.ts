import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, launchJourneyBrowser, openJourneyPage, screenshotDir, signInAsDemo } from './journey';

let browser: Browser;

interface Listed {
  id: string;
  name: string;
  latestRevisionNumber: number;
}

/**
 * A copy of the detector-bias demo (a tripler) made through the API under a name of its own, so that a simulation
 * run here never becomes the current simulation of a design another journey reads.
 */
async function copyOfDetectorDemo(page: Page, name: string): Promise<{ projectId: string; designId: string }> {
  const projects = (await (await page.request.get(`${baseUrl}/api/projects`)).json()) as Listed[];
  const project = projects.find((candidate) => candidate.name.includes('Detector'));
  if (!project) throw new Error('no detector-bias demo project');
  const designs = (await (await page.request.get(`${baseUrl}/api/projects/${project.id}/designs`)).json()) as {
    items: Listed[];
  };
  const demo = designs.items.find((design) => design.name.startsWith('Detector tube bias'));
  if (!demo) throw new Error('no detector-bias demo design');
  const revision = (await (
    await page.request.get(
      `${baseUrl}/api/projects/${project.id}/designs/${demo.id}/revisions/${demo.latestRevisionNumber}`,
    )
  ).json()) as { document: Record<string, unknown> };
  const created = await page.request.post(`${baseUrl}/api/projects/${project.id}/designs`, {
    data: { name, from: { kind: 'document', document: { ...revision.document, name } } },
  });
  expect(created.status()).toBe(201);
  return { projectId: project.id, designId: ((await created.json()) as { id: string }).id };
}

describe.each([
  { width: 1440, height: 900 },
  { width: 1024, height: 768 },
])('the result tabs at $width×$height', (viewport) => {
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  let design: { projectId: string; designId: string };
  const isSideBySide = viewport.width >= 1280;

  beforeAll(async () => {
    browser ??= await launchJourneyBrowser();
    ({ context, page, errors: pageErrors } = await openJourneyPage(browser, { viewport }));
    await signInAsDemo(page, 'engineer@northfold.test');
    design = await copyOfDetectorDemo(page, `Results column ${viewport.width}`);
  });
  afterAll(async () => {
    await context?.close();
  });

  const openWorkbench = async () => {
    await page.goto(`${baseUrl}/projects/${design.projectId}/designs/${design.designId}`);
    await page.getByText(/server result of r1/).waitFor();
  };

  it('fits the schematic to the column, and shows it at full size on request', async () => {
    await openWorkbench();
    await page.getByRole('tab', { name: 'Ladder' }).click();
    const drawing = page.locator('svg[data-schematic]');
    await drawing.waitFor();
    const fitted = await drawing.evaluate((svg) => ({
      shownPx: svg.getBoundingClientRect().width,
      ownPx: Number(svg.getAttribute('width')),
      boxPx: svg.parentElement!.clientWidth,
      scrollsPx: svg.parentElement!.scrollWidth,
    }));
    expect(fitted.shownPx).toBeLessThanOrEqual(fitted.boxPx + 1);
    expect(fitted.scrollsPx).toBeLessThanOrEqual(fitted.boxPx + 1);
    const fullSize = page.getByText('Full size', { exact: true });
    await fullSize.waitFor({ state: 'visible' });
    await fullSize.click();
    await page.locator('svg[data-schematic][data-fitted="false"]').waitFor();
    const full = await drawing.evaluate((svg) => svg.getBoundingClientRect().width);
    expect(full).toBeCloseTo(fitted.ownPx, 0);
    expect(pageErrors).toEqual([]);
  });

  it('condenses the Results summary while what is under it scrolls, and opens it again at the top', async () => {
    await openWorkbench();
    const summary = page.getByRole('region', { name: 'Results summary' });
    await summary.waitFor();
    const tabs = page.getByRole('region', { name: 'Result tabs' });
    // Side by side the result tabs scroll on their own; stacked, the page scrolls the form under the stuck summary.
    const scrollBy = (px: number) =>
      isSideBySide ? tabs.evaluate((box, by) => box.scrollBy(0, by), px) : page.mouse.wheel(0, px);
    const openHeightPx = (await summary.boundingBox())!.height;
    await scrollBy(600);
    await page.locator('[aria-label="Results summary"][data-condensed="true"]').waitFor();
    expect((await summary.boundingBox())!.height).toBeLessThan(openHeightPx);
    expect(await summary.locator('[data-figure-target]').first().isVisible()).toBe(false);
    await scrollBy(-5000);
    await page.locator('[aria-label="Results summary"][data-condensed="false"]').waitFor();
    expect(pageErrors).toEqual([]);
  });

  it('runs a simulation and shows the start-up whole, scaled to its settling, with two marks told apart', async () => {
    await openWorkbench();
    await page.getByRole('tab', { name: 'Waveforms' }).click();
    const start = page.getByRole('button', { name: 'Start simulation' });
    await start.waitFor({ state: 'visible' });
    await start.click();
    const startUp = page.getByRole('figure', { name: 'Start-up' });
    await startUp.locator('svg.recharts-surface').first().waitFor({ timeout: 120_000 });
    const key = startUp.getByLabel('Chart key');
    await key.getByText(/^time to within 1 %/).waitFor();
    // The first view ends at 1.5× the time to within 1 %; the rest of the run is one click away.
    await startUp.getByRole('button', { name: 'Show all' }).waitFor();
    const marks = await startUp
      .locator('.recharts-reference-line line')
      .evaluateAll((lines) =>
        lines.map((line) => [line.getAttribute('stroke'), line.getAttribute('stroke-dasharray')]),
      );
    expect(marks).toHaveLength(2);
    expect(marks[0]![0]).not.toBe(marks[1]![0]);
    expect(marks[0]![1]).not.toBe(marks[1]![1]);
    // Each mark is tagged on the plot itself, beside its line.
    const drawnTexts = await startUp.locator('svg.recharts-surface').first().locator('text').allTextContents();
    expect(drawnTexts).toEqual(expect.arrayContaining(['90 %', '1 %']));

    await startUp.evaluate((figure) => figure.scrollIntoView({ block: 'start' }));
    if (isSideBySide) {
      // Scrolled down, the Results summary condenses; the plot is brought to the column's top again after it.
      await page.locator('[aria-label="Results summary"][data-condensed="true"]').waitFor();
      await startUp.evaluate((figure) => figure.scrollIntoView({ block: 'start' }));
    }
    const place = await startUp.evaluate((figure) => {
      const box = figure.getBoundingClientRect();
      const summary = document.querySelector('[aria-label="Results summary"]')!.getBoundingClientRect();
      return {
        top: box.top,
        bottom: box.bottom,
        summaryBottom: summary.bottom,
        pageScrollsPx: document.documentElement.scrollHeight - window.innerHeight,
      };
    });
    await page.screenshot({ path: resolve(screenshotDir, `results-column-start-up-${viewport.width}.png`) });
    if (isSideBySide) {
      // Side by side the page itself does not scroll, and the plot stands whole below the Results summary.
      expect(place.pageScrollsPx).toBeLessThanOrEqual(4);
      expect(place.top).toBeGreaterThanOrEqual(place.summaryBottom - 1);
      expect(place.bottom).toBeLessThanOrEqual(viewport.height);
    }
    expect(pageErrors).toEqual([]);
  });
});
