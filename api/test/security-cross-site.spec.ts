import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import bcrypt from 'bcryptjs';
import { uploadRoutesOf } from '../src/app.factory';
import { isDemoKitchen, isLoopback, parseConfig, sessionCookieSecure } from '../src/config/config';
import { multipart } from './fixtures/forms';
import { startAppWith } from './support/app-with-settings';
import { startTestApp, type TestApp } from './support/test-app';

// A page served from another port of the same host is the same site (RFC 6265bis, "same-site"
// ignores the port), so the SameSite=Strict session cookie goes with its requests: these tests
// send what such a page can send, with the manager's cookie.
describe('requests forged by another page are refused and change nothing', () => {
  let t: TestApp;
  let manager: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    manager = await t.signIn('manager@example.com');
  });
  afterAll(() => t.close());

  const HOST = '127.0.0.1:3000';
  const newManager = (email: string) => ({ email, name: 'Forged Manager', role: 'manager', password: 'forged-account-77' });
  const userEmails = async () =>
    (await t.app.inject({ method: 'GET', url: '/api/users', headers: { cookie: manager } }))
      .json<{ email: string }[]>()
      .map((u) => u.email);
  const postUsers = (payload: string | Buffer, headers: Record<string, string>) =>
    t.app.inject({ method: 'POST', url: '/api/users', payload, headers: { cookie: manager, host: HOST, ...headers } });

  it('refuses a form-encoded body on a JSON route with 415', async () => {
    const res = await postUsers(new URLSearchParams(newManager('form@example.com')).toString(), {
      'content-type': 'application/x-www-form-urlencoded',
    });
    expect(res.statusCode).toBe(415);
    expect(res.json()).toMatchObject({ code: 'validation', message: expect.stringMatching(/takes JSON/) });
    expect(await userEmails()).not.toContain('form@example.com');
  });

  it('refuses a no-cors text/plain body holding JSON', async () => {
    const res = await postUsers(JSON.stringify(newManager('plain@example.com')), { 'content-type': 'text/plain;charset=UTF-8' });
    expect(res.statusCode).toBe(415);
    expect(await userEmails()).not.toContain('plain@example.com');
  });

  it('refuses multipart on a route that is not an upload', async () => {
    const form = await multipart(newManager('multipart@example.com'));
    const res = await postUsers(form.payload, form.headers);
    expect(res.statusCode).toBe(415);
    expect(await userEmails()).not.toContain('multipart@example.com');
  });

  it('refuses JSON on an upload route', async () => {
    const res = await t.app.inject({
      method: 'POST',
      url: '/api/ingredients/import/preview',
      payload: { file: 'x' },
      headers: { cookie: manager },
    });
    expect(res.statusCode).toBe(415);
    expect(res.json().message).toMatch(/multipart\/form-data/);
  });

  it.each([
    ['another port of the same host', { origin: 'http://127.0.0.1:8080' }],
    ['another host', { origin: 'https://elsewhere.example' }],
    ['an opaque origin (sandboxed frame)', { origin: 'null' }],
    ['Sec-Fetch-Site: same-site', { 'sec-fetch-site': 'same-site' }],
    ['Sec-Fetch-Site: cross-site, even with a matching Origin', { 'sec-fetch-site': 'cross-site', origin: `http://${HOST}` }],
  ])('refuses JSON sent from %s with 403', async (_, headers) => {
    const email = `forged-${Object.values(headers).join('').replace(/\W/g, '')}@example.com`;
    const res = await postUsers(JSON.stringify(newManager(email)), { 'content-type': 'application/json', ...headers });
    expect(res.statusCode).toBe(403);
    expect(res.json()).toMatchObject({ code: 'forbidden', message: expect.stringMatching(/outside Crumbproof/) });
    expect(await userEmails()).not.toContain(email);
  });

  it('refuses a forged sign-in and a forged sign-out too', async () => {
    const signIn = await t.app.inject({
      method: 'POST',
      url: '/api/auth/sign-in',
      payload: { email: 'chef@example.com', password: 'crumbproof-demo' },
      headers: { host: HOST, origin: 'http://127.0.0.1:8080' },
    });
    expect(signIn.statusCode).toBe(403);
    expect(signIn.cookies).toHaveLength(0);
    const out = await t.app.inject({
      method: 'POST',
      url: '/api/auth/sign-out',
      headers: { cookie: manager, host: HOST, 'sec-fetch-site': 'same-site' },
    });
    expect(out.statusCode).toBe(403);
    expect((await t.app.inject({ method: 'GET', url: '/api/me', headers: { cookie: manager } })).statusCode).toBe(200);
  });

  it('accepts JSON from its own pages (same origin)', async () => {
    const res = await postUsers(JSON.stringify(newManager('same-origin@example.com')), {
      'content-type': 'application/json; charset=utf-8',
      origin: `http://${HOST}`,
      'sec-fetch-site': 'same-origin',
    });
    expect(res.statusCode).toBe(201);
  });

  it('accepts a client that sends neither Origin nor Sec-Fetch-Site (curl, scripts): it cannot borrow a browser’s cookie', async () => {
    const res = await postUsers(JSON.stringify(newManager('script@example.com')), { 'content-type': 'application/json' });
    expect(res.statusCode).toBe(201);
  });

  it('takes multipart on exactly the upload routes', () => {
    const doc = SwaggerModule.createDocument(t.app, new DocumentBuilder().build());
    expect([...uploadRoutesOf(doc)].sort()).toEqual([
      'POST /api/ingredients/:code/specifications',
      'POST /api/ingredients/import',
      'POST /api/ingredients/import/preview',
    ]);
  });
});

