import { readFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, launchJourneyBrowser, openJourneyPage, screenshotDir, signInAsDemo } from './journey';

let browser: Browser;
let context: BrowserContext;
let page: Page;

interface Listed {
  id: string;
  name: string;
  latestRevisionNumber: number;
}

/** The demo project whose name contains `projectName` and its first design. */
async function demoDesign(current: Page, projectName: string): Promise<{ project: Listed; design: Listed }> {
  const projects = (await (await current.request.get(`${baseUrl}/api/projects`)).json()) as Listed[];
  const project = projects.find((candidate) => candidate.name.includes(projectName));
  if (!project) throw new Error(`no demo project named ${projectName}`);
  const designs = (await (await current.request.get(`${baseUrl}/api/projects/${project.id}/designs`)).json()) as {
    items: Listed[];
  };
  const design = designs.items[0];
  if (!design) throw new Error('no demo design');
  return { project, design };
}

/** Opens the Workbench of the first design of the demo project whose name contains `projectName`. */
async function openDemoDesign(current: Page, projectName: string): Promise<void> {
  const { project, design } = await demoDesign(current, projectName);
  await current.goto(`${baseUrl}/projects/${project.id}/designs/${design.id}`);
  await current.getByText(/server result of r/).waitFor();
}

/**
 * A new design (seeded ones stay as they are) copied from the first design of a demo project with its half-wave
 * ladder made `stages` stages long, every capacitor as its first; its Workbench opened.
 */
async function openLongerLadder(current: Page, projectName: string, stages: number): Promise<void> {
  const { project, design } = await demoDesign(current, projectName);
  const revisionUrl = `${baseUrl}/api/projects/${project.id}/designs/${design.id}/revisions/${design.latestRevisionNumber}`;
  const { document } = (await (await current.request.get(revisionUrl)).json()) as {
    document: { name: string; multiplier: { topology: string; cellCount: number; capacitors: object[] } };
  };
  const first = document.multiplier.capacitors[0];
  if (document.multiplier.topology !== 'half-wave' || !first) throw new Error('a half-wave demo ladder is expected');
  document.multiplier.cellCount = 2 * stages;
  document.multiplier.capacitors = Array.from({ length: 2 * stages }, () => ({ ...first }));
  document.name = `${document.name}, ${stages} stages`;
  const created = await current.request.post(`${baseUrl}/api/projects/${project.id}/designs`, {
    data: { name: document.name, from: { kind: 'document', document } },
  });
  expect(created.status()).toBe(201);
  const copy = (await created.json()) as { id: string };
  await current.goto(`${baseUrl}/projects/${project.id}/designs/${copy.id}`);
  await current.getByText(/server result of r/).waitFor();
}

/** Chooses one entry of a chart's Export menu and reads the file the browser downloads. */
async function exportAs(current: Page, chart: string, entry: string): Promise<{ name: string; body: Buffer }> {
  await current.getByRole('button', { name: `Export ${chart}` }).click();
  const [download] = await Promise.all([
    current.waitForEvent('download'),
    current.getByRole('menuitem', { name: entry }).click(),
  ]);
  const path = await download.path();
  return { name: download.suggestedFilename(), body: await readFile(path) };
}

describe('plots and schematic journey', () => {
  beforeAll(async () => {
    browser = await launchJourneyBrowser();
    ({ context, page } = await openJourneyPage(browser, {
      viewport: { width: 1440, height: 900 },
      acceptDownloads: true,
    }));
    await signInAsDemo(page, 'engineer@northfold.test');
  });
  afterAll(async () => {
    await context?.close();
    await browser?.close();
  });

  it.each([
    { width: 1440, height: 900 },
    { width: 1024, height: 768 },
  ])('at $width×$height exports the regulation plot as a PNG, an SVG and a CSV that are each valid', async (size) => {
    await page.setViewportSize(size);
    await openDemoDesign(page, 'Detector');
    const figure = page.getByRole('figure', { name: 'Output vs load current' });
    await figure.locator('.recharts-surface').waitFor();
    await figure.scrollIntoViewIfNeeded();
    await page.getByRole('button', { name: 'Export Output vs load current' }).waitFor({ state: 'visible' });

    const png = await exportAs(page, 'Output vs load current', 'PNG image');
    expect(png.name).toBe('output-vs-load-current.png');
    // PNG signature (ISO/IEC 15948 §5.2): 89 50 4E 47 0D 0A 1A 0A.
    expect([...png.body.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

    const svg = await exportAs(page, 'Output vs load current', 'SVG drawing');
    expect(svg.name).toBe('output-vs-load-current.svg');
    // The browser's own XML parser reads it as an SVG document without a parse error.
    const parsed = await page.evaluate((text) => {
      const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
      return {
        root: doc.documentElement.nodeName,
        errors: doc.getElementsByTagName('parsererror').length,
        paths: doc.getElementsByTagName('path').length,
      };
    }, svg.body.toString('utf8'));
    expect(parsed).toMatchObject({ root: 'svg', errors: 0 });
    expect(parsed.paths).toBeGreaterThan(0);

    const csv = await exportAs(page, 'Output vs load current', 'CSV data');
    const lines = csv.body.toString('utf8').trim().split('\r\n');
    expect(lines[0]).toBe('Load current (A),output (mean) (V)');
    expect(lines.length).toBeGreaterThan(5);
    for (const line of lines.slice(1)) expect(line).toMatch(/^-?[\d.e+-]+,-?[\d.e+-]+$/);
  });

  it.each([
    { project: 'Detector', what: 'a tripler', stages: null },
    { project: 'ionizer', what: 'a 10-stage (20-cell) half-wave ladder', stages: 10 },
  ])('draws the schematic of $what with no two labels overlapping (getBBox)', async ({ project, stages }) => {
    await page.setViewportSize({ width: 1440, height: 900 });
    if (stages === null) await openDemoDesign(page, project);
    else await openLongerLadder(page, project, stages);
    await page.getByRole('tab', { name: 'Ladder' }).click();
    const drawing = page.locator('svg[data-schematic]');
    await drawing.waitFor();
    const result = await drawing.evaluate((svg) => {
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
      return { count: boxes.length, texts: boxes.map((b) => b.text), overlaps };
    });
    await drawing.screenshot({ path: resolve(screenshotDir, `schematic-${stages ?? 'tripler'}.png`) });
    expect(result.count).toBeGreaterThan(10);
    // Every capacitor of the ladder is drawn: C3 last on the tripler, C20 on the 10-stage ladder.
    expect(result.texts.some((text) => text.startsWith(stages === null ? 'C3' : 'C20'))).toBe(true);
    expect(result.overlaps).toEqual([]);
  });
});
