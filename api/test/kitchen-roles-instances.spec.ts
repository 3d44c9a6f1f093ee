import { KITCHEN_HEADER, type Me } from '@crumbproof/shared';
import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { createApp } from '../src/app.factory';
import { CHANGE_STALE_MS } from '../src/database/change-feed';
import { startTestApp, type TestApp } from './support/test-app';
import { addPerson, setUpTwoKitchens } from './support/two-kitchens';

const PASSWORD = 'two-counters-and-a-till-47';
/** The staleness bound, with a little more for the requests themselves. */
const BOUND_MS = CHANGE_STALE_MS + 500;

/**
 * A person's roles are read at each request through each instance's copy (KitchenRolesRepository):
 * two instances over one MariaDB, and a role given or taken off through one applies at once there
 * and within the staleness bound on the other.
 */
describe('a person’s kitchen roles on two instances (real MariaDB)', () => {
  let a: TestApp;
  let b: NestFastifyApplication;
  let owner: string;
  let kitchens: { A: string; B: string };
  let personId: number;
  let onA: string;
  let onB: string;
  beforeAll(async () => {
    a = await startTestApp();
    const set = await setUpTwoKitchens(a, PASSWORD);
    owner = set.owner;
    kitchens = { A: set.A, B: set.B };
    b = await createApp({ logLevel: 'silent' });
    personId = await addPerson(a, 'nell@example.com', 'front-of-house', PASSWORD, 'bench');
    onA = await a.signIn('nell@example.com', PASSWORD);
    const res = await b.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email: 'nell@example.com', password: PASSWORD } });
    onB = `cp_session=${res.cookies.find((c) => c.name === 'cp_session')!.value}`;
  });
  afterAll(async () => {
    await b.close();
    await a.close();
  });

  const me = async (app: NestFastifyApplication, cookie: string) =>
    app.inject({ method: 'GET', url: '/api/me', headers: { cookie } }).then((r) => ({ status: r.statusCode, me: r.json<Me>() }));
  const until = async (read: () => Promise<boolean>): Promise<boolean> => {
    const from = Date.now();
    let done = await read();
    while (!done && Date.now() - from < BOUND_MS) {
      await new Promise((r) => setTimeout(r, 20));
      done = await read();
    }
    return done;
  };

  it('gives a role at the other kitchen: at once on the instance that gave it, within the bound on the other', async () => {
    // Both instances have read the person's one kitchen.
    expect((await me(a.app, onA)).me.kitchens.map((k) => String(k.id))).toEqual([kitchens.A]);
    expect((await me(b, onB)).me.kitchens.map((k) => String(k.id))).toEqual([kitchens.A]);
    const added = await a.app.inject({
      method: 'POST',
      url: '/api/users',
      headers: { cookie: owner, [KITCHEN_HEADER]: kitchens.B },
      payload: { email: 'nell@example.com', name: 'Nell', role: 'front-of-house', password: PASSWORD },
    });
    expect(added.json()).toMatchObject({ outcome: 'added' });
    expect((await me(a.app, onA)).me.kitchens.map((k) => String(k.id))).toEqual([kitchens.A, kitchens.B]);
    const startedAt = Date.now();
    expect(await until(async () => (await me(b, onB)).me.kitchens.length === 2)).toBe(true);
    expect(Date.now() - startedAt).toBeLessThanOrEqual(BOUND_MS);
  });

  it('takes the person off a kitchen: their sessions end at once on the instance that did it, within the bound on the other', async () => {
    const taken = await a.app.inject({
      method: 'DELETE',
      url: `/api/users/${personId}/kitchen`,
      headers: { cookie: owner, [KITCHEN_HEADER]: kitchens.B },
    });
    expect(taken.statusCode).toBe(200);
    expect((await me(a.app, onA)).status).toBe(401);
    const startedAt = Date.now();
    expect(await until(async () => (await me(b, onB)).status === 401)).toBe(true);
    expect(Date.now() - startedAt).toBeLessThanOrEqual(BOUND_MS);
    // Signed in again, the person has the one kitchen left, on either instance.
    const again = await b.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email: 'nell@example.com', password: PASSWORD } });
    const cookie = `cp_session=${again.cookies.find((c) => c.name === 'cp_session')!.value}`;
    expect((await me(b, cookie)).me.kitchens.map((k) => String(k.id))).toEqual([kitchens.A]);
    expect((await me(a.app, cookie)).me.kitchens.map((k) => String(k.id))).toEqual([kitchens.A]);
  });
});
