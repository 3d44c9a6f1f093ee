import type { CounterProductsView, PreviewDeclaration, ServedDeclaration } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { Clock } from '../src/common/clock';
import { DAY, isoDay, uploadSpecification } from './support/specifications';
import { startTestApp, type TestApp } from './support/test-app';

/** Lemon shortbread's leaf ingredients in the demo book, as its claims are checked against them. */
const LEAVES = ['plain-flour', 'butter', 'caster-sugar', 'dark-chocolate', 'candied-peel', 'sea-salt'];

/** What a claim that holds stands on: worked out as the declaration is served, from the kitchen's date. */
describe('the basis of a product’s claims (real MariaDB, the clock moved by the test)', () => {
  let t: TestApp;
  let chef: string;
  let counter: string;
  let clock: Clock;

  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    [chef, counter] = await Promise.all(['chef@example.com', 'counter@example.com'].map((e) => t.signIn(e)));
    clock = t.app.get(Clock);
  });
  afterAll(() => t.close());
  afterEach(() => clock.reset());

  const get = (url: string, cookie = chef) => t.app.inject({ method: 'GET', url, headers: { cookie } });
  const served = async (product: string) => {
    const res = await get(`/api/recipes/${product}/declaration`, counter);
    expect(res.statusCode).toBe(200);
    return res.json<ServedDeclaration>();
  };
  const upload = (code: string, reviewBy: string) => uploadSpecification(t, chef, code, { reviewBy });
  const kept = async () =>
    Number((await t.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM declarations', { type: QueryTypes.SELECT }))[0].n);

  it('counts every leaf checked and names those resting on a supplier statement alone, without or past a specification', async () => {
    const first = await served('lemon-shortbread');
    expect(first.basis.items.filter((i) => i.kind === 'ingredient').map((i) => i.id)).toEqual(LEAVES);
    expect(first.claimBasis?.checked).toBe(LEAVES.length);
    expect(first.claimBasis?.statementOnly.map((l) => [l.id, l.why])).toEqual(LEAVES.map((id) => [id, 'no-specification']));
    expect(first.claimBasis?.statementOnly.find((l) => l.id === 'caster-sugar')?.name).toBe('Caster sugar');

    // Butter's specification is current for a year; caster sugar's is due for review today (not yet overdue).
    await upload('butter', isoDay(365));
    await upload('caster-sugar', isoDay(0));
    const declarations = await kept();
    const today = await served('lemon-shortbread');
    expect(today.claimBasis?.checked).toBe(LEAVES.length);
    expect(today.claimBasis?.statementOnly.map((l) => l.id)).toEqual(LEAVES.filter((id) => id !== 'butter' && id !== 'caster-sugar'));

    // Three days on, caster sugar's specification is past its review-by date: it rests on the statement again.
    clock.advance(3 * DAY);
    const later = await served('lemon-shortbread');
    expect(later.claimBasis?.statementOnly.find((l) => l.id === 'caster-sugar')).toEqual({
      id: 'caster-sugar',
      name: 'Caster sugar',
      why: 'review-overdue',
      reviewBy: isoDay(0),
    });
    expect(later.claimBasis?.statementOnly.some((l) => l.id === 'butter')).toBe(false);
    // The same kept declaration served both days: the basis is never part of it.
    const strip = ({ claimBasis: _b, reviewWarnings: _w, ...d }: ServedDeclaration) => d;
    expect(strip(later)).toEqual(strip(today));
    expect(await kept()).toBe(declarations);

    // The counter's feed serves the same basis for every product, from one request.
    const feed = (await get('/api/counter/products', counter)).json<CounterProductsView>();
    const shortbread = feed.products.find((p) => p.id === 'lemon-shortbread')!;
    expect(shortbread.declaration.claimBasis).toEqual(later.claimBasis);
    const brownie = feed.products.find((p) => p.id === 'vegan-brownie')!;
    expect(brownie.declaration.claimBasis?.checked).toBe(10);
    expect(brownie.declaration.claimBasis?.statementOnly.find((l) => l.id === 'caster-sugar')?.why).toBe('review-overdue');

    // A new specification of caster sugar counts at the next read: nothing stale is served.
    await upload('caster-sugar', isoDay(400));
    const renewed = await served('lemon-shortbread');
    expect(renewed.claimBasis?.statementOnly.some((l) => l.id === 'caster-sugar')).toBe(false);
    expect(renewed.claimBasis?.statementOnly).toHaveLength(LEAVES.length - 2);
  });

  it('gives the recipe as edited, before it is saved, the basis its claims would have today', async () => {
    const book = (await get('/api/book')).json<{ recipes: { id: string; lines: unknown[] }[] }>();
    const recipe = book.recipes.find((r) => r.id === 'lemon-shortbread')!;
    const res = await t.app.inject({
      method: 'POST',
      url: '/api/declarations/preview',
      payload: recipe,
      headers: { cookie: chef },
    });
    expect(res.statusCode).toBe(200);
    const preview = res.json<PreviewDeclaration>();
    expect(preview.claimBasis).toEqual((await served('lemon-shortbread')).claimBasis);

    // One line fewer (the candied peel): one leaf fewer checked.
    const withoutPeel = { ...recipe, lines: (recipe.lines as { use: string }[]).filter((l) => l.use !== 'candied-peel') };
    const fewer = (
      await t.app.inject({ method: 'POST', url: '/api/declarations/preview', payload: withoutPeel, headers: { cookie: chef } })
    ).json<PreviewDeclaration>();
    expect(fewer.claimBasis.checked).toBe(preview.claimBasis.checked - 1);
    expect(fewer.claimBasis.statementOnly.some((l) => l.id === 'candied-peel')).toBe(false);
  });
});
