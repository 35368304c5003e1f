import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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

/** Picks an option of a select by its label and the start of the option's text. */
async function choose(current: Page, label: string, option: RegExp): Promise<void> {
  await current.getByRole('combobox', { name: label, exact: true }).click();
  await current.getByRole('option', { name: option }).click();
}

/** Verdicts of the transformer Checks in the Transformer tab, by the row's text. */
async function transformerVerdicts(current: Page): Promise<string[]> {
  const rows = current.getByRole('tabpanel').getByRole('table', { name: 'Checks' }).locator('tr[data-verdict]');
  return rows.evaluateAll((list) => list.map((row) => row.getAttribute('data-verdict') ?? ''));
}

// Flux figures: B = L·Ipk / (N·Ae) (McLyman, Transformer and Inductor Design Handbook, from memory). With the
// tester's 1 mH, 15 : 6 : 900 turns on the small high-permeability E13 core (Ae 12.4 mm², Bsat 320 mT at 100 °C)
// put the peak past saturation. The Sizer gaps every core at least 0.051 mm, the shortest gap made to a
// tolerance (Power Integrations AN-18, 7/96, p. 12), so the 1 mH takes more turns than the ungapped AL would: it ranks first
// the E30 core (Ae 60 mm², bobbin 17.6 mm broad) with 34 primary turns in the given 1 : 60 ratio, with end margins
// for the creepage IEC 60664-1 asks at the ~1.6 kV flyback; the smaller cores' bobbins do not hold the turns.
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
    const { projectId, designId } = await copySeededDesign(page, SEEDED_TESTER, 'Tester on a designed transformer');
    const project = { id: projectId };
    const design = { id: designId };
    await page.goto(`${baseUrl}/projects/${project.id}/designs/${design.id}`);
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();

    // Given numbers -> designed from a core on the shelf: it starts on the core the Sizer ranks first for this
    // driver (the E30, see below), its 1 mH and 1 : 60 kept, and says so.
    await page.getByLabel('Transformer from').getByText('Designed from a core').click();
    const startNote = page.getByRole('status', { name: 'Starting core' });
    await expect
      .poll(() => startNote.textContent(), { timeout: 20_000 })
      .toMatch(/NF-KE30-M1 is the only core of 7 that fits the driver’s 1 mH/);
    expect(await startNote.textContent()).toMatch(/34 : 14 : 2040 turns/);
    await shot(page, 'transformer-00-starting-core.png');
    await page.setViewportSize({ width: 1024, height: 768 });
    await startNote.waitFor();
    await shot(page, 'transformer-00-starting-core-1024.png');
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.getByRole('combobox', { name: 'Core', exact: true }).waitFor();
    // Now the saturating case by hand.
    await choose(page, 'Core', /^NF-KE13-M2/);
    await setTurns(page, 'Primary turns', 15);
    await setTurns(page, 'Feedback turns', 6);
    // Fewer turns in the same 1 : 60 ratio the driver was set for.
    await setTurns(page, 'Secondary turns', 900);
    await page.getByRole('tab', { name: 'Transformer' }).click();
    await expect.poll(() => saturationVerdict(page), { timeout: 20_000 }).toBe('fail');
    await shot(page, 'transformer-01-saturated.png');

    // The fix: the core Sizer below the figures starts from this driver's figures; the E30 core it ranks
    // first is applied to the draft, one undoable edit.
    const sizer = page.getByRole('region', { name: 'Transformer cores for this driver' });
    await sizer.getByText(/^From the driver of .+, at the rated load$/).waitFor();
    // A primary wire for the ~80 mA primary rather than the shelf's thickest.
    await choose(page, 'Primary and feedback wire', /^NF-W020-G2$/);
    await sizer.getByRole('button', { name: /^Rank \d+ shelf cores$/ }).click();
    // Every fitting core's windings cost this driver power its given numbers do not (their 60 Ω secondary is
    // below what 1200 turns of 0.05 mm wire measure): the Sizer says so beside each core.
    await sizer.getByRole('row').filter({ hasText: 'NF-KE30-M1' }).filter({ hasText: 'fails driver power' }).waitFor();
    await sizer.getByRole('button', { name: 'Apply NF-KE30-M1 to the design' }).click();
    await sizer.getByRole('status').filter({ hasText: 'NF-KE30-M1 applied to the draft' }).waitFor();
    await expect.poll(() => saturationVerdict(page), { timeout: 20_000 }).toBe('pass');
    // The result tabs redraw once typing pauses, so wait for the whole table to settle on neither verdict.
    await expect
      .poll(
        async () => {
          const verdicts = await transformerVerdicts(page);
          return verdicts.length > 0 && !verdicts.includes('fail') && !verdicts.includes('marginal');
        },
        { timeout: 20_000 },
      )
      .toBe(true);
    await page.locator('[data-driver-effect="fine"]').waitFor();
    expect(await page.locator('[data-transformer="peakFluxDensityT"]').textContent()).toMatch(/^\d+(\.\d+)? mT$/);
    await shot(page, 'transformer-02-fixed.png');
    // The applied section is an edit like any other: undo brings the saturating E13 back, redo the fix.
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).click();
    await page.keyboard.press('Control+z');
    await expect.poll(() => saturationVerdict(page), { timeout: 20_000 }).toBe('fail');
    await page.keyboard.press('Control+Shift+z');
    await expect.poll(() => saturationVerdict(page), { timeout: 20_000 }).toBe('pass');

    await page
      .getByLabel('Change note')
      .fill('Transformer designed on the E30 core the Sizer ranks first, 34 : 14 : 2040 turns');
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
      'NF-KE30-M1',
      'Winding schedule',
      'Hipot test voltage',
    ]) {
      expect(text).toContain(expected);
    }
    expect(text).toMatch(/primary\s+1 \(dot\)–2\s+34/);
    await shot(page, 'transformer-03-sign-off.png');
    expect(pageErrors).toEqual([]);
  }, 180_000);
});
