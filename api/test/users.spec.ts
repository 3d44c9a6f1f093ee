import { startTestApp, type TestApp } from './support/test-app';

describe('users (manager)', () => {
  let t: TestApp;
  let manager: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    manager = await t.signIn('manager@example.com');
  });
  afterAll(() => t.close());

  const call = (method: 'GET' | 'POST' | 'PATCH', url: string, payload?: object, cookie = manager) =>
    t.app.inject({ method, url, payload, headers: { cookie } });

  it('lists users without any password or hash', async () => {
    const res = await call('GET', '/api/users');
    expect(res.statusCode).toBe(200);
    expect(
      res
        .json()
        .map((u: { email: string }) => u.email)
        .sort(),
    ).toEqual(['chef@example.com', 'counter@example.com', 'manager@example.com']);
    expect(res.body).not.toMatch(/password|hash/i);
  });

  it('creates a user who can then sign in with the role given', async () => {
    const res = await call('POST', '/api/users', {
      email: 'new.baker@example.com',
      name: 'Oona Vey',
      role: 'pastry-chef',
      password: 'layered-sponge-42',
    });
    expect(res.statusCode).toBe(201);
    const cookie = await t.signIn('new.baker@example.com', 'layered-sponge-42');
    const me = await t.app.inject({ method: 'GET', url: '/api/me', headers: { cookie } });
    expect(me.json()).toMatchObject({ role: 'pastry-chef', name: 'Oona Vey' });
  });

  it('names each bad field and saves nothing', async () => {
    const res = await call('POST', '/api/users', { email: 'bad', name: '', role: 'baker', password: 'short' });
    expect(res.statusCode).toBe(400);
    expect([...new Set(res.json().fields.map((f: { path: string }) => f.path))].sort()).toEqual(['email', 'name', 'password', 'role']);
    expect((await call('GET', '/api/users')).json()).toHaveLength(4);
  });

  it('refuses a second account with the same email', async () => {
    const res = await call('POST', '/api/users', {
      email: 'chef@example.com',
      name: 'Twin',
      role: 'pastry-chef',
      password: 'another-pass-99',
    });
    expect(res.statusCode).toBe(409);
    expect(res.json().message).toBe('A user with that email already exists.');
  });

  it('changes a role: the old session ends, and signing in again brings the new role', async () => {
    const counter = await t.signIn('counter@example.com');
    const list = (await call('GET', '/api/users')).json<{ id: number; email: string }[]>();
    const id = list.find((u) => u.email === 'counter@example.com')!.id;
    expect((await call('GET', '/api/ingredients', undefined, counter)).statusCode).toBe(403);
    expect((await call('PATCH', `/api/users/${id}`, { role: 'pastry-chef' })).statusCode).toBe(200);
    expect((await call('GET', '/api/ingredients', undefined, counter)).statusCode).toBe(401);
    const again = await t.signIn('counter@example.com');
    expect((await call('GET', '/api/ingredients', undefined, again)).statusCode).toBe(200);
    await call('PATCH', `/api/users/${id}`, { role: 'front-of-house' });
  });

  it('a deactivated user is signed out and cannot sign in', async () => {
    const created = (
      await call('POST', '/api/users', {
        email: 'leaver@example.com',
        name: 'Ash Leaver',
        role: 'front-of-house',
        password: 'gone-by-friday-1',
      })
    ).json();
    const session = await t.signIn('leaver@example.com', 'gone-by-friday-1');
    expect((await call('PATCH', `/api/users/${created.id}`, { active: false })).statusCode).toBe(200);
    expect((await call('GET', '/api/me', undefined, session)).statusCode).toBe(401);
    const again = await t.app.inject({
      method: 'POST',
      url: '/api/auth/sign-in',
      payload: { email: 'leaver@example.com', password: 'gone-by-friday-1' },
    });
    expect(again.statusCode).toBe(401);
  });

  it('keeps at least one active manager', async () => {
    const list = (await call('GET', '/api/users')).json<{ id: number; email: string }[]>();
    const id = list.find((u) => u.email === 'manager@example.com')!.id;
    const res = await call('PATCH', `/api/users/${id}`, { role: 'pastry-chef' });
    expect(res.statusCode).toBe(409);
    expect(res.json().message).toMatch(/at least one active manager/);
  });
});
