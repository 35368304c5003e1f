import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, launchJourneyBrowser, openJourneyPage, screenshotDir, signInAsDemo } from './journey';

interface Listed {
  id: string;
  name: string;
}

let browser: Browser;
let context: BrowserContext;
let page: Page;
let pageErrors: string[];

async function shot(current: Page, name: string): Promise<void> {
  await current.screenshot({ path: resolve(screenshotDir, name), fullPage: true });
}

/** The verdict of the core saturation Check in the Transformer tab. */
async function saturationVerdict(current: Page): Promise<string | null> {
  const row = current
    .getByRole('tabpanel')
    .getByRole('table', { name: 'Checks' })
    .getByRole('row')
    .filter({ hasText: 'peak flux density' });
  return row.getAttribute('data-verdict', { timeout: 10_000 });
}

/** Types a whole number into a field of the designed transformer and leaves it. */
async function setTurns(current: Page, label: string, turns: number): Promise<void> {
  const field = current.getByLabel(label, { exact: true });
  await field.fill(String(turns));
  await field.blur();
}

// Flux figures: B = L·Ipk / (N·Ae) (McLyman, Transformer and Inductor Design Handbook, from memory); with the
// demo's 1 mH on the small high-permeability E13 core (Ae 12.4 mm², Bsat 320 mT at 100 °C), 15 primary turns
// put the peak past saturation and 30 bring it below 80 % of it.
describe('transformer journey', () => {
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

  it('designs the handheld tester’s transformer on a shelf core, fixes its saturation and downloads its sheet', async () => {
    await signInAsDemo(page, 'engineer@northfold.test');
    // A copy of the tester's seeded first revision, so revisions other journeys add to the demo design (a
    // calibrated model, say) do not change the starting point.
    const projects = (await (await page.request.get(`${baseUrl}/api/projects`)).json()) as Listed[];
    const project = projects.find((candidate) => candidate.name === 'Handheld surface-charge tester');
    if (!project) throw new Error('no demo tester project');
    const designs = (await (await page.request.get(`${baseUrl}/api/projects/${project.id}/designs`)).json()) as {
      items: Listed[];
    };
    const seeded = designs.items.find((candidate) => candidate.name === 'Handheld surface-charge tester');
    if (!seeded) throw new Error('no demo tester design');
    const first = (await (
      await page.request.get(`${baseUrl}/api/projects/${project.id}/designs/${seeded.id}/revisions/1`)
    ).json()) as { document: unknown };
    const created = await page.request.post(`${baseUrl}/api/projects/${project.id}/designs`, {
      data: { name: 'Tester on a designed transformer', from: { kind: 'document', document: first.document } },
    });
    expect(created.status()).toBe(201);
    const design = (await created.json()) as { id: string };
    await page.goto(`${baseUrl}/projects/${project.id}/designs/${design.id}`);
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();

    // Given numbers -> designed from a core on the shelf.
    await page.getByLabel('Transformer from').getByText('Designed from a core').click();
    await page.getByRole('combobox', { name: 'Core', exact: true }).click();
    await page.getByRole('option', { name: /^NF-KE13-M2/ }).click();
    await setTurns(page, 'Primary turns', 15);
    await setTurns(page, 'Feedback turns', 6);
    await page.getByRole('tab', { name: 'Transformer' }).click();
    await expect.poll(() => saturationVerdict(page), { timeout: 20_000 }).toBe('fail');
    await shot(page, 'transformer-01-saturated.png');

    // More turns on the same inductance: less flux.
    await setTurns(page, 'Primary turns', 30);
    await setTurns(page, 'Feedback turns', 12);
    await expect.poll(() => saturationVerdict(page), { timeout: 20_000 }).toBe('pass');
    expect(await page.locator('[data-transformer="peakFluxDensityT"]').textContent()).toMatch(/^\d+(\.\d+)? mT$/);
    await shot(page, 'transformer-02-fixed.png');

    await page.getByLabel('Change note').fill('Transformer designed on the E13 core, 30 primary turns');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await page.getByRole('link', { name: 'Sign-off of r2' }).click();
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download Transformer sheet (PDF, NOT RELEASED)', exact: true }).click(),
    ]);
    const pdfPath = resolve(screenshotDir, 'transformer-sheet.pdf');
    await download.saveAs(pdfPath);
    expect(download.suggestedFilename()).toMatch(/-r2-transformer-sheet\.pdf$/);
    expect(readFileSync(pdfPath).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = execFileSync('pdftotext', ['-layout', pdfPath, '-']).toString('utf8');
    for (const expected of [
      'Transformer sheet',
      'NOT RELEASED',
      'NF-KE13-M2',
      'Winding schedule',
      'Hipot test voltage',
    ]) {
      expect(text).toContain(expected);
    }
    expect(text).toMatch(/primary\s+1 \(dot\)–2\s+30/);
    await shot(page, 'transformer-03-sign-off.png');
    expect(pageErrors).toEqual([]);
  }, 180_000);
});
