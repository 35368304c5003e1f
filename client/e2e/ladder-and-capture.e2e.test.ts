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

/** The first design of the demo project whose name contains `projectName`, with its latest revision's document. */
async function demoDesign(page: Page, projectName: string) {
  const projects = (await (await page.request.get(`${baseUrl}/api/projects`)).json()) as Listed[];
  const project = projects.find((candidate) => candidate.name.includes(projectName));
  if (!project) throw new Error(`no demo project named ${projectName}`);
  const designs = (await (await page.request.get(`${baseUrl}/api/projects/${project.id}/designs`)).json()) as {
    items: Listed[];
  };
  const design = designs.items[0];
  if (!design) throw new Error('no demo design');
  const revision = (await (
    await page.request.get(
      `${baseUrl}/api/projects/${project.id}/designs/${design.id}/revisions/${design.latestRevisionNumber}`,
    )
  ).json()) as {
    document: { multiplier: { cellCount: number; capacitors: unknown[] } } & Record<string, unknown>;
    report: { outputMeanV: number; ripplePeakToPeakV: number; resolvedDrive: { frequencyHz: number } };
  };
  return { project, design, revision };
}

/** Every pair of text boxes of the schematic that intersect, from the browser's own text metrics (getBBox). */
async function labelOverlaps(page: Page): Promise<{ count: number; overlaps: string[] }> {
  const drawing = page.locator('svg[data-schematic]');
  await drawing.waitFor();
  return drawing.evaluate((svg) => {
    const boxes = [...svg.querySelectorAll('text')].map((text) => ({
      text: text.textContent ?? '',
      box: text.getBBox(),
    }));
    const overlaps: string[] = [];
    boxes.forEach((a, i) =>
      boxes.slice(i + 1).forEach((b) => {
        const hit =
          a.box.x < b.box.x + b.box.width &&
          b.box.x < a.box.x + a.box.width &&
          a.box.y < b.box.y + b.box.height &&
          b.box.y < a.box.y + a.box.height;
        if (hit) overlaps.push(`${a.text} × ${b.text}`);
      }),
    );
    return { count: boxes.length, overlaps };
  });
}

describe.each([
  { width: 1440, height: 900 },
  { width: 1024, height: 768 },
])('a ten-stage ladder and a scope capture at $width×$height', (viewport) => {
  let context: BrowserContext;
  let page: Page;
  let pageErrors: string[];
  beforeAll(async () => {
    browser ??= await launchJourneyBrowser();
    ({ context, page, errors: pageErrors } = await openJourneyPage(browser, { viewport }));
    await signInAsDemo(page, 'engineer@northfold.test');
  });
  afterAll(async () => {
    await context?.close();
  });

  it('draws the schematic of a 20-cell (10-stage) half-wave ladder with no two labels overlapping', async () => {
    const { project, revision } = await demoDesign(page, 'onizer');
    const document = structuredClone(revision.document);
    const last = document.multiplier.capacitors.at(-1);
    document.multiplier.cellCount = 20;
    document.multiplier.capacitors = Array.from({ length: 20 }, (_, i) => document.multiplier.capacitors[i] ?? last);
    const created = await page.request.post(`${baseUrl}/api/projects/${project.id}/designs`, {
      data: { name: `Ten-stage ladder ${viewport.width}`, from: { kind: 'document', document } },
    });
    expect(created.status()).toBe(201);
    const design = (await created.json()) as { id: string };
    await page.goto(`${baseUrl}/projects/${project.id}/designs/${design.id}`);
    await page.getByText(/server result of r1/).waitFor();
    await page.getByRole('tab', { name: 'Ladder' }).click();
    // The labels are laid out at the drawing's own size; fitted into a narrow column Chromium measures text
    // with the scaled-down font's metrics, so the layout is checked at full size.
    const fullSize = page.getByText('Full size', { exact: true });
    await fullSize.waitFor({ state: 'visible' });
    await fullSize.click();
    await page.locator('svg[data-schematic][data-fitted="false"]').waitFor();
    const result = await labelOverlaps(page);
    // Twenty capacitors and twenty diodes, each named.
    expect(result.count).toBeGreaterThan(40);
    expect(result.overlaps).toEqual([]);
    const figure = page.locator('svg[data-schematic]');
    await figure.scrollIntoViewIfNeeded();
    await page.screenshot({ path: resolve(screenshotDir, `ten-stage-${viewport.width}.png`) });
    expect(pageErrors).toEqual([]);
  });

  it('overlays a scope capture on the predicted mean and ripple band with time in engineering units', async () => {
    const { project, design, revision } = await demoDesign(page, 'Detector');
    // A 2 ms capture at 100 kS/s of the predicted output with its predicted ripple at the drive frequency.
    const meanV = revision.report.outputMeanV;
    const rippleV = revision.report.ripplePeakToPeakV;
    const frequencyHz = revision.report.resolvedDrive.frequencyHz;
    const rows = Array.from({ length: 200 }, (_, i) => {
      const t = i * 1e-5;
      return `${(t * 1e3).toFixed(3)},${(meanV + (rippleV / 2) * Math.sin(2 * Math.PI * frequencyHz * t)).toFixed(3)}`;
    });
    const csv = ['Time [ms],CH1 [V]', ...rows].join('\n');
    const benchPath = `/projects/${project.id}/designs/${design.id}/revisions/${design.latestRevisionNumber}/bench-runs`;
    await page.goto(`${baseUrl}${benchPath}`);
    await page.getByRole('heading', { name: /Bench runs · revision/ }).waitFor();
    const form = page.getByRole('form', { name: 'Upload a bench run' });
    await form.getByText('Scope capture (time, voltage)').click();
    await form
      .locator('input[type="file"]')
      .first()
      .setInputFiles({ name: 'capture.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await form.getByRole('button', { name: 'Upload and compare' }).click();
    const overlay = page.getByLabel('Bench overlay');
    await overlay.locator('.recharts-surface').first().waitFor();
    await overlay.scrollIntoViewIfNeeded();
    await page.screenshot({ path: resolve(screenshotDir, `scope-capture-${viewport.width}.png`), fullPage: true });
    // The title is the run's own or a plain one, never a dangling colon for a run without a title.
    await overlay.getByText('Capture against prediction', { exact: true }).waitFor();
    // The time axis names its prefixed unit; its ticks are round numbers in that unit, never raw floating point
    // (0.9975000000000002) or a current unit on a time axis.
    await overlay.getByText(/^Time \((ms|µs|s)\)$/).waitFor();
    // The horizontal axis's ticks: the tick labels that share one baseline (recharts 3 draws them in layers apart
    // from their axis).
    const ticks = await overlay.evaluate((root) => {
      const byRow = new Map<string, string[]>();
      for (const tick of root.querySelectorAll('.recharts-cartesian-axis-tick-value')) {
        const y = tick.getAttribute('y') ?? '';
        byRow.set(y, [...(byRow.get(y) ?? []), (tick.textContent ?? '').trim()]);
      }
      return [...byRow.values()].sort((a, b) => b.length - a.length)[0] ?? [];
    });
    expect(ticks.length).toBeGreaterThan(2);
    for (const tick of ticks) expect(tick).toMatch(/^-?\d{1,4}(\.\d{1,3})?$/);
    // The measured points span the plot: the last tick is near the capture's 2 ms end, not a few % of the axis.
    expect(Number(ticks.at(-1))).toBeGreaterThanOrEqual(1.5);
    expect(pageErrors.filter((text) => !text.includes('400'))).toEqual([]);
  });
});

afterAll(async () => {
  await browser?.close();
});
