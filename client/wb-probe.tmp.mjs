import { chromium } from 'playwright-core';
const base = 'http://127.0.0.1:8475';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'] });
const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
const api = context.request;
await api.post(`${base}/api/auth/sign-in`, { data: { email: 'engineer@northfold.test', password: 'Northfold-demo-1' } });
const [project] = await (await api.get(`${base}/api/projects`)).json();
const created = await api.post(`${base}/api/projects/${project.id}/designs`, { data: { name: 'Probe', from: { kind: 'template', templateId: 'detectorBias' } } });
const design = await created.json();
const page = await context.newPage();
await page.goto(`${base}/projects/${project.id}/designs/${design.id}`);
await page.getByText('server result of r1').waitFor();
const input = await page.getByLabel('C1 capacitance').elementHandle();
for (let i = 0; i < 6; i++) {
  const r = await page.evaluate(({ input, text }) => {
    const figures = () => [...document.querySelectorAll('[data-figure] [data-value]')].map((e) => e.textContent).join('|');
    const badge = () => [...document.querySelectorAll('.mantine-Badge-root')].map((e) => e.textContent ?? '').find((t) => t.startsWith('live preview')) ?? '';
    const before = figures();
    return new Promise((resolve) => {
      const start = performance.now(); let renderMs = null; let syncMs = null;
      const check = () => { const now = performance.now() - start; if (renderMs === null && badge().includes('updating')) renderMs = now; if (badge() === 'live preview (unsaved edits)' && figures() !== before) { obs.disconnect(); resolve({ syncMs, renderMs, resultMs: now }); } };
      const obs = new MutationObserver(check); obs.observe(document.body, { subtree: true, childList: true, characterData: true });
      const setValue = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value').set;
      setValue.call(input, text); input.dispatchEvent(new Event('input', { bubbles: true }));
      syncMs = performance.now() - start;
      check();
    });
  }, { input, text: `${(1.2 + 0.1 * i).toFixed(1)}n` });
  console.log(JSON.stringify(r));
}
await browser.close();
