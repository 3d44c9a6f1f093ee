import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BookFile, KitchenMakes, Me, ServedDeclaration } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { tableChecksums } from './fixtures/table-checksums';
import { startTestApp, type TestApp } from './support/test-app';
import { addPerson } from './support/two-kitchens';

const fixture = (name: string): unknown => JSON.parse(readFileSync(join(__dirname, '..', '..', 'tests', 'fixtures', name), 'utf8'));
const twoKitchens = fixture('two-kitchens.book.json') as BookFile;
const PASSWORD = 'two-kitchens-pass-17';

/**
 * Two kitchens over one recipe book (tests/fixtures/two-kitchens.book.json): the bench (EU rules,
 * sesame on shared equipment) and the corner shop (US rules, sesame kept apart, its own flour from
 * next door standing in for the shared one, and selling the shortbread only).
 */
describe('several kitchens over one recipe book (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;
  let benchOnly: string;
  const kitchen: Record<'bench' | 'corner', number> = { bench: 0, corner: 0 };

  const call = (method: 'GET' | 'POST' | 'PUT' | 'PATCH', url: string, cookie: string, at?: number, payload?: unknown) =>
    t.app.inject({
      method,
      url,
      headers: { cookie, ...(at !== undefined ? { 'x-crumbproof-kitchen': String(at) } : {}) },
      ...(payload !== undefined ? { payload: payload as object } : {}),
    });
  const declared = async (code: string, at: number) => {
    const res = await call('GET', `/api/recipes/${code}/declaration`, manager, at);
    expect(res.statusCode).toBe(200);
    return res.json<ServedDeclaration>();
  };
  beforeAll(async () => {
    t = await startTestApp();
    await addPerson(t, 'lead@example.com', 'manager', PASSWORD);
    manager = await t.signIn('lead@example.com', PASSWORD);
    const imported = await call('POST', '/api/book/import', manager, undefined, twoKitchens);
    expect(imported.statusCode).toBe(200);
    expect(imported.json().kitchens).toEqual({ bench: 'created', corner: 'created' });
    const sites = await t.sequelize.query<{ id: number; code: string }>('SELECT id, code FROM sites', { type: QueryTypes.SELECT });
    for (const s of sites) kitchen[s.code as 'bench' | 'corner'] = s.id;
    await addPerson(t, 'bench-counter@example.com', 'front-of-house', PASSWORD, 'bench');
    benchOnly = await t.signIn('bench-counter@example.com', PASSWORD);
  });
  afterAll(() => t.close());

  it('makes the manager who set the kitchens up a manager at both, and asks which kitchen a request is for', async () => {
    const me = (await call('GET', '/api/me', manager)).json<Me>();
    expect(me.kitchen).toBeNull();
    expect(me.kitchens).toEqual([
      { id: kitchen.bench, code: 'bench', name: 'Test bench', role: 'manager' },
      { id: kitchen.corner, code: 'corner', name: 'Corner Shop', role: 'manager' },
    ]);
    const unnamed = await call('GET', '/api/recipes', manager);
    expect(unnamed.statusCode).toBe(400);
    expect(unnamed.json()).toMatchObject({
      code: 'kitchen-required',
      message: 'You work in 2 kitchens (Test bench, Corner Shop): choose the one this is for.',
    });
    expect((await call('GET', '/api/me', manager, kitchen.corner)).json<Me>()).toMatchObject({ kitchen: kitchen.corner, role: 'manager' });
    // Where a header cannot be sent, the query names the kitchen, beside a route's own query.
    const byQuery = await call('GET', `/api/ingredients?q=flour&kitchen=${kitchen.corner}`, manager);
    expect(byQuery.statusCode).toBe(200);
    expect(byQuery.json<Array<{ id: string }>>().map((i) => i.id)).toContain('corner-flour');
  });

  it('declares one recipe differently at each kitchen, by its handling, its regime and its own flour', async () => {
    const bench = await declared('shortbread', kitchen.bench);
    const corner = await declared('shortbread', kitchen.corner);
    expect(bench.regime).toBe('EU');
    expect(corner.regime).toBe('US');
    // Sesame is handled on shared equipment at the bench and kept apart at the corner shop.
    expect(bench.mayContain.map((m) => m.allergen)).toContain('sesame');
    expect(corner.mayContain.map((m) => m.allergen)).not.toContain('sesame');
    // The corner shop's flour from next door may contain soy; the shared flour may not.
    // US rules name the group soybeans (Food Allergen Labeling and Consumer Protection Act of 2004, section 201(qq)).
    expect(corner.mayContain.map((m) => m.allergen)).toContain('soybeans');
    expect(bench.mayContain.map((m) => m.allergen)).not.toContain('soy');
    // Each regime's own list: the EU declares cereals containing gluten (Regulation (EU) No 1169/2011,
    // Annex II point 1), the US wheat (Food Allergen Labeling and Consumer Protection Act of 2004, section 201(qq)).
    expect(bench.contains.map((c) => c.allergen).sort()).toEqual(['gluten', 'milk']);
    expect(corner.contains.map((c) => c.allergen).sort()).toEqual(['milk', 'wheat']);
    // Each says which kitchen it answers for, and what stood in for what there.
    expect(bench.basis.kitchen).toEqual({ id: kitchen.bench, name: 'Test bench' });
    expect(corner.basis.kitchen).toEqual({ id: kitchen.corner, name: 'Corner Shop' });
    expect(bench.basis.standIns).toBeUndefined();
    expect(corner.basis.standIns).toEqual([
      expect.objectContaining({ recipe: 'shortbread', replaces: 'flour', with: 'corner-flour', note: 'Milled next door' }),
    ]);
    // Each is kept apart: two stored declarations of the one recipe revision.
    const [{ n }] = await t.sequelize.query<{ n: number }>(
      "SELECT COUNT(DISTINCT d.input_hash) AS n FROM declarations d JOIN recipes r ON r.id = d.recipe_id WHERE r.code = 'shortbread'",
      { type: QueryTypes.SELECT },
    );
    expect(Number(n)).toBe(2);
  });

  it('lists at each kitchen only the products it sells', async () => {
    const codes = async (at: number) =>
      (await call('GET', '/api/declarations', manager, at)).json<ServedDeclaration[]>().map((d) => d.product);
    expect((await call('GET', '/api/declarations', manager, kitchen.corner)).statusCode).toBe(200);
    expect(await codes(kitchen.bench)).toHaveLength(2);
    expect(await codes(kitchen.corner)).toHaveLength(1);
  });

  it('refuses a person every request for a kitchen they have no role at, and changes nothing', async () => {
    expect((await call('GET', '/api/recipes/shortbread/declaration', benchOnly, kitchen.bench)).statusCode).toBe(200);
    // Their only kitchen is taken without naming it.
    expect((await call('GET', '/api/recipes/shortbread/declaration', benchOnly)).statusCode).toBe(200);
    const before = await tableChecksums(t.sequelize);
    for (const [method, url] of [
      ['GET', '/api/recipes/shortbread/declaration'],
      ['GET', '/api/declarations'],
      ['GET', '/api/kitchen'],
      ['GET', '/api/counter/questions'],
    ] as const) {
      const res = await call(method, url, benchOnly, kitchen.corner);
      expect({ url, status: res.statusCode }).toEqual({ url, status: 403 });
      expect(res.json().message).toMatch(/no role at that kitchen/);
    }
    // A kitchen that is not there is refused alike, never taken for another.
    expect((await call('GET', '/api/kitchen', benchOnly, 999999)).statusCode).toBe(403);
    expect((await call('GET', '/api/kitchen', benchOnly, Number.NaN)).statusCode).toBe(403);
    expect(await tableChecksums(t.sequelize)).toEqual(before);
  });

  it('exports the whole book with both kitchens, as it was imported', async () => {
    const exported = (await call('GET', '/api/book', manager, kitchen.bench)).json<BookFile>();
    expect(exported.site).toBeUndefined();
    expect(exported.sites).toEqual(twoKitchens.sites);
    expect(exported.ingredients.find((i) => i.id === 'corner-flour')?.onlyAt).toBe('corner');
    const again = await call('POST', '/api/book/import', manager, kitchen.bench, exported);
    expect(again.statusCode).toBe(200);
    expect(again.json()).toMatchObject({
      kitchens: { bench: 'unchanged', corner: 'unchanged' },
      ingredients: { created: [], revised: [] },
      recipes: { created: [], revised: [] },
    });
  });

  it("keeps a kitchen's own ingredient its own when an editor saves it, from either kitchen", async () => {
    const got = await call('GET', '/api/ingredients/corner-flour', manager, kitchen.corner);
    expect(got.statusCode).toBe(200);
    const { revision, updatedAt: _at, ...body } = got.json();
    const saved = await call('PUT', '/api/ingredients/corner-flour', manager, kitchen.bench, {
      ...body,
      name: 'Corner flour, stone-milled',
      baseRevision: revision,
    });
    expect(saved.json()).toMatchObject({ name: 'Corner flour, stone-milled' });
    expect(saved.statusCode).toBe(200);
    const exported = (await call('GET', '/api/book', manager, kitchen.corner)).json<BookFile>();
    expect(exported.ingredients.find((i) => i.id === 'corner-flour')).toMatchObject({
      name: 'Corner flour, stone-milled',
      onlyAt: 'corner',
    });
    // Still only the corner shop's: the bench's shortbread is made with the shared flour.
    expect((await declared('shortbread', kitchen.bench)).mayContain.map((m) => m.allergen)).not.toContain('soy');
  });

  it('refuses a recipe line naming a kitchen’s own ingredient, and a book of one kitchen given as site, and saves nothing', async () => {
    const before = await tableChecksums(t.sequelize);
    const recipe = (await call('GET', '/api/recipes/shortbread', manager, kitchen.bench)).json();
    const { revision, updatedAt: _at, ...body } = recipe;
    const own = await call('PUT', '/api/recipes/shortbread', manager, kitchen.corner, {
      ...body,
      lines: body.lines.map((l: { use: string }) => (l.use === 'flour' ? { ...l, use: 'corner-flour' } : l)),
      baseRevision: revision,
    });
    expect(own.statusCode).toBe(400);
    expect(own.json().message).toMatch(/corner-flour/);
    const { sites: _sites, ...items } = twoKitchens;
    const asSite = await call('POST', '/api/book/import', manager, kitchen.bench, {
      ...items,
      ingredients: items.ingredients.filter((i) => i.onlyAt === undefined),
      site: { name: 'One kitchen', regime: 'UK', handles: [] },
    });
    expect(asSite.statusCode).toBe(400);
    expect(asSite.json().message).toMatch(/This installation has 2 kitchens \(bench, corner\)/);
    expect(await tableChecksums(t.sequelize)).toEqual(before);
  });

  it("gives each kitchen's managers its own audit trail, with the changes to the shared book made anywhere", async () => {
    const renamed = await call('PATCH', '/api/kitchen', manager, kitchen.corner, { name: 'Corner Shop on the Square' });
    expect(renamed.statusCode).toBe(200);
    const trail = async (at: number, action: string) =>
      (await call('GET', `/api/audit?action=${action}`, manager, at)).json<{ items: Array<{ id: string; summary: string }> }>().items;
    const atCorner = await trail(kitchen.corner, 'kitchen.updated');
    expect(atCorner).toHaveLength(1);
    expect(await trail(kitchen.bench, 'kitchen.updated')).toEqual([]);
    // The corner's event is not the bench's to read, even by its number.
    expect((await call('GET', `/api/audit/${atCorner[0].id}`, manager, kitchen.bench)).statusCode).toBe(404);
    expect((await call('GET', `/api/audit/${atCorner[0].id}`, manager, kitchen.corner)).statusCode).toBe(200);
    // The corner flour was saved at the bench: a change to the shared book, on both kitchens' trails.
    for (const at of [kitchen.bench, kitchen.corner])
      expect((await trail(at, 'ingredient.saved')).map((e) => e.summary)).toEqual([expect.stringMatching(/corner-flour/)]);
  });

  it('says what each kitchen makes differently: its own ingredient standing in, and what it sells', async () => {
    const makes = async (at: number) => {
      const res = await call('GET', '/api/book/kitchen', manager, at);
      expect(res.statusCode).toBe(200);
      return res.json<KitchenMakes>();
    };
    // The book as it stands (earlier tests rename the corner and edit its flour).
    const book = (await call('GET', '/api/book', manager, kitchen.corner)).json<BookFile>();
    const flourLines = book.recipes.flatMap((r) => r.lines).filter((l) => l.use === 'flour').length;
    expect(flourLines).toBeGreaterThan(0);
    const name = (id: string) => [...book.ingredients, ...book.recipes].find((i) => i.id === id)!.name;
    const site = (code: string) => book.sites!.find((s) => s.id === code)!.name;
    expect(await makes(kitchen.corner)).toEqual({
      code: 'corner',
      name: site('corner'),
      substitutions: [
        {
          replaces: { id: 'flour', name: name('flour') },
          with: expect.objectContaining({ id: 'corner-flour', name: name('corner-flour') }),
          note: 'Milled next door',
          lines: flourLines,
        },
      ],
      sells: [{ id: 'shortbread', name: name('shortbread') }],
      notSold: [{ id: 'sesame-snap', name: name('sesame-snap') }],
    });
    expect(await makes(kitchen.bench)).toEqual({ code: 'bench', name: site('bench'), substitutions: [], sells: null, notSold: [] });
    // Front of house reads the counter, not how the kitchen is set up.
    expect((await call('GET', '/api/book/kitchen', benchOnly, kitchen.bench)).statusCode).toBe(403);
  });

  it('puts a sign-in on the trail of the kitchens its person works at, and an unknown address’s on every kitchen’s', async () => {
    await t.signIn('bench-counter@example.com', PASSWORD);
    const refused = async (email: string) =>
      expect((await t.req('POST', '/api/auth/sign-in', undefined, { email, password: 'not-the-password-1' })).statusCode).toBe(401);
    await refused('bench-counter@example.com');
    await refused('nobody-here@example.com');
    const [{ id: counterId }] = await t.sequelize.query<{ id: number }>("SELECT id FROM users WHERE email = 'bench-counter@example.com'", {
      type: QueryTypes.SELECT,
    });
    const count = async (at: number, query: string) =>
      (await call('GET', `/api/audit?${query}`, manager, at)).json<{ items: unknown[] }>().items.length;
    const signedIn = `action=sign-in.succeeded&record=${counterId}`;
    expect(await count(kitchen.bench, signedIn)).toBeGreaterThan(0);
    expect(await count(kitchen.corner, signedIn)).toBe(0);
    const failed = (email: string) => `action=sign-in.failed&record=${encodeURIComponent(email)}`;
    expect(await count(kitchen.bench, failed('bench-counter@example.com'))).toBe(1);
    expect(await count(kitchen.corner, failed('bench-counter@example.com'))).toBe(0);
    for (const at of [kitchen.bench, kitchen.corner]) expect(await count(at, failed('nobody-here@example.com'))).toBe(1);
  });

  it('puts a new product on sale at the kitchen it is created at, adding it to that kitchen’s list', async () => {
    const { revision: _r, updatedAt: _at, ...shortbread } = (await call('GET', '/api/recipes/shortbread', manager, kitchen.corner)).json();
    const created = await call('POST', '/api/recipes', manager, kitchen.corner, {
      ...shortbread,
      id: 'corner-rounds',
      name: 'Corner rounds',
    });
    expect(created.statusCode).toBe(201);
    const sold = async (at: number) =>
      (await call('GET', '/api/declarations', manager, at)).json<ServedDeclaration[]>().map((d) => d.product);
    expect(await sold(kitchen.corner)).toContain('corner-rounds');
    // The bench sells every product for sale: it has no list of its own.
    expect(await sold(kitchen.bench)).toContain('corner-rounds');
    const exported = (await call('GET', '/api/book', manager, kitchen.corner)).json<BookFile>();
    expect(exported.sites?.find((s) => s.id === 'corner')?.sells).toEqual(['shortbread', 'corner-rounds']);
  });
});
