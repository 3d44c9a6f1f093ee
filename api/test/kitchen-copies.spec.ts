import type { IngredientView, ServedDeclaration } from '@crumbproof/shared';
import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { Sequelize } from 'sequelize-typescript';
import { createApp } from '../src/app.factory';
import { CHANGE_STALE_MS } from '../src/database/change-feed';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * Each API instance keeps the kitchen it read last and serves from it while the change feed has
 * heard no write (ChangeFeed polls every kitchen's versions). Two instances over one MariaDB: a
 * write through one is served at once by it and by the other within the staleness bound, and a
 * warm read costs no query at all (the feed's poll runs beside the requests, not in them).
 */
describe('the kitchen copy each instance keeps (real MariaDB)', () => {
  let a: TestApp;
  let b: NestFastifyApplication;
  let chefA: string;
  let chefB: string;
  beforeAll(async () => {
    a = await startTestApp({ seed: true });
    b = await createApp({ logLevel: 'silent' });
    chefA = await a.signIn('chef@example.com');
    const res = await b.inject({
      method: 'POST',
      url: '/api/auth/sign-in',
      payload: { email: 'chef@example.com', password: 'crumbproof-demo' },
    });
    chefB = `cp_session=${res.cookies.find((c) => c.name === 'cp_session')!.value}`;
  });
  afterAll(async () => {
    await b.close();
    await a.close();
  });

  const get = (app: NestFastifyApplication, url: string, cookie: string) => app.inject({ method: 'GET', url, headers: { cookie } });
  const declaration = async (app: NestFastifyApplication, cookie: string) =>
    (await get(app, '/api/recipes/vegan-brownie/declaration', cookie)).json<ServedDeclaration>();

  it('serves what was saved through one instance at once there, and through the other within the staleness bound', async () => {
    const before = await declaration(b, chefB);
    expect(before.contains.map((c) => c.allergen)).not.toContain('sesame');
    const leaf = before.basis.items.find((i) => i.kind === 'ingredient')!;
    const loaded = (await get(a.app, `/api/ingredients/${leaf.id}`, chefA)).json<IngredientView>();
    const { revision, updatedAt: _u, ...body } = loaded;
    const saved = await a.app.inject({
      method: 'PUT',
      url: `/api/ingredients/${leaf.id}`,
      headers: { cookie: chefA },
      payload: { ...body, contains: [...(body.contains ?? []), 'sesame'], baseRevision: revision },
    });
    expect(saved.statusCode).toBe(200);
    const savedAt = Date.now();

    // Read-your-writes on the instance that saved it.
    const here = (await get(a.app, '/api/recipes/vegan-brownie/declaration', chefA)).json<ServedDeclaration>();
    expect(here.contains.map((c) => c.allergen)).toContain('sesame');
    // The other instance hears it within the bound.
    let after = await declaration(b, chefB);
    while (!after.contains.some((c) => c.allergen === 'sesame') && Date.now() - savedAt < CHANGE_STALE_MS + 500) {
      await new Promise((r) => setTimeout(r, 20));
      after = await declaration(b, chefB);
    }
    expect({ heardWithinMs: Date.now() - savedAt <= CHANGE_STALE_MS + 500 }).toEqual({ heardWithinMs: true });
    expect(after.contains.map((c) => c.allergen)).toContain('sesame');
    expect(after.basis.items.find((i) => i.id === leaf.id)!.revision).toBe(revision + 1);
  });

  it('serves a declaration and every product’s again from the kept copies without a query', async () => {
    await declaration(b, chefB);
    await get(b, '/api/declarations', chefB);
    const sequelize = b.get(Sequelize);
    const sent: string[] = [];
    const query = sequelize.query.bind(sequelize) as (...args: unknown[]) => Promise<unknown>;
    const spy = jest.spyOn(sequelize, 'query').mockImplementation(((...args: unknown[]) => {
      sent.push(String(args[0]));
      return query(...args);
    }) as never);
    try {
      for (let n = 0; n < 5; n++) {
        const served = await declaration(b, chefB);
        expect(served.contains.length).toBeGreaterThan(0);
        const all = await get(b, '/api/declarations', chefB);
        expect(all.statusCode).toBe(200);
        expect(all.json<ServedDeclaration[]>().length).toBeGreaterThan(1);
      }
    } finally {
      spy.mockRestore();
    }
    // The session, its user, their roles at the kitchens, the kitchens' rows, the items, the kept
    // declarations and the specifications are all kept in memory until a change is heard (the
    // change feed polls the revisions every 200 ms on a connection of its own, beside the requests).
    expect(sent).toEqual([]);
  });

  it('answers a declaration with its entity tag, and 304 to a request that holds it', async () => {
    const first = await get(b, '/api/recipes/vegan-brownie/declaration', chefB);
    const etag = first.headers.etag as string;
    expect(etag).toMatch(/^"[\w-]{43}"$/);
    const again = await b.inject({
      method: 'GET',
      url: '/api/recipes/vegan-brownie/declaration',
      headers: { cookie: chefB, 'if-none-match': etag },
    });
    expect(again.statusCode).toBe(304);
    expect(again.body).toBe('');
    const other = await b.inject({
      method: 'GET',
      url: '/api/recipes/vegan-brownie/declaration',
      headers: { cookie: chefB, 'if-none-match': '"something-else"' },
    });
    expect(other.statusCode).toBe(200);
    expect(other.json<ServedDeclaration>()).toEqual(first.json<ServedDeclaration>());
  });
});
