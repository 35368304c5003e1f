import { chromium } from 'playwright-core';
const base = 'http://127.0.0.1:8475';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'] });
for (const [w, h] of [[1440, 900], [1024, 768]]) {
  const context = await browser.newContext({ viewport: { width: w, height: h }, colorScheme: 'light' });
  const api = context.request;
  await api.post(`${base}/api/auth/sign-in`, { data: { email: 'engineer@northfold.test', password: 'Northfold-demo-1' } });
  const projects = await (await api.get(`${base}/api/projects`)).json();
  const project = projects[0];
  const list = (await (await api.get(`${base}/api/projects/${project.id}/designs`)).json()).items;
  let other = list[1];
  if (!other) {
    const created = await api.post(`${base}/api/projects/${project.id}/designs`, { data: { name: 'Four-cell variant', from: { kind: 'template', templateId: 'surfaceChargeTester' } } });
    other = await created.json();
  }
  const page = await context.newPage();
  page.on('pageerror', (e) => console.log('pageerror', e.message));
  await page.goto(`${base}/projects/${project.id}/compare?a=${list[0].id}.1&b=${other.id}.1`);
  await page.getByRole('table', { name: 'Results' }).waitFor({ timeout: 20000 });
  await page.waitForTimeout(500);
  await page.screenshot({ path: `/tmp/wb-shots/compare-${w}.png` });
  await page.getByRole('table', { name: 'Results' }).scrollIntoViewIfNeeded();
  await page.screenshot({ path: `/tmp/wb-shots/compare-${w}-results.png` });
  await context.close();
}
await browser.close();