describe('security headers on API answers', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
  });
  afterAll(() => t.close());

  it.each(['/api/health', '/api/me', '/api/no-such-route'])('%s carries the CSP, nosniff, Referrer-Policy and no framing', async (url) => {
    const res = await t.app.inject({ method: 'GET', url });
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(res.headers['x-frame-options']).toBe('DENY');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
  });

  it('sets the session cookie without Secure, and no HSTS, on loopback, where nothing crosses a network', async () => {
    const res = await t.app.inject({
      method: 'POST',
      url: '/api/auth/sign-in',
      payload: { email: 'counter@example.com', password: 'crumbproof-demo' },
    });
    expect(res.statusCode).toBe(200);
    expect(res.cookies.find((c) => c.name === 'cp_session')?.secure).toBeFalsy();
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });
});

describe('the session cookie is Secure outside development and loopback', () => {
  it.each([
    [{ HOST: '127.0.0.1', NODE_ENV: 'production' as const }, false],
    [{ HOST: 'localhost', NODE_ENV: 'production' as const }, false],
    [{ HOST: '0.0.0.0', NODE_ENV: 'production' as const }, true],
    [{ HOST: '192.168.1.20', NODE_ENV: 'test' as const }, true],
    [{ HOST: '0.0.0.0', NODE_ENV: 'development' as const }, false],
    [{ HOST: '127.0.0.1', NODE_ENV: 'production' as const, COOKIE_SECURE: 'true' as const }, true],
  ])('%o → Secure %s', (settings, secure) => {
    expect(sessionCookieSecure({ COOKIE_SECURE: undefined, ...settings })).toBe(secure);
  });

  it('refuses to start without Secure beyond loopback', () => {
    expect(() =>
      parseConfig({ JWT_SECRET: 'x'.repeat(32), HOST: '0.0.0.0', NODE_ENV: 'production', COOKIE_SECURE: 'false', DEMO_KITCHEN: 'false' }),
    ).toThrow(/COOKIE_SECURE: .*HTTPS/);
  });

  it('knows loopback from addresses other machines reach', () => {
    expect(['127.0.0.1', '127.1.2.3', 'localhost', '::1', '[::1]'].every(isLoopback)).toBe(true);
    expect(['0.0.0.0', '::', '192.168.1.20', '10.0.0.1', 'crumbproof.example'].some(isLoopback)).toBe(false);
    expect(isDemoKitchen({ HOST: '0.0.0.0', NODE_ENV: 'development', DEMO_KITCHEN: undefined })).toBe(false);
  });

  it('sends the cookie with Secure, and HSTS, from an installation listening beyond loopback', async () => {
    const s = await startAppWith(
      { HOST: '0.0.0.0', NODE_ENV: 'production', DEMO_KITCHEN: undefined, COOKIE_SECURE: undefined },
      { database: `${process.env.DB_NAME}_lan` },
    );
    try {
      await s.sequelize.query(
        "INSERT INTO users (email, name, role, password_hash, active, created_at, updated_at) VALUES ('lan@example.com', 'Lan Manager', 'manager', ?, TRUE, NOW(), NOW())",
        { replacements: [bcrypt.hashSync('lan-manager-pass-42', 4)] },
      );
      const res = await s.app.inject({
        method: 'POST',
        url: '/api/auth/sign-in',
        payload: { email: 'lan@example.com', password: 'lan-manager-pass-42' },
      });
      expect(res.statusCode).toBe(200);
      expect(res.cookies.find((c) => c.name === 'cp_session')).toMatchObject({ secure: true, httpOnly: true, sameSite: 'Strict' });
      expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    } finally {
      await s.close();
    }
  });
});
