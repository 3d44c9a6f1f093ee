import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Book, ProductDeclaration, ServedDeclaration } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from './support/test-app';

const fixture = (name: string): unknown => JSON.parse(readFileSync(join(__dirname, '..', '..', 'tests', 'fixtures', name), 'utf8'));
const shortbread = fixture('shortbread.book.json') as Book;

describe('recipe book, declarations and the checked write path (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;
  let manager: string;
  let counter: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    ({ manager, chef, counter } = await t.signInDemo());
  });
  afterAll(() => t.close());

  const req: TestApp['req'] = (...args) => t.req(...args);
  const count = async (table: string) =>
    Number((await t.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table}`, { type: QueryTypes.SELECT }))[0].n);

  it('exports the seeded demo kitchen as a recipe book that validates against the published schema', async () => {
    const res = await req('GET', '/api/book', chef);
    expect(res.statusCode).toBe(200);
    const book = res.json<Book>();
    expect(book.crumbproofBook).toBe(1);
    expect(book.site.regime).toBe('UK');
    expect(book.recipes.filter((r) => r.sale).length).toBeGreaterThanOrEqual(5);
  });

  it('declares a demo product for the counter, with nutrition, and serves the same declaration from the store', async () => {
    const first = await req('GET', '/api/recipes/vegan-brownie/declaration', counter);
    expect(first.statusCode).toBe(200);
    const d = first.json<ProductDeclaration>();
    expect(d.claims.vegan.status).toBe('ok');
    expect(d.nutrition.per100g.energyKj).toBeGreaterThan(0);
    const stored = await count('declarations');
    const again = await req('GET', '/api/recipes/vegan-brownie/declaration', counter);
    expect(again.json()).toEqual(d);
    expect(await count('declarations')).toBe(stored);
  });

  it('gives a declaration in another regime on request, and refuses an unknown regime by name', async () => {
    const us = await req('GET', '/api/recipes/apricot-walnut-loaf/declaration?regime=US', counter);
    expect(us.statusCode).toBe(200);
    expect(us.json().regime).toBe('US');
    expect(us.json().contains.map((c: { allergen: string }) => c.allergen)).toEqual(expect.arrayContaining(['tree-nuts', 'wheat']));
    const bad = await req('GET', '/api/recipes/apricot-walnut-loaf/declaration?regime=XX', counter);
    expect(bad.statusCode).toBe(400);
    // The query parameter is named as it was sent, never as a body.
    expect(bad.json().fields[0].path).toBe('regime');
    expect(bad.json().message).toMatch(/regime: Use one of EU, UK, US, CA, ANZ/);
    expect(bad.json().message).not.toContain('(body)');
  });

  it('imports a book all or nothing: one bad recipe and nothing is saved, naming the recipe and line', async () => {
    const before = await count('recipe_revisions');
    const bad: Book = {
      ...shortbread,
      site: { name: 'Wrenfield Lane Bakehouse', regime: 'UK', handles: [] },
      ingredients: [...shortbread.ingredients, { id: 'lemon', name: 'Lemon', contains: [], mayContain: [], vegan: true, vegetarian: true }],
      recipes: [
        shortbread.recipes[0],
        {
          id: 'lemon-curd',
          name: 'Lemon curd',
          lines: [
            { use: 'butter', qty: 50, unit: 'g' },
            { use: 'flour', qty: 5, unit: 'g' },
            { use: 'butter', qty: 1, unit: 'g' },
            { use: 'lemon', qty: 2, unit: 'each' },
          ],
        },
      ],
    };
    const res = await req('POST', '/api/book/import', manager, bad);
    expect(res.statusCode).toBe(400);
    expect(res.json().code).toBe('unweighable-line');
    expect(res.json().message).toMatch(/Line 4 of Lemon curd uses 'lemon' in 'each', but Lemon has no weight per unit/);
    // The problem as data: the recipe, its line, what the line uses and what would weigh it.
    expect(res.json().problems).toEqual([
      {
        code: 'unweighable-line',
        recipe: 'lemon-curd',
        field: 'unit',
        line: 4,
        use: 'lemon',
        unit: 'each',
        needs: 'gEach',
        message: expect.stringMatching(/^Line 4 of Lemon curd uses 'lemon' in 'each'/),
      },
    ]);
    expect(res.json().fields).toBeUndefined();
    expect(await count('recipe_revisions')).toBe(before);
    expect((await req('GET', '/api/recipes/shortbread', chef)).statusCode).toBe(404);
  });

  it('refuses a book that fails the schema, naming the ingredient and field', async () => {
    const res = await req('POST', '/api/book/import', manager, {
      ...shortbread,
      ingredients: [{ ...shortbread.ingredients[0], vegan: 'maybe' }],
    });
    expect(res.statusCode).toBe(400);
    expect(res.json().code).toBe('book-invalid');
    expect(res.json().fields).toEqual([
      { path: 'ingredients.0 (flour).vegan', message: 'Say whether it is vegan: true, false, or null when it is not known.' },
    ]);
    expect(res.json().problems).toBeUndefined();
  });

  it('words a schema problem of a book as the declare command does', async () => {
    const res = await req('POST', '/api/book/import', manager, {
      crumbproofBook: 1,
      site: { name: 'x', regime: 'EU' },
      ingredients: [{ id: 'lemon', name: 'Lemon', vegan: true }],
      recipes: [],
    });
    expect(res.statusCode).toBe(400);
    // The same line as `npm run declare` prints for this book (api/src/cli/declare.spec.ts).
    expect(res.json().message).toBe(
      'The recipe book is not valid. ingredients.0 (lemon).vegetarian: Say whether it is vegetarian: true, false, or null when it is not known.',
    );
  });

  it('imports a good book, merging by id, and reports what it created', async () => {
    const book = { ...shortbread, site: (await req('GET', '/api/book', chef)).json().site };
    const res = await req('POST', '/api/book/import', manager, book);
    expect(res.statusCode).toBe(200);
    expect(res.json().recipes.created).toEqual(['shortbread']);
    const d = (await req('GET', '/api/recipes/shortbread/declaration', counter)).json<ProductDeclaration>();
    expect(d.contains.map((c) => c.allergen)).toEqual(['gluten', 'milk']);
    expect(d.claims.vegan.status).toBe('fails');
    expect(d.errors.map((e) => e.code)).toContain('claim-not-met');
    const again = await req('POST', '/api/book/import', manager, book);
    expect(again.json().recipes).toEqual({ created: [], revised: [], unchanged: 1 });
  });

  it('imports a book of several megabytes and over a thousand new ingredients, then finds nothing to do when it comes again', async () => {
    const exported = (await req('GET', '/api/book', chef)).json<Book>();
    const template = exported.ingredients[0];
    const extra = Array.from({ length: 1100 }, (_, i) => ({
      ...template,
      id: `bulk-flour-${i}`,
      name: `Stone-ground flour, lot ${i}`,
      composition: `Wheat flour from lot ${i}. `.padEnd(3000, '.'),
    }));
    const book = { ...exported, ingredients: [...exported.ingredients, ...extra] };
    expect(JSON.stringify(book).length).toBeGreaterThan(3 * 1024 * 1024); // above the 2 MB of any other request
    const res = await req('POST', '/api/book/import', manager, book);
    expect(res.statusCode).toBe(200);
    expect(res.json().ingredients.created).toHaveLength(1100);
    expect(res.json().ingredients.unchanged).toBe(exported.ingredients.length);
    const back = (await req('GET', '/api/book', chef)).json<Book>();
    expect(back.ingredients.find((i) => i.id === 'bulk-flour-1099')).toEqual(extra[1099]);
    const again = await req('POST', '/api/book/import', manager, book);
    expect(again.json().ingredients).toEqual({ created: [], revised: [], unchanged: exported.ingredients.length + 1100 });
    const changed = await req('POST', '/api/book/import', manager, {
      ...book,
      ingredients: book.ingredients.map((i) => (i.id === 'bulk-flour-7' ? { ...i, name: 'Stone-ground flour, lot 7 (new mill)' } : i)),
    });
    expect(changed.json().ingredients.revised).toEqual(['bulk-flour-7']);
    const history = (await req('GET', '/api/ingredients/bulk-flour-7/revisions', chef)).json<{ revision: number }[]>();
    expect(history.map((r) => r.revision).sort()).toEqual([1, 2]);
  });

  it('keeps a declaration for each of hundreds of new recipes at import, timed as the database clock says', async () => {
    const { site } = (await req('GET', '/api/book', chef)).json<Book>();
    const recipes = Array.from({ length: 520 }, (_, i) => ({
      id: `tray-bake-${i}`,
      name: `Tray bake ${i}`,
      lines: [
        { use: 'plain-flour', qty: 100, unit: 'g' as const },
        { use: 'butter', qty: 20 + (i % 50), unit: 'g' as const },
      ],
      sale: { portionG: 60 },
    }));
    const before = await count('declarations');
    const started = Date.now();
    const res = await req('POST', '/api/book/import', manager, { crumbproofBook: 1, site, ingredients: [], recipes });
    expect(res.statusCode).toBe(200);
    expect(res.json().recipes.created).toHaveLength(520);
    expect(await count('declarations')).toBeGreaterThanOrEqual(before + 520);
    const stored = await count('declarations');
    const last = (await req('GET', '/api/recipes/tray-bake-519/declaration', counter)).json<ProductDeclaration>();
    expect(await count('declarations')).toBe(stored); // served from what the import kept
    expect(last.contains.map((c) => c.allergen)).toEqual(['gluten', 'milk']);
    const at = Date.parse((last as ServedDeclaration).basis.computedAt);
    expect(at).toBeGreaterThanOrEqual(started - 1000);
    expect(at).toBeLessThanOrEqual(Date.now() + 1000);
  });

  it("carries the kitchen's address in the book, and a book without one keeps the kitchen's", async () => {
    const exported = (await req('GET', '/api/book', chef)).json<Book>();
    expect(exported.site.address).toBe('14 Tannery Row, Wexcombe (an invented address)');
    const { address: _dropped, ...withoutAddress } = exported.site;
    const res = await req('POST', '/api/book/import', manager, { ...exported, site: withoutAddress });
    expect(res.statusCode).toBe(200);
    expect(res.json().site).toBe('unchanged');
    expect((await req('GET', '/api/kitchen', chef)).json().address).toBe('14 Tannery Row, Wexcombe (an invented address)');
  });

  it('refuses a recipe that contains itself through a sub-recipe, and saves nothing', async () => {
    const sponge = (await req('GET', '/api/recipes/vanilla-sponge', chef)).json();
    const { revision, updatedAt: _u, ...body } = sponge;
    const looped = { ...body, lines: [...body.lines, { use: 'strawberry-layer-cake', qty: 10, unit: 'g' }], baseRevision: revision };
    const res = await req('PUT', '/api/recipes/vanilla-sponge', chef, looped);
    expect(res.statusCode).toBe(400);
    expect(res.json().code).toBe('recipe-cycle');
    // The recipes in order: each uses the next, and the last uses the first.
    expect(res.json().problems).toEqual([
      {
        code: 'recipe-cycle',
        recipes: ['strawberry-layer-cake', 'vanilla-sponge'],
        message:
          'Strawberry and vanilla layer cake contains itself: Strawberry and vanilla layer cake → Vanilla sponge → Strawberry and vanilla layer cake. Remove one of these lines.',
      },
    ]);
    expect((await req('GET', '/api/recipes/vanilla-sponge', chef)).json().revision).toBe(sponge.revision);
  });

  it('refuses a line that uses an unknown id', async () => {
    const res = await req('POST', '/api/recipes', chef, {
      id: 'mystery-bun',
      name: 'Mystery bun',
      lines: [{ use: 'unicorn-dust', qty: 5, unit: 'g' }],
    });
    expect(res.statusCode).toBe(400);
    expect(res.json().code).toBe('unknown-reference');
    expect(res.json().message).toMatch(/unicorn-dust/);
    expect(res.json().problems).toEqual([
      { code: 'unknown-reference', recipe: 'mystery-bun', field: 'use', line: 1, use: 'unicorn-dust', message: expect.any(String) },
    ]);
  });

  it('changing an ingredient gives every product above it a new declaration (the store follows)', async () => {
    const before = (await req('GET', '/api/recipes/shortbread/declaration', counter)).json<ProductDeclaration>();
    expect(before.claims['dairy-free'].status).toBe('fails');
    const butter = (await req('GET', '/api/ingredients/butter', chef)).json();
    const { revision, updatedAt: _u, ...body } = butter;
    const res = await req('PUT', '/api/ingredients/butter', chef, {
      ...body,
      name: 'Plant butter',
      contains: [],
      vegan: true,
      baseRevision: revision,
    });
    expect(res.statusCode).toBe(200);
    expect(res.json().revision).toBe(butter.revision + 1);
    const after = (await req('GET', '/api/recipes/shortbread/declaration', counter)).json<ProductDeclaration>();
    expect(after.contains.map((c) => c.allergen)).toEqual(['gluten']);
    expect(after.claims.vegan.status).toBe('ok');
  });

  it('lists where an ingredient is used at any depth, with paths', async () => {
    const book = (await req('GET', '/api/book', chef)).json<Book>();
    const cakeLines = book.recipes.find((r) => r.id === 'strawberry-layer-cake')!.lines.map((l) => l.use);
    const sub = cakeLines.find((id) => book.recipes.some((r) => r.id === id))!;
    const leaf = book.recipes.find((r) => r.id === sub)!.lines.find((l) => book.ingredients.some((i) => i.id === l.use))!.use;
    const res = await req('GET', `/api/ingredients/${leaf}/used-in`, chef);
    expect(res.statusCode).toBe(200);
    const cake = res.json().find((u: { id: string }) => u.id === 'strawberry-layer-cake');
    expect(cake.paths).toContainEqual(['strawberry-layer-cake', sub, leaf]);
  });

  it('keeps a recipe’s revisions with what changed in its declaration', async () => {
    const rec = (await req('GET', '/api/recipes/shortbread', chef)).json();
    const { revision, updatedAt: _u, ...body } = rec;
    const withEgg = { ...body, lines: [...body.lines, { use: 'free-range-eggs', qty: 50, unit: 'g' }], baseRevision: revision };
    const ingredients = (await req('GET', '/api/ingredients', chef)).json<{ id: string; contains?: string[] }[]>();
    const egg = ingredients.find((i) => (i.contains ?? []).includes('egg'))!;
    withEgg.lines[withEgg.lines.length - 1].use = egg.id;
    expect((await req('PUT', '/api/recipes/shortbread', chef, withEgg)).statusCode).toBe(200);
    const revs = (await req('GET', '/api/recipes/shortbread/revisions', chef)).json();
    expect(revs[0].revision).toBe(2);
    expect(revs[0].authorName).toBe('Tobiah Quill');
    expect(revs[0].diff.containsAdded.map((g: { allergen: string }) => g.allergen)).toContain('eggs');
  });

  it('previews a recipe as edited without saving it', async () => {
    const before = await count('recipe_revisions');
    const res = await req('POST', '/api/declarations/preview', chef, {
      id: 'draft-biscuit',
      name: 'Draft biscuit',
      lines: [{ use: 'flour', qty: 100, unit: 'g' }],
      sale: { portionG: 20, claims: ['gluten-free'] },
    });
    expect(res.statusCode).toBe(200);
    expect(res.json().claims['gluten-free'].status).toBe('fails');
    expect(await count('recipe_revisions')).toBe(before);
  });

  it('the manager changes how the kitchen handles an allergen, and may-contain follows on every product', async () => {
    const before = (await req('GET', '/api/recipes/vegan-brownie/declaration', counter)).json<ProductDeclaration>();
    expect(before.mayContain.map((m) => m.allergen)).not.toContain('lupin');
    const kitchen = (await req('GET', '/api/kitchen', counter)).json();
    expect(
      (await t.app.inject({ method: 'PATCH', url: '/api/kitchen', headers: { cookie: chef }, payload: { handles: [] } })).statusCode,
    ).toBe(403);
    const bad = await t.app.inject({
      method: 'PATCH',
      url: '/api/kitchen',
      headers: { cookie: manager },
      payload: { handles: [{ allergen: 'lupin', controls: 'sometimes' }] },
    });
    expect(bad.statusCode).toBe(400);
    expect(bad.json().fields[0].path).toBe('handles.0.controls');
    const res = await t.app.inject({
      method: 'PATCH',
      url: '/api/kitchen',
      headers: { cookie: manager },
      payload: { handles: [...kitchen.handles, { allergen: 'lupin', controls: 'shared-area' }] },
    });
    expect(res.statusCode).toBe(200);
    const after = (await req('GET', '/api/recipes/vegan-brownie/declaration', counter)).json<ProductDeclaration>();
    const lupin = after.mayContain.find((m) => m.allergen === 'lupin')!;
    expect(lupin.why.join(' ')).toMatch(/same area/i);
  });

  it('searches, filters and pages the ingredient library, giving the total', async () => {
    const all = await req('GET', '/api/ingredients', chef);
    const total = Number(all.headers['x-total-count']);
    expect(total).toBe(all.json().length);
    const page = await req('GET', '/api/ingredients?limit=5&offset=5', chef);
    expect(page.json()).toHaveLength(5);
    expect(page.json()[0].id).toBe(all.json()[5].id);
    expect(page.headers['x-total-count']).toBe(String(total));
    const milk = (await req('GET', '/api/ingredients?source=milk', chef)).json<{ contains?: string[] }[]>();
    expect(milk.length).toBeGreaterThan(0);
    expect(milk.every((i) => (i.contains ?? []).includes('milk'))).toBe(true);
    expect((await req('GET', '/api/ingredients?q=SPELT', chef)).json().map((i: { id: string }) => i.id)).toContain('spelt-flour');
    const bad = await req('GET', '/api/ingredients?source=unicorn', chef);
    expect(bad.statusCode).toBe(400);
    expect(bad.json().fields[0].path).toBe('source');
  });

  it('keeps declaring a product whose QUID names an ingredient no longer in it, with an error that blocks its labels', async () => {
    const rec = (await req('GET', '/api/recipes/lemon-shortbread', chef)).json();
    const { revision, updatedAt: _u, ...body } = rec;
    expect(body.sale.quid).toContain('butter');
    // 502 g go in without the butter, so the bake cannot come out at the 640 g it did with it.
    const withoutButter = {
      ...body,
      lines: body.lines.filter((l: { use: string }) => l.use !== 'butter'),
      finishedWeightG: 480,
      baseRevision: revision,
    };
    const res = await req('PUT', '/api/recipes/lemon-shortbread', chef, withoutButter);
    expect(res.statusCode).toBe(200);
    const d = (await req('GET', '/api/recipes/lemon-shortbread/declaration', counter)).json<ProductDeclaration>();
    expect(d.errors.map((e) => e.code)).toContain('quid-not-in-product');
  });

  it('front-of-house cannot write', async () => {
    expect((await req('PUT', '/api/ingredients/butter', counter, {})).statusCode).toBe(403);
    expect((await req('POST', '/api/book/import', counter, shortbread)).statusCode).toBe(403);
  });
});

describe('two writes at once (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    chef = await t.signIn('chef@example.com');
  });
  afterAll(() => t.close());

  it('never lets two recipes start using each other at the same moment', async () => {
    const base = { lines: [{ use: 'caster-sugar', qty: 10, unit: 'g' }] };
    for (const id of ['alpha-crumb', 'beta-crumb']) {
      const res = await t.app.inject({
        method: 'POST',
        url: '/api/recipes',
        headers: { cookie: chef },
        payload: { id, name: id, ...base },
      });
      expect(res.statusCode).toBe(201);
    }
    const put = (id: string, other: string) =>
      t.app.inject({
        method: 'PUT',
        url: `/api/recipes/${id}`,
        headers: { cookie: chef },
        payload: { id, name: id, lines: [...base.lines, { use: other, qty: 5, unit: 'g' }], baseRevision: 1 },
      });
    const [a, b] = await Promise.all([put('alpha-crumb', 'beta-crumb'), put('beta-crumb', 'alpha-crumb')]);
    expect([a.statusCode, b.statusCode].sort()).toEqual([200, 400]);
    expect([a, b].find((r) => r.statusCode === 400)!.json().code).toBe('recipe-cycle');
  });
});
