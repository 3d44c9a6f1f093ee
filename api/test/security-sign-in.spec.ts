import { createHash } from 'node:crypto';
import bcrypt from 'bcryptjs';
import { QueryTypes } from 'sequelize';
import { passwordSchema } from '@crumbproof/shared';
import { FREE_TRIES, LOCK_AT, waitAfterFailures } from '../src/auth/sign-in-limits.repository';
import { parseConfig } from '../src/config/config';
import { checkPassword, commonPasswordProblem } from '../src/users/password';
import { startAppWith } from './support/app-with-settings';
import { startTestApp, type TestApp } from './support/test-app';
import { TWO_KITCHENS_BOOK } from './support/two-kitchens';

const DEMO = 'crumbproof-demo';
/** 72 bytes, the most bcrypt reads. */
const LONGEST = `${'Proofing-basket-'.repeat(4)}crumbs42`;

describe('password guessing is slowed per account, per address and across the kitchen', () => {
  let t: TestApp;
  let manager: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    manager = await t.signIn('manager@example.com');
  });
  afterAll(() => t.close());
  afterEach(async () => {
    await t.sequelize.query('DELETE FROM sign_in_counters');
  });

  const signIn = (email: string, password: string, remoteAddress = '127.0.0.1') =>
    t.app.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email, password }, remoteAddress });
  const waitIsOver = (email: string) =>
    t.sequelize.query('UPDATE sign_in_failures SET wait_until = NOW(3) - INTERVAL 1 SECOND WHERE email = ?', { replacements: [email] });

  it('makes an account wait after four wrong passwords in a row, even for the right one, with a plain message', async () => {
    const statuses: number[] = [];
    for (let i = 0; i <= FREE_TRIES; i++) statuses.push((await signIn('chef@example.com', `wrong-${i}`)).statusCode);
    expect(statuses).toEqual([401, 401, 401, 401, 401]);
    const right = await signIn('chef@example.com', DEMO);
    expect(right.statusCode).toBe(429);
    expect(right.json()).toMatchObject({
      code: 'too-many-requests',
      message: '5 wrong passwords in a row for this account. Wait 1 minute, then try again.',
    });
    expect(right.cookies).toHaveLength(0);
    await waitIsOver('chef@example.com');
    expect((await signIn('chef@example.com', DEMO)).statusCode).toBe(200);
    // A right password starts the count afresh.
    expect((await signIn('chef@example.com', 'wrong-again')).statusCode).toBe(401);
    expect((await signIn('chef@example.com', DEMO)).statusCode).toBe(200);
  });

  it('doubles the wait with each further wrong password, then locks the account for an hour', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11].map((n) => waitAfterFailures(n) / 60_000)).toEqual([0, 0, 0, 0, 1, 2, 4, 8, 16, 60, 60]);
    expect(LOCK_AT).toBe(10);
  });

  it('locks after ten wrong passwords in a row; a manager setting a new password unlocks it at once', async () => {
    const created = await t.app.inject({
      method: 'POST',
      url: '/api/users',
      payload: { email: 'locked.out@example.com', name: 'Locked Out', role: 'front-of-house', password: 'counter-morning-21' },
      headers: { cookie: manager },
    });
    expect(created.statusCode).toBe(201);
    for (let i = 0; i < LOCK_AT; i++) {
      await waitIsOver('locked.out@example.com');
      expect((await signIn('locked.out@example.com', `wrong-${i}`, `10.6.${i}.1`)).statusCode).toBe(401);
    }
    const locked = await signIn('locked.out@example.com', 'counter-morning-21');
    expect(locked.statusCode).toBe(429);
    expect(locked.json().message).toBe(
      'This account is locked for 60 minutes after 10 wrong passwords in a row. Try again then, or ask a manager to set a new password, which unlocks it at once.',
    );
    const patched = await t.app.inject({
      method: 'PATCH',
      url: `/api/users/${created.json().id}`,
      payload: { password: 'counter-evening-34' },
      headers: { cookie: manager },
    });
    expect(patched.statusCode).toBe(200);
    expect((await signIn('locked.out@example.com', 'counter-evening-34')).statusCode).toBe(200);
  });

  it('treats an email with no account the same, so the answers never tell which emails have accounts', async () => {
    const statuses: number[] = [];
    for (let i = 0; i <= FREE_TRIES + 1; i++) statuses.push((await signIn('no.account@example.com', `wrong-${i}`)).statusCode);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });

  it('lets no guess sent in parallel slip past the count', async () => {
    const answers = await Promise.all(Array.from({ length: 12 }, (_, i) => signIn('counter@example.com', `parallel-${i}`, `10.5.${i}.1`)));
    const statuses = answers.map((a) => a.statusCode);
    expect(statuses.filter((s) => s === 401)).toHaveLength(FREE_TRIES + 1);
    expect(statuses.filter((s) => s === 429)).toHaveLength(12 - FREE_TRIES - 1);
    await t.sequelize.query("DELETE FROM sign_in_failures WHERE email = 'counter@example.com'");
  });

  it('slows one address trying one password across many accounts (SIGN_IN_LIMIT, 10 by default)', async () => {
    for (let i = 0; i < 10; i++) expect((await signIn(`spray-${i}@example.com`, 'Summer-in-2024', '10.9.9.9')).statusCode).toBe(401);
    const next = await signIn('spray-10@example.com', 'Summer-in-2024', '10.9.9.9');
    expect(next.statusCode).toBe(429);
    expect(next.json().message).toMatch(/^Too many wrong passwords from this device\. Wait \d+ minutes?, then try again\.$/);
    expect((await signIn('counter@example.com', DEMO, '10.9.9.10')).statusCode).toBe(200);
  });

  it('slows the whole kitchen when one password is tried across many accounts from many addresses (SIGN_IN_GLOBAL_LIMIT, 30)', async () => {
    for (let i = 0; i < 30; i++) {
      expect((await signIn(`spread-${i}@example.com`, 'Summer-in-2024', `10.8.${i}.1`)).statusCode).toBe(401);
    }
    const next = await signIn('chef@example.com', DEMO, '10.7.0.1');
    expect(next.statusCode).toBe(429);
    expect(next.json().message).toMatch(/^Too many wrong passwords on this kitchen's accounts/);
  }, 120_000);

  it('keeps every count in the database, so all instances of the API share it', async () => {
    await signIn('shared.count@example.com', 'wrong-once');
    const rows = await t.sequelize.query<{ failures: number }>('SELECT failures FROM sign_in_failures WHERE email = ?', {
      replacements: ['shared.count@example.com'],
      type: QueryTypes.SELECT,
    });
    expect(rows).toEqual([{ failures: 1 }]);
  });
});

