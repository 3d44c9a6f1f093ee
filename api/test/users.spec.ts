import { KITCHEN_HEADER, type User } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from './support/test-app';
import { setUpTwoKitchens } from './support/two-kitchens';

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
    expect(res.json().message).toBe(
      'Tobiah Quill (chef@example.com) already works at Wrenfield Lane Bakehouse, as pastry chef. Change their role in the list instead.',
    );
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

describe('people per kitchen: a role at each, and a manager acts at their own kitchen only', () => {
  const PASSWORD = 'two-kitchens-pass-58';
  let t: TestApp;
  let owner: string;
  const kitchen = { A: '', B: '' };
  beforeAll(async () => {
    t = await startTestApp();
    ({ owner, A: kitchen.A, B: kitchen.B } = await setUpTwoKitchens(t, PASSWORD));
  });
  afterAll(() => t.close());

  const at = (k: 'A' | 'B', method: 'GET' | 'POST' | 'PATCH' | 'DELETE', url: string, cookie: string, payload?: object) =>
    t.app.inject({ method, url, headers: { cookie, [KITCHEN_HEADER]: kitchen[k] }, ...(payload ? { payload } : {}) });
  const people = async (k: 'A' | 'B', cookie = owner) => (await at(k, 'GET', '/api/users', cookie)).json<User[]>();
  const person = async (k: 'A' | 'B', email: string) => (await people(k)).find((u) => u.email === email);
  const idOf = async (email: string) =>
    (await t.sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { replacements: [email], type: QueryTypes.SELECT }))[0]
      .id;
  const auditOf = async (action: string) =>
    t.sequelize.query<{ summary: string; actor_role: string }>(
      'SELECT summary, actor_role FROM audit_events WHERE action = ? ORDER BY id',
      {
        replacements: [action],
        type: QueryTypes.SELECT,
      },
    );
  const add = (k: 'A' | 'B', email: string, name: string, role: string, cookie = owner) =>
    at(k, 'POST', '/api/users', cookie, { email, name, role, password: PASSWORD });

  let nell: string;
  it('adds a person at A, and the same address at B with another role: one account, a role at each', async () => {
    const created = await add('A', 'nell@example.com', 'Nell Marsh', 'manager');
    expect(created.statusCode).toBe(201);
    expect(created.json()).toMatchObject({ outcome: 'created', role: 'manager', elsewhere: 0 });
    // At B the address is known: the account is added with the role there, its name and password kept.
    const added = await add('B', 'nell@example.com', 'Another Name', 'front-of-house');
    expect(added.statusCode).toBe(201);
    expect(added.json()).toMatchObject({ outcome: 'added', name: 'Nell Marsh', role: 'front-of-house', elsewhere: 1 });
    expect(added.json().message).toBe(
      'nell@example.com already has a Crumbproof account, as Nell Marsh: they now work at Corner Shop too, as front of house, and sign in with their own password (no invitation or new password was sent).',
    );
    expect((await auditOf('user.added-to-kitchen')).map((e) => e.summary)).toEqual([
      'Added Nell Marsh (nell@example.com), who has an account already and works at 1 other kitchen, to Corner Shop as front-of-house.',
    ]);
    expect(await person('A', 'nell@example.com')).toMatchObject({ role: 'manager', elsewhere: 1 });
    expect(await person('B', 'nell@example.com')).toMatchObject({ role: 'front-of-house', elsewhere: 1 });

    nell = await t.signIn('nell@example.com', PASSWORD);
    const me = (await t.app.inject({ method: 'GET', url: '/api/me', headers: { cookie: nell } })).json();
    expect(me.kitchens.map((k: { name: string; role: string }) => [k.name, k.role])).toEqual([
      ['Test bench', 'manager'],
      ['Corner Shop', 'front-of-house'],
    ]);
    expect((await t.app.inject({ method: 'GET', url: '/api/users', headers: { cookie: nell } })).json()).toMatchObject({
      code: 'kitchen-required',
    });
    expect((await at('A', 'GET', '/api/users', nell)).statusCode).toBe(200);
    expect((await at('B', 'GET', '/api/users', nell)).statusCode).toBe(403);
  });

  it('refuses an address already at this kitchen, and a deactivated account, adding nothing', async () => {
    const again = await add('A', 'nell@example.com', 'Nell Marsh', 'pastry-chef');
    expect(again.statusCode).toBe(409);
    expect(again.json().message).toBe(
      'Nell Marsh (nell@example.com) already works at Test bench, as manager. Change their role in the list instead.',
    );
    expect(await add('B', 'gone@example.com', 'Gone Soon', 'pastry-chef')).toMatchObject({ statusCode: 201 });
    expect((await at('B', 'PATCH', `/api/users/${await idOf('gone@example.com')}`, owner, { active: false })).statusCode).toBe(200);
    const deactivated = await add('A', 'gone@example.com', 'Gone Soon', 'pastry-chef');
    expect(deactivated.statusCode).toBe(409);
    expect(deactivated.json().message).toMatch(/^gone@example.com belongs to a deactivated account/);
    expect(await person('A', 'gone@example.com')).toBeUndefined();
  });

  it('an invitation to an address of another kitchen adds the role here and sends no mail', async () => {
    expect(await add('B', 'bo@example.com', 'Bo Lindqvist', 'pastry-chef')).toMatchObject({ statusCode: 201 });
    const [{ n: mailsBefore }] = await t.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM mail_outbox', {
      type: QueryTypes.SELECT,
    });
    const invited = await at('A', 'POST', '/api/users/invitations', owner, { email: 'bo@example.com', name: 'Bo', role: 'front-of-house' });
    expect(invited.statusCode).toBe(201);
    expect(invited.json()).toMatchObject({ outcome: 'added', name: 'Bo Lindqvist', role: 'front-of-house', invitationPending: false });
    const [{ n: mailsAfter }] = await t.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM mail_outbox', {
      type: QueryTypes.SELECT,
    });
    expect(mailsAfter).toBe(mailsBefore);
    expect(await person('A', 'bo@example.com')).toMatchObject({ role: 'front-of-house' });
    expect(await person('B', 'bo@example.com')).toMatchObject({ role: 'pastry-chef' });
    // Bo leaves A again: back to B only, for the tests below.
    expect((await at('A', 'DELETE', `/api/users/${await idOf('bo@example.com')}/kitchen`, owner)).statusCode).toBe(200);
  });

  it('a manager of A neither sees nor changes a person who works only at B', async () => {
    nell = await t.signIn('nell@example.com', PASSWORD);
    const bo = await idOf('bo@example.com');
    expect((await people('A', nell)).map((u) => u.email)).not.toContain('bo@example.com');
    for (const [method, url, payload] of [
      ['PATCH', `/api/users/${bo}`, { name: 'Renamed' }],
      ['PATCH', `/api/users/${bo}`, { role: 'manager' }],
      ['PATCH', `/api/users/${bo}`, { active: false }],
      ['DELETE', `/api/users/${bo}/kitchen`, undefined],
      ['POST', `/api/users/${bo}/invitation`, {}],
    ] as const) {
      const res = await at('A', method, url, nell, payload);
      expect({ status: res.statusCode, message: res.json().message }).toEqual({
        status: 404,
        message: `There is no user ${bo} at this kitchen (Test bench).`,
      });
    }
    // Naming kitchen B, where Nell is front of house, is refused by role.
    expect((await at('B', 'PATCH', `/api/users/${bo}`, nell, { name: 'Renamed' })).statusCode).toBe(403);
    expect(await person('B', 'bo@example.com')).toMatchObject({ name: 'Bo Lindqvist', role: 'pastry-chef', active: true });
  });

  it('changes a role at this kitchen only; the person’s sessions end', async () => {
    const id = await idOf('nell@example.com');
    const res = await at('B', 'PATCH', `/api/users/${id}`, owner, { role: 'pastry-chef' });
    expect(res.statusCode).toBe(200);
    expect(res.json()).toMatchObject({ role: 'pastry-chef', elsewhere: 1 });
    expect(await person('A', 'nell@example.com')).toMatchObject({ role: 'manager' });
    expect(await person('B', 'nell@example.com')).toMatchObject({ role: 'pastry-chef' });
    expect((await at('A', 'GET', '/api/users', nell)).statusCode).toBe(401);
    nell = await t.signIn('nell@example.com', PASSWORD);
    expect((await at('B', 'GET', '/api/ingredients', nell)).statusCode).toBe(200);
  });

  it('deactivates or sets the password of an account only for a manager at every kitchen the person works in', async () => {
    expect(await add('A', 'pat@example.com', 'Pat Rowe', 'pastry-chef', nell)).toMatchObject({ statusCode: 201 });
    expect(await add('B', 'pat@example.com', 'Pat Rowe', 'front-of-house')).toMatchObject({ statusCode: 201 });
    const pat = await idOf('pat@example.com');
    const refusedBefore = (await auditOf('access.refused')).length;
    for (const [payload, what] of [
      [{ active: false }, 'deactivate'],
      [{ password: 'taken-over-pass-77' }, 'set the password of'],
    ] as const) {
      const res = await at('A', 'PATCH', `/api/users/${pat}`, nell, payload);
      expect(res.statusCode).toBe(403);
      expect(res.json().message).toBe(
        `You cannot ${what} Pat Rowe’s account: it is theirs at every kitchen they work in, and you are not a manager at Corner Shop. A manager of every kitchen they work in can; or take them off this kitchen instead.`,
      );
    }
    expect(await auditOf('access.refused')).toHaveLength(refusedBefore + 2);
    const patSession = await t.signIn('pat@example.com', PASSWORD);
    expect(await person('A', 'pat@example.com')).toMatchObject({ active: true });
    // Their name and their role at A are Nell's to change.
    expect((await at('A', 'PATCH', `/api/users/${pat}`, nell, { name: 'Pat R. Rowe', role: 'front-of-house' })).statusCode).toBe(200);
    // The manager of both kitchens may deactivate the account.
    expect((await at('A', 'PATCH', `/api/users/${pat}`, owner, { active: false })).statusCode).toBe(200);
    expect((await at('B', 'GET', '/api/counter/products', patSession)).statusCode).toBe(401);
    // A person of A alone is Nell's to deactivate.
    expect(await add('A', 'ada@example.com', 'Ada Finch', 'front-of-house', nell)).toMatchObject({ statusCode: 201 });
    expect((await at('A', 'PATCH', `/api/users/${await idOf('ada@example.com')}`, nell, { active: false })).statusCode).toBe(200);
  });

  it('keeps an active manager at each kitchen', async () => {
    const ownerId = await idOf('owner@example.com');
    // Nell manages A too, so the owner may stop being a manager there; at B the owner is the only one.
    const atB = await at('B', 'PATCH', `/api/users/${ownerId}`, owner, { role: 'pastry-chef' });
    expect(atB.statusCode).toBe(409);
    expect(atB.json().message).toBe('Corner Shop needs at least one active manager. Make someone else manager there first.');
    const self = await at('B', 'DELETE', `/api/users/${ownerId}/kitchen`, owner);
    expect(self.statusCode).toBe(409);
    expect(self.json().message).toBe('You cannot take yourself off Corner Shop: ask another manager here to do it.');
    expect(await person('B', 'owner@example.com')).toMatchObject({ role: 'manager' });
  });

  it('takes a person off this kitchen: their account and other kitchen stay, their sessions end', async () => {
    const id = await idOf('nell@example.com');
    const res = await at('B', 'DELETE', `/api/users/${id}/kitchen`, owner);
    expect(res.statusCode).toBe(200);
    expect(res.json()).toEqual({
      id,
      kitchen: Number(kitchen.B),
      elsewhere: 1,
      message: 'Nell Marsh no longer works at Corner Shop. Their account stays, for the 1 other kitchen they work at.',
    });
    expect(await person('B', 'nell@example.com')).toBeUndefined();
    expect(await person('A', 'nell@example.com')).toMatchObject({ role: 'manager', elsewhere: 0 });
    expect((await auditOf('user.taken-off-kitchen')).map((e) => e.summary)).toContain(
      'Took Nell Marsh (nell@example.com) off Corner Shop, where they were pastry-chef; they work at 1 other kitchen.',
    );
    expect((await at('A', 'GET', '/api/users', nell)).statusCode).toBe(401);
    // Signed in again, kitchen A is Nell's only one: requests need not name it.
    nell = await t.signIn('nell@example.com', PASSWORD);
    expect((await t.app.inject({ method: 'GET', url: '/api/users', headers: { cookie: nell } })).statusCode).toBe(200);
    expect((await at('B', 'GET', '/api/counter/products', nell)).statusCode).toBe(403);
    // Taken off already: there is no such person at B.
    const again = await at('B', 'DELETE', `/api/users/${id}/kitchen`, owner);
    expect(again.json().message).toBe(`There is no user ${id} at this kitchen (Corner Shop).`);
  });
});
