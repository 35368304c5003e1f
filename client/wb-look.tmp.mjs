import { chromium } from 'playwright-core';
const base = 'http://127.0.0.1:8475';
const who = process.argv[2] ?? 'engineer';
const which = Number(process.argv[3] ?? '0');
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'] });
for (const [w, h] of [[1440, 900], [1024, 768]]) {
  const context = await browser.newContext({ viewport: { width: w, height: h }, colorScheme: 'light' });
  const api = context.request;
  await api.post(`${base}/api/auth/sign-in`, { data: { email: `${who}@northfold.test`, password: 'Northfold-demo-1' } });
  const projects = await (await api.get(`${base}/api/projects`)).json();
  const project = projects[which % projects.length];
  const designs = await (await api.get(`${base}/api/projects/${project.id}/designs`)).json();
  const list = designs.items ?? designs;
  const design = list[0];
  const page = await context.newPage();
  page.on('pageerror', (e) => console.log('pageerror', e.message));
  await page.goto(`${base}/projects/${project.id}/designs/${design.id}`);
  await page.getByText(/server result of r/).waitFor({ timeout: 20000 });
  await page.waitForTimeout(800);
  await page.screenshot({ path: `/tmp/wb-shots/${who}-${which}-${w}.png` });
  if (process.argv[4]) {
    const c1 = page.getByLabel('C1 capacitance');
    await c1.fill('1n');
    await page.getByText('live preview (unsaved edits)').waitFor();
    await page.screenshot({ path: `/tmp/wb-shots/${who}-${which}-${w}-edited.png` });
  }
  await context.close();
}
await browser.close();
