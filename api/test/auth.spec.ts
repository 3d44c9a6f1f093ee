import { JwtService } from '@nestjs/jwt';
import { startTestApp, type TestApp } from './support/test-app';

describe('sign-in, sessions and roles (real MariaDB)', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
  });
  afterAll(() => t.close());

  const post = (url: string, payload: unknown, cookie?: string) =>
    t.app.inject({ method: 'POST', url, payload: payload as object, headers: cookie ? { cookie } : {} });

  it('signs in with the right password and sets an httpOnly, SameSite session cookie', async () => {
    const res = await post('/api/auth/sign-in', { email: 'Manager@Example.com ', password: 'crumbproof-demo' });
    expect(res.statusCode).toBe(200);
    expect(res.json()).toEqual({
      id: expect.any(Number),
      email: 'manager@example.com',
      name: expect.any(String),
      role: 'manager',
      kitchen: expect.any(Number),
      kitchens: [{ id: expect.any(Number), code: null, name: 'Wrenfield Lane Bakehouse', role: 'manager' }],
    });
    const cookie = res.cookies.find((c) => c.name === 'cp_session')!;
    expect(cookie).toMatchObject({ httpOnly: true, sameSite: 'Strict', path: '/' });
    expect(res.body).not.toMatch(/password|hash/i);
  });

  it('refuses a wrong password with 401 and a plain message', async () => {
    const res = await post('/api/auth/sign-in', { email: 'chef@example.com', password: 'not-the-password' });
    expect(res.statusCode).toBe(401);
    expect(res.json()).toMatchObject({ code: 'bad-credentials', message: 'Email or password is not right.' });
    expect(res.cookies).toHaveLength(0);
  });

  it('refuses an unknown user with the same 401 as a wrong password', async () => {
    const res = await post('/api/auth/sign-in', { email: 'nobody@example.com', password: 'crumbproof-demo' });
    expect(res.statusCode).toBe(401);
    expect(res.json()).toMatchObject({ code: 'bad-credentials', message: 'Email or password is not right.' });
  });

  it('names each bad field of a malformed body with 400', async () => {
    const res = await post('/api/auth/sign-in', { email: 'not-an-email' });
    expect(res.statusCode).toBe(400);
    const body = res.json();
    expect(body.code).toBe('validation');
    expect(body.fields.map((f: { path: string }) => f.path).sort()).toEqual(['email', 'password']);
  });

  it('says so plainly when the body is not JSON', async () => {
    const res = await t.app.inject({
      method: 'POST',
      url: '/api/auth/sign-in',
      payload: '{"email":',
      headers: { 'content-type': 'application/json' },
    });
    expect(res.statusCode).toBe(400);
    expect(res.json().message).toMatch(/valid JSON/);
  });

  it('makes one email wait after repeated wrong passwords, without locking out colleagues', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      statuses.push((await post('/api/auth/sign-in', { email: 'guesser@example.com', password: `guess-${i}` })).statusCode);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
    const blocked = await post('/api/auth/sign-in', { email: 'Guesser@example.com', password: 'crumbproof-demo' });
    expect(blocked.json()).toMatchObject({ code: 'too-many-requests' });
    const colleague = await post('/api/auth/sign-in', { email: 'chef@example.com', password: 'crumbproof-demo' });
    expect(colleague.statusCode).toBe(200);
  });

  it('answers /api/me for a session and 401 without one; sign-out clears the cookie', async () => {
    expect((await t.app.inject({ method: 'GET', url: '/api/me' })).statusCode).toBe(401);
    const cookie = await t.signIn('chef@example.com');
    const me = await t.app.inject({ method: 'GET', url: '/api/me', headers: { cookie } });
    expect(me.json()).toMatchObject({ email: 'chef@example.com', role: 'pastry-chef' });
    const out = await post('/api/auth/sign-out', {}, cookie);
    expect(out.statusCode).toBe(204);
    const cleared = out.cookies.find((c) => c.name === 'cp_session')!;
    expect(cleared.value).toBe('');
  });

  it('renews a session past half its life on use, and leaves a fresh one alone', async () => {
    const jwt = t.app.get(JwtService);
    const signedIn = await t.signIn('chef@example.com');
    const { sub: id, sid } = jwt.decode<{ sub: number; sid: string }>(signedIn.slice('cp_session='.length));
    const now = Math.floor(Date.now() / 1000);
    const old = await jwt.signAsync({ sub: id, sid, iat: now - 20 * 60 });
    const renewed = await t.app.inject({ method: 'GET', url: '/api/me', headers: { cookie: `cp_session=${old}` } });
    expect(renewed.statusCode).toBe(200);
    const cookie = renewed.cookies.find((c) => c.name === 'cp_session')!;
    expect(cookie.value).not.toBe(old);
    expect(jwt.decode<{ iat: number }>(cookie.value).iat).toBeGreaterThanOrEqual(now);
    const fresh = await t.app.inject({
      method: 'GET',
      url: '/api/me',
      headers: { cookie: `cp_session=${await jwt.signAsync({ sub: id, sid })}` },
    });
    expect(fresh.cookies.find((c) => c.name === 'cp_session')).toBeUndefined();
    expect(fresh.json()).toMatchObject({ id, email: 'chef@example.com', name: 'Tobiah Quill', role: 'pastry-chef' });
  });

  it('refuses an expired session', async () => {
    const jwt = t.app.get(JwtService);
    const expired = await jwt.signAsync({ sub: 1 }, { expiresIn: -60 });
    const res = await t.app.inject({ method: 'GET', url: '/api/me', headers: { cookie: `cp_session=${expired}` } });
    expect(res.statusCode).toBe(401);
  });

  it('refuses a forged or expired token', async () => {
    const res = await t.app.inject({
      method: 'GET',
      url: '/api/me',
      headers: { cookie: 'cp_session=eyJhbGciOiJIUzI1NiJ9.eyJzdWIiOjF9.forged' },
    });
    expect(res.statusCode).toBe(401);
  });

  describe('each role reaches what it should and is refused the rest', () => {
    const emails = { manager: 'manager@example.com', chef: 'chef@example.com', counter: 'counter@example.com' } as const;
    const cookies: Record<string, string> = {};
    beforeAll(async () => {
      for (const [k, e] of Object.entries(emails)) cookies[k] = await t.signIn(e);
    });

    it.each([
      { who: 'manager', method: 'GET', url: '/api/users', status: 200 },
      { who: 'chef', method: 'GET', url: '/api/users', status: 403 },
      { who: 'counter', method: 'GET', url: '/api/users', status: 403 },
      { who: 'manager', method: 'GET', url: '/api/ingredients', status: 200 },
      { who: 'chef', method: 'GET', url: '/api/ingredients', status: 200 },
      { who: 'counter', method: 'GET', url: '/api/ingredients', status: 403 },
      { who: 'counter', method: 'GET', url: '/api/recipes', status: 200 },
      { who: 'counter', method: 'GET', url: '/api/kitchen', status: 200 },
      { who: 'counter', method: 'GET', url: '/api/declarations', status: 200 },
      { who: 'counter', method: 'POST', url: '/api/recipes', status: 403 },
      { who: 'counter', method: 'POST', url: '/api/declarations/preview', status: 403 },
      { who: 'chef', method: 'POST', url: '/api/book/import', status: 403 },
      { who: 'chef', method: 'GET', url: '/api/book', status: 200 },
      { who: 'counter', method: 'GET', url: '/api/book', status: 403 },
      { who: 'chef', method: 'POST', url: '/api/users', status: 403 },
    ] as const)('$who: $method $url → $status', async ({ who, method, url, status }) => {
      const res = await t.app.inject({ method, url, headers: { cookie: cookies[who] }, ...(method === 'POST' ? { payload: {} } : {}) });
      expect(res.statusCode).toBe(status);
      if (status === 403) expect(res.json()).toMatchObject({ code: 'forbidden' });
    });
  });
});
