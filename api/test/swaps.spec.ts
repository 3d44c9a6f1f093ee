import type { Book } from '@crumbproof/shared';
import { startTestApp, type TestApp } from './support/test-app';

describe('swap check (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;
  let book: Book;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    chef = await t.signIn('chef@example.com');
    book = (await t.app.inject({ method: 'GET', url: '/api/book', headers: { cookie: chef } })).json();
  });
  afterAll(() => t.close());

  const post = (url: string, payload: object) => t.app.inject({ method: 'POST', url, payload, headers: { cookie: chef } });

  /** The dairy ingredient used directly in the most recipes, and a vegan ingredient weighable in the same units. */
  function dairyAndPlant() {
    const dairy = book.ingredients.filter((i) => (i.contains ?? []).some((c) => (typeof c === 'string' ? c : c.source) === 'milk'));
    const uses = (id: string) => book.recipes.filter((r) => r.lines.some((l) => l.use === id)).length;
    const from = dairy.sort((a, b) => uses(b.id) - uses(a.id))[0];
    const to = book.ingredients.find(
      (i) =>
        i.vegan === true &&
        i.contains !== undefined &&
        !(i.contains ?? []).some((c) => (typeof c === 'string' ? c : c.source) === 'milk') &&
        i.id !== from.id,
    )!;
    return { from, to };
  }

  it('shows, before saving, what every affected product would declare', async () => {
    const { from, to } = dairyAndPlant();
    const res = await post('/api/swaps/preview', { from: from.id, to: to.id });
    expect(res.statusCode).toBe(200);
    const preview = res.json();
    expect(preview.recipes.length).toBeGreaterThan(0);
    expect(preview.products.length).toBeGreaterThan(0);
    for (const p of preview.products) {
      expect(p.diff.claims).toHaveLength(8);
      expect(p.before.product).toBe(p.product);
    }
    const revisions = (
      await t.app.inject({ method: 'GET', url: `/api/recipes/${preview.recipes[0].id}`, headers: { cookie: chef } })
    ).json().revision;
    expect(revisions).toBe(1);
  });

  it('limits a swap to one recipe when asked, leaving the others that use the ingredient alone', async () => {
    const users = book.recipes.filter((r) => r.lines.some((l) => l.use === 'butter')).map((r) => r.id);
    expect(users.length).toBeGreaterThan(1);
    const res = await post('/api/swaps/preview', { from: 'butter', to: 'plant-spread', recipe: 'vanilla-sponge' });
    expect(res.statusCode).toBe(200);
    expect(res.json().recipes.map((r: { id: string }) => r.id)).toEqual(['vanilla-sponge']);
    const cake = res.json().products.find((p: { product: string }) => p.product === 'strawberry-layer-cake');
    // The buttercream still brings milk, so the cake stays not dairy-free, and the reason names it.
    expect(cake.after.claims['dairy-free'].status).toBe('fails');
    expect(cake.after.claims['dairy-free'].reasons.some((r: { path: string[] }) => r.path.includes('meringue-buttercream'))).toBe(true);
  });

  it('applies a swap as new revisions of the changed recipes, in one go', async () => {
    const { from, to } = dairyAndPlant();
    const preview = (await post('/api/swaps/preview', { from: from.id, to: to.id })).json();
    const res = await post('/api/swaps/apply', { from: from.id, to: to.id });
    expect(res.statusCode).toBe(200);
    expect(
      res
        .json()
        .recipes.map((r: { id: string }) => r.id)
        .sort(),
    ).toEqual(preview.recipes.map((r: { id: string }) => r.id).sort());
    for (const r of res.json().recipes) expect(r.revision).toBe(2);
    // The new revision keeps its declaration, so the history can say what the swap changed.
    const changed = res.json().recipes[0].id;
    const history = (await t.app.inject({ method: 'GET', url: `/api/recipes/${changed}/revisions`, headers: { cookie: chef } })).json();
    expect(history[0].note).toMatch(/^Swapped /);
    expect(history[0].declaration).not.toBeNull();
    expect(history[0].diff).not.toBeNull();
    // A product that asked for the replaced ingredient's percentage now asks for the replacement's.
    const quidOwner = book.recipes.find((r) => r.sale?.quid?.includes(from.id) && r.lines.some((l) => l.use === from.id));
    expect(quidOwner).toBeDefined();
    const d = await t.app.inject({ method: 'GET', url: `/api/recipes/${quidOwner!.id}/declaration`, headers: { cookie: chef } });
    expect(d.statusCode).toBe(200);
    expect(d.json().quid.map((q: { ingredient: string }) => q.ingredient)).toContain(to.id);
    const again = await post('/api/swaps/preview', { from: from.id, to: to.id });
    expect(again.statusCode).toBe(400);
    expect(again.json().message).toMatch(/nothing to swap/);
  });

  it.each([
    { body: { from: 'no-such-thing', to: 'butter' }, status: 404, message: /no ingredient or recipe 'no-such-thing'/ },
    { body: { from: 'x' }, status: 400, message: /to/ },
  ])('refuses $body with $status', async ({ body, status, message }) => {
    const res = await post('/api/swaps/preview', body);
    expect(res.statusCode).toBe(status);
    expect(res.json().message).toMatch(message);
  });
});
