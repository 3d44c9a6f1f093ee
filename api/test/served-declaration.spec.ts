import type { Book, ServedDeclaration } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * A served declaration says where it comes from: when it was computed, under which regime, from
 * which revision of the product and of everything below it, and which version of the kitchen's
 * settings. Checked on the real MariaDB, on a small product imported into the demo kitchen.
 */
describe('a served declaration and its basis (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;
  let manager: string;
  let counter: string;
  let site: Book['site'];
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    ({ manager, chef, counter } = await t.signInDemo());
    site = (await req('GET', '/api/book', chef)).json<Book>().site;
    // Biscuits made of a dough and a plant spread; the QUID names the spread.
    const imported = await req('POST', '/api/book/import', manager, {
      crumbproofBook: 1,
      site,
      ingredients: [
        { id: 'basis-flour', name: 'Basis flour', contains: ['wheat'], mayContain: [], vegan: true, vegetarian: true },
        { id: 'basis-spread', name: 'Basis plant spread', contains: [], mayContain: [], vegan: true, vegetarian: true },
        { id: 'basis-sugar', name: 'Basis sugar', contains: [], mayContain: [], vegan: true, vegetarian: true },
      ],
      recipes: [
        {
          id: 'basis-dough',
          name: 'Basis dough',
          lines: [
            { use: 'basis-flour', qty: 200, unit: 'g' },
            { use: 'basis-spread', qty: 100, unit: 'g' },
          ],
        },
        {
          id: 'basis-biscuit',
          name: 'Basis biscuit',
          lines: [
            { use: 'basis-dough', qty: 300, unit: 'g' },
            { use: 'basis-sugar', qty: 50, unit: 'g' },
          ],
          sale: { portionG: 25, quid: ['basis-spread'] },
        },
      ],
    });
    expect(imported.statusCode).toBe(200);
  });
  afterAll(() => t.close());

  const req: TestApp['req'] = (...args) => t.req(...args);
  const served = async (code: string, query = '') => {
    const res = await req('GET', `/api/recipes/${code}/declaration${query}`, counter);
    expect(res.statusCode).toBe(200);
    return res.json<ServedDeclaration>();
  };
  const siteVersion = async () =>
    Number(
      (await t.sequelize.query<{ version: number }>('SELECT version FROM sites ORDER BY id LIMIT 1', { type: QueryTypes.SELECT }))[0]
        .version,
    );
  const declarationRows = async () =>
    Number((await t.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM declarations', { type: QueryTypes.SELECT }))[0].n);

  it('has kept, once the import answered, the declaration of each recipe it wrote, which serving then reads', async () => {
    const keptOf = () =>
      t.sequelize.query<{ code: string; computedAt: Date }>(
        `SELECT r.code AS code, d.created_at AS computedAt FROM declarations d JOIN recipes r ON r.id = d.recipe_id
         WHERE r.code IN ('basis-dough', 'basis-biscuit') ORDER BY r.code`,
        { type: QueryTypes.SELECT },
      );
    const kept = await keptOf();
    expect(kept.map((k) => k.code)).toEqual(['basis-biscuit', 'basis-dough']);
    const rows = await declarationRows();
    const [biscuit, dough] = [await served('basis-biscuit'), await served('basis-dough')];
    expect(Date.parse(biscuit.basis.computedAt)).toBe(new Date(kept[0].computedAt).getTime());
    expect(Date.parse(dough.basis.computedAt)).toBe(new Date(kept[1].computedAt).getTime());
    expect(await declarationRows()).toBe(rows);
  });

  it('names the product first, then every ingredient and sub-recipe it is made from, each at its current revision', async () => {
    const d = await served('basis-biscuit');
    expect(d.basis.items).toEqual([
      { id: 'basis-biscuit', kind: 'recipe', name: 'Basis biscuit', revision: 1 },
      { id: 'basis-dough', kind: 'recipe', name: 'Basis dough', revision: 1 },
      { id: 'basis-flour', kind: 'ingredient', name: 'Basis flour', revision: 1 },
      { id: 'basis-spread', kind: 'ingredient', name: 'Basis plant spread', revision: 1 },
      { id: 'basis-sugar', kind: 'ingredient', name: 'Basis sugar', revision: 1 },
    ]);
    expect(d.basis.regime).toBe(site.regime);
    expect(d.basis.siteVersion).toBe(await siteVersion());
    expect(Number.isNaN(Date.parse(d.basis.computedAt))).toBe(false);
    expect(d.contains.map((c) => c.allergen)).toEqual(['gluten']);
  });

  it('serves the kept declaration again, computed at the same moment, without computing it anew', async () => {
    const first = await served('basis-biscuit');
    const rows = await declarationRows();
    const again = await served('basis-biscuit');
    expect(again).toEqual(first);
    expect(await declarationRows()).toBe(rows);
  });

  it('after an ingredient is revised, shows its new revision, a later computation and the allergen it brings', async () => {
    const before = await served('basis-biscuit');
    const spread = (await req('GET', '/api/ingredients/basis-spread', chef)).json();
    const { revision, updatedAt: _u, ...body } = spread;
    // The supplier's new specification states soya.
    const res = await req('PUT', '/api/ingredients/basis-spread', chef, { ...body, contains: ['soy'], baseRevision: revision });
    expect(res.statusCode).toBe(200);
    const after = await served('basis-biscuit');
    expect(after.basis.items.find((i) => i.id === 'basis-spread')!.revision).toBe(2);
    expect(after.basis.items.filter((i) => i.id !== 'basis-spread').map((i) => [i.id, i.revision])).toEqual(
      before.basis.items.filter((i) => i.id !== 'basis-spread').map((i) => [i.id, i.revision]),
    );
    expect(Date.parse(after.basis.computedAt)).toBeGreaterThan(Date.parse(before.basis.computedAt));
    expect(after.contains.map((c) => c.allergen)).toEqual(['gluten', 'soybeans']);
    expect(before.contains.map((c) => c.allergen)).not.toContain('soybeans');
  });

  it('follows a change to the kitchen’s settings with their new version', async () => {
    const before = await served('basis-biscuit');
    const version = await siteVersion();
    const kitchen = (await req('GET', '/api/kitchen', counter)).json();
    const res = await req('PATCH', '/api/kitchen', manager, {
      handles: [...kitchen.handles, { allergen: 'lupin', controls: 'shared-equipment' }],
    });
    expect(res.statusCode).toBe(200);
    const after = await served('basis-biscuit');
    expect(after.basis.siteVersion).toBe(version + 1);
    expect(await siteVersion()).toBe(version + 1);
    expect(Date.parse(after.basis.computedAt)).toBeGreaterThan(Date.parse(before.basis.computedAt));
  });

  it('says which regime it was declared under when another is asked for', async () => {
    const us = await served('basis-biscuit', '?regime=US');
    expect(us.regime).toBe('US');
    expect(us.basis.regime).toBe('US');
    expect(us.basis.items[0].id).toBe('basis-biscuit');
  });

  it('gives every product for sale with its own basis', async () => {
    const res = await req('GET', '/api/declarations', counter);
    expect(res.statusCode).toBe(200);
    const all = res.json<ServedDeclaration[]>();
    expect(all.length).toBeGreaterThanOrEqual(6);
    for (const d of all) {
      expect(d.basis.items[0]).toMatchObject({ id: d.product, kind: 'recipe' });
      expect(d.basis.siteVersion).toBe(await siteVersion());
    }
    const biscuit = all.find((d) => d.product === 'basis-biscuit')!;
    expect(biscuit).toEqual(await served('basis-biscuit'));
  });

  it('imports the same book again, written with its keys in another order, and saves nothing', async () => {
    const book = (await req('GET', '/api/book', chef)).json<Book>();
    const reversed = (v: unknown): unknown =>
      Array.isArray(v)
        ? v.map(reversed)
        : v && typeof v === 'object'
          ? Object.fromEntries(
              Object.entries(v)
                .reverse()
                .map(([k, x]) => [k, reversed(x)]),
            )
          : v;
    const before = await served('basis-biscuit');
    const version = await siteVersion();
    const res = await req('POST', '/api/book/import', manager, reversed(book));
    expect(res.statusCode).toBe(200);
    expect(res.json()).toEqual({
      site: 'unchanged',
      kitchens: { site: 'unchanged' },
      ingredients: { created: [], revised: [], unchanged: book.ingredients.length },
      recipes: { created: [], revised: [], unchanged: book.recipes.length },
    });
    expect(await siteVersion()).toBe(version);
    expect(await served('basis-biscuit')).toEqual(before);
  });
});