describe('passwords', () => {
  let t: TestApp;
  let manager: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    manager = await t.signIn('manager@example.com');
  });
  afterAll(() => t.close());

  const create = (password: string) =>
    t.app.inject({
      method: 'POST',
      url: '/api/users',
      payload: { email: `p${Math.random().toString(36).slice(2)}@example.com`, name: 'New Baker', role: 'pastry-chef', password },
      headers: { cookie: manager },
    });

  it.each([
    ['on the common-passwords list', 'qwerty123456', /common passwords/],
    ['a listed password with digits and a symbol around it', 'Sunshine2024!', /common passwords/],
    ['the demo kitchen’s published password', DEMO, /published/],
    ['over 72 bytes for bcrypt', `${LONGEST}x`, /at most 72 bytes/],
    ['72 bytes in 36 accented letters plus a digit', `${'é'.repeat(36)}1`, /at most 72 bytes/],
    ['one character over and over', 'aaaaaaaaaaaa1', /different characters/],
    ['padded with control characters', 'gone-by-friday-1\u0000\u0000', /control characters/],
    ['holding a tab', 'gone-by\tfriday-1', /control characters/],
  ])('refuses a password %s, naming the field, and adds nobody', async (_, password, message) => {
    const before = (await t.app.inject({ method: 'GET', url: '/api/users', headers: { cookie: manager } })).json().length;
    const res = await create(password);
    expect(res.statusCode).toBe(400);
    expect(res.json().fields).toEqual(expect.arrayContaining([{ path: 'password', message: expect.stringMatching(message) }]));
    expect((await t.app.inject({ method: 'GET', url: '/api/users', headers: { cookie: manager } })).json()).toHaveLength(before);
  });

  it('accepts a good one of exactly 72 bytes', async () => {
    expect(new TextEncoder().encode(LONGEST).length).toBe(72);
    expect((await create(LONGEST)).statusCode).toBe(201);
  });

  it('the same rule runs in the browser (shared schema), all but the list', () => {
    expect(passwordSchema.safeParse('gone-by-friday-1').success).toBe(true);
    expect(passwordSchema.safeParse('aaaaaaaaaaaa1').success).toBe(false);
    expect(passwordSchema.safeParse(`${'x1'.repeat(36)}y`).success).toBe(false);
    expect(commonPasswordProblem('football12345')).toMatch(/common passwords/);
    expect(commonPasswordProblem('layered-sponge-42')).toBeNull();
  });

  it('never lets a password longer than 72 bytes match one that shares its first 72', async () => {
    const hash = bcrypt.hashSync('b2-'.repeat(24), 4);
    expect(await checkPassword('b2-'.repeat(24), hash)).toBe(true);
    expect(await checkPassword(`${'b2-'.repeat(24)}anything`, hash)).toBe(false);
  });
});

