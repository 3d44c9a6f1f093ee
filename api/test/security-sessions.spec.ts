import { JwtService } from '@nestjs/jwt';
import { QueryTypes } from 'sequelize';
import { createApp } from '../src/app.factory';
import { CHANGE_STALE_MS } from '../src/database/change-feed';
import { changedByHand } from './support/changed-by-hand';
import { startTestApp, type TestApp } from './support/test-app';

describe('sessions are kept by the server and end when they should', () => {
  let t: TestApp;
  let manager: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    manager = await t.signIn('manager@example.com');
  });
  afterAll(() => t.close());

  const get = (url: string, cookie: string) => t.app.inject({ method: 'GET', url, headers: { cookie } });
  const claimsOf = (cookie: string) =>
    t.app.get(JwtService).decode<{ sub: number; sid: string; iat: number; exp: number }>(cookie.slice('cp_session='.length));
  /** The same session's token as it was when it was older: past half its life, so due for renewal. */
  const aged = (cookie: string) => {
    const { sub, sid } = claimsOf(cookie);
    return t.app
      .get(JwtService)
      .signAsync({ sub, sid, iat: Math.floor(Date.now() / 1000) - 20 * 60 })
      .then((token) => `cp_session=${token}`);
  };
  const userId = async (email: string) =>
    (await get('/api/users', manager)).json<{ id: number; email: string }[]>().find((u) => u.email === email)!.id;
  const patchUser = (id: number, payload: object, cookie = manager) =>
    t.app.inject({ method: 'PATCH', url: `/api/users/${id}`, payload, headers: { cookie } });
  const writeIngredient = (cookie: string) => t.app.inject({ method: 'POST', url: '/api/ingredients', payload: {}, headers: { cookie } });

  it('a cookie replayed after sign-out is refused and not renewed', async () => {
    const cookie = await t.signIn('chef@example.com');
    const old = await aged(cookie);
    expect((await t.app.inject({ method: 'POST', url: '/api/auth/sign-out', headers: { cookie } })).statusCode).toBe(204);
    for (const replay of [cookie, old]) {
      const res = await get('/api/me', replay);
      expect(res.statusCode).toBe(401);
      expect(res.cookies.find((c) => c.name === 'cp_session')).toBeUndefined();
    }
    const [row] = await t.sequelize.query('SELECT ended_at, end_reason FROM sessions WHERE id = ?', {
      replacements: [claimsOf(cookie).sid],
      type: QueryTypes.SELECT,
    });
    expect(row).toMatchObject({ ended_at: expect.any(Date), end_reason: 'signed-out' });
  });

  it('after a password change the old cookie neither reads nor writes', async () => {
    const created = await t.app.inject({
      method: 'POST',
      url: '/api/users',
      payload: { email: 'second.chef@example.com', name: 'Second Chef', role: 'pastry-chef', password: 'first-piping-bag-12' },
      headers: { cookie: manager },
    });
    expect(created.statusCode).toBe(201);
    const cookie = await t.signIn('second.chef@example.com', 'first-piping-bag-12');
    expect((await writeIngredient(cookie)).statusCode).toBe(400); // past the session check, refused as a bad body
    expect((await patchUser(created.json().id, { password: 'new-piping-bag-31' })).statusCode).toBe(200);
    expect((await writeIngredient(cookie)).statusCode).toBe(401);
    expect((await get('/api/me', cookie)).statusCode).toBe(401);
    const fresh = await t.signIn('second.chef@example.com', 'new-piping-bag-31');
    expect((await get('/api/me', fresh)).statusCode).toBe(200);
  });

  it('a manager changing their own password keeps the session they did it with, and ends their others', async () => {
    const mine = await t.signIn('manager@example.com');
    const other = await t.signIn('manager@example.com');
    const id = await userId('manager@example.com');
    expect((await patchUser(id, { password: 'whisked-ganache-58' }, mine)).statusCode).toBe(200);
    expect((await get('/api/me', mine)).statusCode).toBe(200);
    expect((await get('/api/me', other)).statusCode).toBe(401);
    expect((await get('/api/me', manager)).statusCode).toBe(401);
    manager = mine;
  });

  it('deactivating ends every session, and reactivating does not bring old cookies back', async () => {
    const counter = await t.signIn('counter@example.com');
    const old = await aged(counter);
    const id = await userId('counter@example.com');
    expect((await patchUser(id, { active: false })).statusCode).toBe(200);
    expect((await patchUser(id, { active: true })).statusCode).toBe(200);
    expect((await get('/api/me', counter)).statusCode).toBe(401);
    const renewed = await get('/api/me', old);
    expect(renewed.statusCode).toBe(401);
    expect(renewed.cookies).toHaveLength(0);
    expect((await get('/api/me', await t.signIn('counter@example.com'))).statusCode).toBe(200);
  });

  it('a role change ends the sessions of that user', async () => {
    const counter = await t.signIn('counter@example.com');
    const id = await userId('counter@example.com');
    expect((await patchUser(id, { role: 'pastry-chef' })).statusCode).toBe(200);
    expect((await get('/api/me', counter)).statusCode).toBe(401);
    await patchUser(id, { role: 'front-of-house' });
  });

  it('ends a session at its absolute end however busy it is, and no renewal outlives it', async () => {
    const cookie = await t.signIn('chef@example.com');
    const { sid } = claimsOf(cookie);
    const [row] = await t.sequelize.query<{ created_at: Date; expires_at: Date }>(
      'SELECT created_at, expires_at FROM sessions WHERE id = ?',
      {
        replacements: [sid],
        type: QueryTypes.SELECT,
      },
    );
    expect(new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()).toBe(12 * 3600 * 1000);

    // Five minutes of its twelve hours left, two of them idle: a renewal is cut to those five minutes.
    await t.sequelize.query(
      'UPDATE sessions SET expires_at = NOW(3) + INTERVAL 5 MINUTE, idle_expires_at = NOW(3) + INTERVAL 2 MINUTE WHERE id = ?',
      { replacements: [sid] },
    );
    await changedByHand(t);
    const renewed = await get('/api/me', await aged(cookie));
    expect(renewed.statusCode).toBe(200);
    const next = renewed.cookies.find((c) => c.name === 'cp_session')!;
    expect(next.maxAge).toBeGreaterThan(2 * 60);
    expect(next.maxAge).toBeLessThanOrEqual(5 * 60);
    expect(claimsOf(`cp_session=${next.value}`).exp * 1000).toBeLessThanOrEqual(Date.now() + 5 * 60 * 1000 + 1000);
    // Nearer the end than half the idle life, nothing is renewed any more.
    const again = await get('/api/me', await aged(`cp_session=${next.value}`));
    expect(again.statusCode).toBe(200);
    expect(again.cookies).toHaveLength(0);

    await t.sequelize.query('UPDATE sessions SET expires_at = NOW(3) - INTERVAL 1 SECOND WHERE id = ?', { replacements: [sid] });
    await changedByHand(t);
    const late = await get('/api/me', cookie);
    expect(late.statusCode).toBe(401);
    expect(late.cookies).toHaveLength(0);
  });

  it('ends a session left idle past SESSION_MINUTES even while its token is still signed', async () => {
    const cookie = await t.signIn('chef@example.com');
    await t.sequelize.query('UPDATE sessions SET idle_expires_at = NOW(3) - INTERVAL 1 SECOND WHERE id = ?', {
      replacements: [claimsOf(cookie).sid],
    });
    await changedByHand(t);
    expect((await get('/api/me', cookie)).statusCode).toBe(401);
  });

  it('refuses a token without a session, signed with the right key', async () => {
    const { sub } = claimsOf(manager);
    const bare = await t.app.get(JwtService).signAsync({ sub });
    expect((await get('/api/me', `cp_session=${bare}`)).statusCode).toBe(401);
    const made = await t.app.get(JwtService).signAsync({ sub, sid: 'f'.repeat(32) });
    expect((await get('/api/me', `cp_session=${made}`)).statusCode).toBe(401);
  });

  it('two instances of the API share the sessions: one signs in, the other honours it and its sign-out', async () => {
    const second = await createApp({ logLevel: 'silent' });
    try {
      const cookie = await t.signIn('chef@example.com');
      expect((await second.inject({ method: 'GET', url: '/api/me', headers: { cookie } })).statusCode).toBe(200);
      expect((await second.inject({ method: 'POST', url: '/api/auth/sign-out', headers: { cookie } })).statusCode).toBe(204);
      expect((await get('/api/me', cookie)).statusCode).toBe(401);
    } finally {
      await second.close();
    }
  });

  it('refuses on every instance, within the staleness bound, a session one instance served a moment ago and another ended', async () => {
    const second = await createApp({ logLevel: 'silent' });
    try {
      const cookie = await t.signIn('chef@example.com');
      // Both instances have served the session, so both keep it.
      expect((await get('/api/me', cookie)).statusCode).toBe(200);
      expect((await second.inject({ method: 'GET', url: '/api/me', headers: { cookie } })).statusCode).toBe(200);
      expect((await second.inject({ method: 'POST', url: '/api/auth/sign-out', headers: { cookie } })).statusCode).toBe(204);
      const endedAt = Date.now();
      // At once on the instance that ended it.
      expect((await second.inject({ method: 'GET', url: '/api/me', headers: { cookie } })).statusCode).toBe(401);
      // Within the bound on the other.
      let status = (await get('/api/me', cookie)).statusCode;
      while (status === 200 && Date.now() - endedAt < CHANGE_STALE_MS + 500) {
        await new Promise((r) => setTimeout(r, 20));
        status = (await get('/api/me', cookie)).statusCode;
      }
      expect({ status, withinBound: Date.now() - endedAt <= CHANGE_STALE_MS + 500 }).toEqual({ status: 401, withinBound: true });
    } finally {
      await second.close();
    }
  });
});
