import type { KitchenRole, SwapPreview, SwapProduct } from '@crumbproof/shared';
import { startChainApp, type ChainApp } from './support/chain-kitchens';
import type { TestApp } from './support/test-app';

/**
 * The swap check over several kitchens sharing one recipe book (tests/fixtures/chain-kitchens.book.json):
 * a swap of a shared ingredient lists every product it reaches at every kitchen, each declared as
 * that kitchen makes it, and is applied once for all of them.
 */
describe('swap check across kitchens (real MariaDB)', () => {
  let chain: ChainApp;
  let t: TestApp;
  let manager: string;
  let chef: string;
  /** The kitchens' numbers by their id in the book. */
  let kitchen: Record<string, number>;

  beforeAll(async () => {
    chain = await startChainApp();
    ({ t, manager, chef, kitchen } = chain);
  });
  afterAll(() => t?.close());

  const post = (cookie: string, at: string, url: string, payload: object) => chain.at(at, 'POST', url, cookie, payload);
  const get = (cookie: string, at: string, url: string) => chain.at(at, 'GET', url, cookie);
  const entry = (p: SwapPreview, at: string, product: string): SwapProduct | undefined =>
    p.products.find((x) => x.kitchen.code === at && x.product === product);
  const names = (groups: { label: string }[]) => groups.map((g) => g.label);

  it('gives the importing manager the new kitchens, and the chef the first one only', async () => {
    expect(Object.keys(kitchen).sort()).toEqual(['bench', 'corner', 'market']);
    const me = (await t.app.inject({ method: 'GET', url: '/api/me', headers: { cookie: chef } })).json<{ kitchens: KitchenRole[] }>();
    expect(me.kitchens.map((k) => k.code)).toEqual(['bench']);
  });

  it('a shared-ingredient change lists products in every site it touches, each with its own before and after', async () => {
    const res = await post(manager, 'bench', '/api/swaps/preview', { from: 'butter', to: 'plant-spread' });
    expect(res.statusCode).toBe(200);
    const preview = res.json<SwapPreview>();
    expect(preview.recipes.map((r) => r.id).sort()).toEqual(['sesame-snap', 'shortbread']);
    // The request's kitchen first, then the others in the order they were set up; each with its count.
    expect(preview.kitchens).toEqual([
      { id: kitchen.bench, code: 'bench', name: 'Test bench', regime: 'EU', products: 2 },
      { id: kitchen.corner, code: 'corner', name: 'Corner Shop', regime: 'US', products: 1 },
      { id: kitchen.market, code: 'market', name: 'Market Stall', regime: 'UK', products: 1 },
    ]);
    expect(preview.products.map((p) => `${p.kitchen.code} ${p.product}`)).toEqual([
      'bench sesame-snap',
      'bench shortbread',
      'corner shortbread',
      'market shortbread',
    ]);
    const bench = entry(preview, 'bench', 'shortbread')!;
    const corner = entry(preview, 'corner', 'shortbread')!;
    const market = entry(preview, 'market', 'shortbread')!;
    expect(bench.kitchen).toEqual({ id: kitchen.bench, code: 'bench', name: 'Test bench', regime: 'EU' });
    // Every kitchen loses the milk of the butter.
    for (const p of [bench, corner, market]) {
      expect(p.before.contains.some((g) => g.label.toLowerCase().includes('milk'))).toBe(true);
      expect(p.after.contains.some((g) => g.label.toLowerCase().includes('milk'))).toBe(false);
    }
    // Each kitchen's handling and own ingredients give it its own declaration: the bench shares
    // equipment with sesame, the corner shop keeps sesame apart and makes it with its own flour
    // (may contain soy), the market stall made it with its farm butter (may contain egg).
    expect(names(bench.after.mayContain)).toEqual([expect.stringMatching(/sesame/i)]);
    expect(names(corner.before.mayContain)).toEqual([expect.stringMatching(/soy/i)]);
    expect(names(corner.after.mayContain)).toEqual([expect.stringMatching(/soy/i)]);
    expect(names(market.before.mayContain)).toEqual([expect.stringMatching(/egg/i)]);
    expect(market.after.mayContain).toEqual([]);
    expect(bench.after).not.toEqual(corner.after);
    expect(corner.after.ingredientsText).toMatch(/Stone-ground wheat flour/);
    expect(bench.after.ingredientsText).toMatch(/Plain wheat flour/);
    // The market stall's farm butter stood in for butter; after the swap the line names plant spread, which it makes as the book says.
    expect(market.standIns.before.map((s) => s.withName)).toEqual(['Farm butter']);
    expect(market.standIns.after).toEqual([]);
    expect(market.diff.changed).toBe(true);
    expect(market.after.claims.vegan.status).toBe('ok');
  });

  it('leaves out a kitchen whose own ingredient stands in for both the ingredient swapped out and its replacement', async () => {
    const preview = (await post(manager, 'corner', '/api/swaps/preview', { from: 'butter', to: 'cultured-butter' })).json<SwapPreview>();
    expect(preview.kitchens.map((k) => [k.code, k.products])).toEqual([
      ['corner', 1],
      ['bench', 2],
      ['market', 0],
    ]);
    expect(preview.products.some((p) => p.kitchen.code === 'market')).toBe(false);
  });

  it('shows a chef every kitchen the swap reaches, those they have no role in too', async () => {
    const res = await post(chef, 'bench', '/api/swaps/preview', { from: 'butter', to: 'plant-spread' });
    expect(res.statusCode).toBe(200);
    expect(new Set(res.json<SwapPreview>().products.map((p) => p.kitchen.code))).toEqual(new Set(['bench', 'corner', 'market']));
    // A kitchen the chef has no role in cannot be asked for.
    expect((await post(chef, 'corner', '/api/swaps/preview', { from: 'butter', to: 'plant-spread' })).statusCode).toBe(403);
  });

  it('refuses to swap a kitchen’s own ingredient, naming the shared one it stands in for', async () => {
    const res = await post(manager, 'corner', '/api/swaps/preview', { from: 'corner-flour', to: 'flour' });
    expect(res.statusCode).toBe(400);
    expect(res.json().message).toMatch(/Corner Shop's own ingredient, standing in there for Plain wheat flour/);
  });

  it('applies the swap once to the shared recipes, and every kitchen then declares what its preview said', async () => {
    const preview = (await post(manager, 'corner', '/api/swaps/preview', { from: 'butter', to: 'plant-spread' })).json<SwapPreview>();
    const res = await post(manager, 'corner', '/api/swaps/apply', { from: 'butter', to: 'plant-spread' });
    expect(res.statusCode).toBe(200);
    expect(res.json<{ recipes: { id: string }[] }>().recipes.sort((a, b) => a.id.localeCompare(b.id))).toEqual([
      { id: 'sesame-snap', revision: 2 },
      { id: 'shortbread', revision: 2 },
    ]);
    // The shared recipe names the shared ingredients: the corner shop's substitution is not written into the book.
    const book = (await get(manager, 'bench', '/api/book')).json<{ recipes: { id: string; lines: { use: string }[] }[] }>();
    expect(book.recipes.find((r) => r.id === 'shortbread')!.lines.map((l) => l.use)).toEqual(['flour', 'plant-spread', 'sugar']);
    for (const at of ['bench', 'corner', 'market']) {
      const served = (await get(manager, at, '/api/recipes/shortbread/declaration')).json();
      const expected = entry(preview, at, 'shortbread')!.after;
      expect({ at, contains: served.contains, mayContain: served.mayContain, text: served.ingredientsText }).toEqual({
        at,
        contains: expected.contains,
        mayContain: expected.mayContain,
        text: expected.ingredientsText,
      });
    }
  });
});
