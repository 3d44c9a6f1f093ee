import type { IngredientView, ServedDeclaration } from '@crumbproof/shared';
import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { Sequelize } from 'sequelize-typescript';
import { createApp } from '../src/app.factory';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * Each API instance keeps the kitchen it read last and serves from it while the kitchen's row says
 * nothing changed. Two instances over one MariaDB: a write through one is served by the other at
 * its next read, and a read that changes nothing costs a bounded number of queries.
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

  it('serves through one instance what was saved through the other, at once', async () => {
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

    const after = await declaration(b, chefB);
    expect(after.contains.map((c) => c.allergen)).toContain('sesame');
    expect(after.basis.items.find((i) => i.id === leaf.id)!.revision).toBe(revision + 1);
  });

  it('serves a declaration again from the kept copy in a few small queries, not a read of the whole kitchen', async () => {
    await declaration(b, chefB);
    const sequelize = b.get(Sequelize);
    const sent: string[] = [];
    const query = sequelize.query.bind(sequelize) as (...args: unknown[]) => Promise<unknown>;
    const spy = jest.spyOn(sequelize, 'query').mockImplementation(((...args: unknown[]) => {
      sent.push(String(args[0]));
      return query(...args);
    }) as never);
    try {
      const served = await declaration(b, chefB);
      expect(served.contains.length).toBeGreaterThan(0);
    } finally {
      spy.mockRestore();
    }
    // The session, its user, their roles at the kitchens and the kitchens' rows: no query reads the
    // ingredients' or recipes' revisions, the kept declarations or the specifications, all kept
    // with the kitchen copy.
    expect(sent.filter((q) => /_revisions|`declarations`|`specifications`/.test(q))).toEqual([]);
    expect(sent.length).toBeLessThanOrEqual(4);
  });
});
