import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseUrl, launchJourneyBrowser, openJourneyPage, signInAsDemo } from './journey';

const plantedEmail = (tag: string) => `planted-${tag}@northfold.test`;

/** A page on another port of 127.0.0.1 that submits a form to the app as soon as it loads. */
function attackPage(action: string, method: string, enctype: string, tag: string): string {
  const fields = { email: plantedEmail(tag), displayName: 'Planted', role: 'admin', password: 'Planted-admin-77' };
  const inputs = Object.entries(fields)
    .map(([name, value]) => `<input type="hidden" name="${name}" value="${value}">`)
    .join('');
  return `<!doctype html><html><head><link rel="icon" href="data:,"></head><body>
<form id="f" method="${method}" action="${action}" enctype="${enctype}">${inputs}</form>
<script>document.getElementById('f').submit();</script></body></html>`;
}

// SameSite=Strict compares sites (registrable domain, or the bare IP), not ports: a page on another port of
// 127.0.0.1 is same-site and its form posts carry the session cookie (RFC 6265bis, "same-site" requests).
describe('cross-port form post with the admin session', () => {
  let browser: Browser;
  let attacker: Server;
  let attackerUrl = '';

  beforeAll(async () => {
    browser = await launchJourneyBrowser();
    attacker = createServer((request, response) => {
      const url = new URL(request.url ?? '/', 'http://127.0.0.1');
      const enctype = url.searchParams.get('enctype') ?? 'application/x-www-form-urlencoded';
      const target = url.searchParams.get('target') ?? '/api/users';
      response.writeHead(200, { 'content-type': 'text/html' });
      const method = url.searchParams.get('method') ?? 'POST';
      response.end(attackPage(`${baseUrl}${target}`, method, enctype, url.searchParams.get('tag') ?? 'x'));
    });
    await new Promise<void>((done) => attacker.listen(0, '127.0.0.1', done));
    attackerUrl = `http://127.0.0.1:${(attacker.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await browser?.close();
    await new Promise<void>((done) => attacker?.close(() => done()));
  });

  it('refuses the auto-submitted form (urlencoded, text/plain, multipart) and creates no account', async () => {
    const { context, page } = await openJourneyPage(browser, { viewport: { width: 1024, height: 768 } }, /./);
    try {
      await signInAsDemo(page, 'admin@northfold.test');
      // The precondition of the attack holds: a navigation from the other port carries the admin's cookie.
      const me = page.waitForResponse((response) => response.url().startsWith(`${baseUrl}/api/auth/me`));
      await page.goto(`${attackerUrl}/?target=/api/auth/me&method=GET`);
      expect((await me).status()).toBe(200);
      expect(await (await me).text()).toContain('admin@northfold.test');

      for (const [tag, enctype] of [
        ['form', 'application/x-www-form-urlencoded'],
        ['plain', 'text/plain'],
        ['multipart', 'multipart/form-data'],
      ] as const) {
        const answer = page.waitForResponse((response) => response.url() === `${baseUrl}/api/users`);
        await page.goto(`${attackerUrl}/?enctype=${encodeURIComponent(enctype)}&tag=${tag}`);
        const response = await answer;
        expect(response.request().method()).toBe('POST');
        expect(response.request().headers()['origin']).toBe(attackerUrl);
        expect(response.status()).toBe(403);
        expect(((await response.json()) as { code: string }).code).toBe('cross_origin');
      }

      const users = await context.request.get(`${baseUrl}/api/users?pageSize=100`);
      expect(users.status()).toBe(200);
      const emails = ((await users.json()) as { items: { email: string }[] }).items.map((user) => user.email);
      expect(emails).toContain('admin@northfold.test');
      for (const tag of ['form', 'plain', 'multipart']) expect(emails).not.toContain(plantedEmail(tag));
    } finally {
      await context.close();
    }
  });
});
