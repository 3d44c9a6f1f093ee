import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, openBrowser, signIn, type Session } from './support/browser';

/**
 * A page served from another port of the same host (127.0.0.1): the same site, so the
 * SameSite=Strict session cookie goes with its requests. It tries what such a page can do:
 * an auto-submitted form, a no-cors fetch with a JSON text body, a JSON fetch, and a frame.
 */
function forgingPage(target: string): string {
  const forged = { email: 'forged.manager@example.com', name: 'Forged Manager', role: 'manager', password: 'forged-account-77' };
  return `<!doctype html><html><head><title>Another page</title></head><body>
<iframe name="sink" title="sink"></iframe>
<form id="form" method="POST" action="${target}/api/users" target="sink">
  ${Object.entries(forged)
    .map(([k, v]) => `<input name="${k}" value="${v}">`)
    .join('')}
</form>
<iframe id="framed" title="framed" src="${target}/sign-in"></iframe>
<script>
  window.results = {};
  fetch('${target}/api/users', { method: 'POST', mode: 'no-cors', credentials: 'include',
    headers: { 'Content-Type': 'text/plain' }, body: JSON.stringify(${JSON.stringify({ ...forged, email: 'no-cors@example.com' })}) })
    .then(() => { window.results.noCors = 'sent'; }, (e) => { window.results.noCors = 'blocked: ' + e.message; });
  fetch('${target}/api/users', { method: 'POST', credentials: 'include',
    headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(${JSON.stringify({ ...forged, email: 'json@example.com' })}) })
    .then((r) => { window.results.json = 'answered ' + r.status; }, (e) => { window.results.json = 'blocked: ' + e.message; });
  document.getElementById('form').submit();
</script></body></html>`;
}

async function userEmails(page: Page): Promise<string[]> {
  return page.evaluate(async () => {
    const res = await fetch('/api/users', { credentials: 'include' });
    return ((await res.json()) as { email: string }[]).map((u) => u.email);
  });
}

describe('a page on another port of the same host cannot act with the manager’s session', () => {
  let s: Session;
  let other: Server;
  let otherUrl: string;
  beforeAll(async () => {
    other = createServer((_, res) => {
      res.writeHead(200, { 'Content-Type': 'text/html; charset=utf-8' });
      res.end(forgingPage(BASE_URL));
    });
    await new Promise<void>((r) => other.listen(0, '127.0.0.1', r));
    otherUrl = `http://127.0.0.1:${(other.address() as AddressInfo).port}/`;
    s = await openBrowser();
    await signIn(s.page, 'manager@example.com');
  });
  afterAll(async () => {
    await s.close();
    await new Promise((r) => other.close(r));
  });

  it('refuses the forged form, the no-cors fetch and the JSON fetch, and creates no account', async () => {
    const before = await userEmails(s.page);
    const isForged = (r: { url(): string; method(): string }) => r.url() === `${BASE_URL}/api/users` && r.method() === 'POST';
    let sent = 0;
    const answers: number[] = [];
    s.page.context().on('request', (r) => {
      if (isForged(r)) sent++;
    });
    s.page.context().on('response', (r) => {
      if (isForged(r.request())) answers.push(r.status());
    });
    const attacker = await s.page.context().newPage();
    const refusedFrame = new Promise<string>((resolve) => {
      attacker.on('console', (m) => {
        if (/frame-ancestors/i.test(m.text())) resolve(m.text());
      });
    });
    await attacker.goto(otherUrl);
    await attacker.waitForFunction(() => {
      const r = (window as unknown as { results: Record<string, string> }).results;
      return r.noCors !== undefined && r.json !== undefined;
    });
    const results = await attacker.evaluate(() => (window as unknown as { results: Record<string, string> }).results);
    // The form and the no-cors fetch reach the API and are refused (the no-cors answer is kept
    // from the page, and from the browser's own report, by Cross-Origin-Resource-Policy); the JSON
    // fetch needs a CORS preflight, which the API never grants, so it is never sent.
    await attacker.waitForTimeout(500);
    expect(sent).toBeGreaterThanOrEqual(2);
    expect(answers.length).toBeGreaterThan(0);
    expect(answers.every((status) => status === 403)).toBe(true);
    expect(results.json).toMatch(/^blocked/);
    // Chromium refuses to show Crumbproof inside the other page, and says why.
    expect(await refusedFrame).toMatch(/^Framing '.*' violates .*frame-ancestors 'none'/);
    await attacker.close();

    const after = await userEmails(s.page);
    expect(after).toEqual(before);
    expect(after).not.toEqual(expect.arrayContaining(['forged.manager@example.com']));
    expect(after.filter((e) => /forged|no-cors|json@/.test(e))).toEqual([]);
  });

  it('still accepts the same change made in Crumbproof itself', async () => {
    const res = await s.page.evaluate(async (email) => {
      const r = await fetch('/api/users', {
        method: 'POST',
        credentials: 'include',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ email, name: 'Own Page', role: 'front-of-house', password: 'own-page-sponge-63' }),
      });
      return r.status;
    }, `own.page.${Date.now()}@example.com`);
    expect(res).toBe(201);
  });
});

describe('the built app runs under its Content-Security-Policy', () => {
  let s: Session;
  const violations: string[] = [];
  beforeAll(async () => {
    s = await openBrowser();
    await s.context.addInitScript(() => {
      document.addEventListener('securitypolicyviolation', (e) => {
        console.error(`csp-violation ${e.violatedDirective} ${e.blockedURI} ${e.sourceFile}:${e.lineNumber} on ${location.pathname}`);
      });
    });
    s.page.on('console', (m) => {
      if (/csp-violation|Content Security Policy/i.test(m.text())) violations.push(m.text());
    });
  });
  afterAll(() => s.close());

  it('serves the pages with the CSP, nosniff, Referrer-Policy and no framing', async () => {
    const res = await s.page.goto(`${BASE_URL}/sign-in`);
    const headers = res!.headers();
    expect(headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(headers['content-security-policy']).toContain("script-src 'self'");
    expect(headers['x-frame-options']).toBe('DENY');
    expect(headers['x-content-type-options']).toBe('nosniff');
    expect(headers['referrer-policy']).toBe('no-referrer');
  });

  it('loads every page of the manager with no CSP violation', async () => {
    await signIn(s.page, 'manager@example.com');
    for (const path of ['/ingredients', '/recipes', '/recipes/vegan-brownie', '/kitchen', '/users', '/counter', '/first-manager']) {
      await s.page.goto(`${BASE_URL}${path}`);
      await s.page.getByRole('heading', { level: 1 }).first().waitFor();
    }
    await s.page.goto(`${BASE_URL}/api/docs`);
    await s.page.locator('.swagger-ui').first().waitFor();
    expect(violations).toEqual([]);
  });
});
