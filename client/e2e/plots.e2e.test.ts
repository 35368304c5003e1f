import { readFile } from 'node:fs/promises';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, launchJourneyBrowser, openJourneyPage, signInAsDemo } from './journey';

let browser: Browser;
let context: BrowserContext;
let page: Page;

interface Listed {
  id: string;
  name: string;
  latestRevisionNumber: number;
}

/** Opens the Workbench of the first design of the demo project whose name contains `projectName`. */
async function openDemoDesign(current: Page, projectName: string): Promise<void> {
  const projects = (await (await current.request.get(`${baseUrl}/api/projects`)).json()) as Listed[];
  const project = projects.find((candidate) => candidate.name.includes(projectName));
  if (!project) throw new Error(`no demo project named ${projectName}`);
  const designs = (await (await current.request.get(`${baseUrl}/api/projects/${project.id}/designs`)).json()) as {
    items: Listed[];
  };
  const design = designs.items[0];
  if (!design) throw new Error('no demo design');
  await current.goto(`${baseUrl}/projects/${project.id}/designs/${design.id}`);
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

  it('exports the regulation plot as a PNG, an SVG and a CSV that are each valid', async () => {
    await openDemoDesign(page, 'Detector');
    await page.getByRole('figure', { name: 'Output vs load current' }).locator('.recharts-surface').waitFor();

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
    { project: 'Detector', what: 'a tripler' },
    { project: 'ionizer', what: 'a 14-cell (7-stage) half-wave ladder' },
  ])('draws the schematic of $what with no two labels overlapping (getBBox)', async ({ project }) => {
    await openDemoDesign(page, project);
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
      return { count: boxes.length, overlaps };
    });
    expect(result.count).toBeGreaterThan(10);
    expect(result.overlaps).toEqual([]);
  });
});