describe('demo mode and a kitchen’s own installation', () => {
  const base = `${process.env.DB_NAME}_own`;

  it('allows the demo kitchen on loopback only', () => {
    const env = { JWT_SECRET: 'x'.repeat(32) };
    expect(() => parseConfig({ ...env, HOST: '0.0.0.0', DEMO_KITCHEN: 'true', COOKIE_SECURE: 'true' })).toThrow(/DEMO_KITCHEN: .*loopback/);
    expect(() => parseConfig({ ...env, HOST: '127.0.0.1', DEMO_KITCHEN: 'true' })).not.toThrow();
  });

  it('seeds no demo accounts outside demo mode, and prints a one-time link that sets the first manager', async () => {
    const s = await startAppWith({ DEMO_KITCHEN: 'false' }, { database: `${base}_a`, seed: true });
    try {
      const users = await s.sequelize.query('SELECT id FROM users', { type: QueryTypes.SELECT });
      expect(users).toHaveLength(0);
      expect(
        (await s.app.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email: 'manager@example.com', password: DEMO } }))
          .statusCode,
      ).toBe(401);

      const link = (await s.issueFirstManagerLink())!;
      const stored = await s.sequelize.query<{ token_sha256: string }>('SELECT token_sha256 FROM first_manager_links', {
        type: QueryTypes.SELECT,
      });
      expect(stored).toEqual([{ token_sha256: createHash('sha256').update(link).digest('hex') }]);
      expect(JSON.stringify(stored)).not.toContain(link);

      const body = { token: link, email: 'owner@example.com', name: 'Kitchen Owner', password: 'rye-sourdough-starter-9' };
      const weak = await s.app.inject({ method: 'POST', url: '/api/auth/first-manager', payload: { ...body, password: 'password1234' } });
      expect(weak.statusCode).toBe(400);
      const set = await s.app.inject({ method: 'POST', url: '/api/auth/first-manager', payload: body });
      expect(set.statusCode).toBe(201);
      expect(set.json()).toMatchObject({ email: 'owner@example.com', role: 'manager' });
      const again = await s.app.inject({
        method: 'POST',
        url: '/api/auth/first-manager',
        payload: { ...body, email: 'second@example.com' },
      });
      expect(again.statusCode).toBe(403);
      const signIn = await s.app.inject({
        method: 'POST',
        url: '/api/auth/sign-in',
        payload: { email: 'owner@example.com', password: 'rye-sourdough-starter-9' },
      });
      expect(signIn.statusCode).toBe(200);
      expect(await s.issueFirstManagerLink()).toBeNull();
    } finally {
      await s.close();
    }
  }, 120_000);

  it('refuses an expired link, and one replaced by a newer link', async () => {
    const s = await startAppWith({ DEMO_KITCHEN: 'false' }, { database: `${base}_b` });
    try {
      const first = (await s.issueFirstManagerLink())!;
      const second = (await s.issueFirstManagerLink())!;
      const body = (token: string) => ({ token, email: 'owner@example.com', name: 'Kitchen Owner', password: 'rye-sourdough-starter-9' });
      const replaced = await s.app.inject({ method: 'POST', url: '/api/auth/first-manager', payload: body(first) });
      expect(replaced.statusCode).toBe(403);
      expect(replaced.json().message).toMatch(/used, has expired or was replaced/);
      await s.sequelize.query('UPDATE first_manager_links SET expires_at = NOW(3) - INTERVAL 1 SECOND');
      expect((await s.app.inject({ method: 'POST', url: '/api/auth/first-manager', payload: body(second) })).statusCode).toBe(403);
      expect(await s.sequelize.query('SELECT id FROM users', { type: QueryTypes.SELECT })).toHaveLength(0);
    } finally {
      await s.close();
    }
  });

  it('refuses the published password of accounts a demo run left, once demo mode is off, and offers the link', async () => {
    const demo = await startAppWith({ DEMO_KITCHEN: 'true' }, { database: `${base}_c`, seed: true });
    expect(
      (await demo.app.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email: 'manager@example.com', password: DEMO } }))
        .statusCode,
    ).toBe(200);
    await demo.close({ keepDatabase: true });
    const own = await startAppWith({ DEMO_KITCHEN: 'false' }, { database: `${base}_c`, create: false });
    try {
      const res = await own.app.inject({
        method: 'POST',
        url: '/api/auth/sign-in',
        payload: { email: 'manager@example.com', password: DEMO },
      });
      expect(res.statusCode).toBe(401);
      expect(res.json().message).toMatch(/published password, which works only in the demo/);
      expect(res.cookies).toHaveLength(0);
      expect(typeof (await own.issueFirstManagerLink())).toBe('string');
    } finally {
      await own.close();
    }
  }, 120_000);

  it('offers the link while one kitchen has no manager who can sign in, and makes its manager that kitchen’s only', async () => {
    const s = await startAppWith({ DEMO_KITCHEN: 'false' }, { database: `${base}_d` });
    try {
      const password = 'two-kitchens-owner-4';
      await s.sequelize.query(
        "INSERT INTO users (email, name, role, password_hash, active, created_at, updated_at) VALUES ('owner@example.com', 'Owner', 'manager', ?, TRUE, NOW(), NOW())",
        { replacements: [bcrypt.hashSync(password, 4)] },
      );
      const signIn = await s.app.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email: 'owner@example.com', password } });
      const cookie = `cp_session=${signIn.cookies.find((c) => c.name === 'cp_session')!.value}`;
      const imported = await s.app.inject({ method: 'POST', url: '/api/book/import', payload: TWO_KITCHENS_BOOK, headers: { cookie } });
      expect(imported.statusCode).toBe(200);
      // The importing manager manages both kitchens: no link.
      expect(await s.issueFirstManagerLink()).toBeNull();
      // Corner Shop left without a manager (as a restored installation may be): a link is printed.
      await s.sequelize.query("UPDATE kitchen_roles SET role = 'pastry-chef' WHERE site_id = (SELECT id FROM sites WHERE code = 'corner')");
      const token = (await s.issueFirstManagerLink())!;
      expect(typeof token).toBe('string');
      const set = await s.app.inject({
        method: 'POST',
        url: '/api/auth/first-manager',
        payload: { token, email: 'corner@example.com', name: 'Corner Manager', password: 'corner-shop-keys-31' },
      });
      expect(set.statusCode).toBe(201);
      expect(set.json().kitchens).toEqual([{ id: expect.any(Number), code: 'corner', name: 'Corner Shop', role: 'manager' }]);
      expect(await s.issueFirstManagerLink()).toBeNull();
    } finally {
      await s.close();
    }
  }, 120_000);
});
