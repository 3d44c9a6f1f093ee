import type { ApprovalsView } from '@crumbproof/shared';
import { startChainApp, type ChainApp } from './support/chain-kitchens';

/**
 * Change control over several kitchens sharing one recipe book (tests/fixtures/chain-kitchens.book.json),
 * on the real MariaDB: a change to a shared ingredient sends each product to approval at every
 * kitchen whose declaration of it changes, each against that kitchen's own approval; an approval
 * at one kitchen approves nothing at another, and labels print only where the product is approved.
 * The steps run in order and build on each other.
 */
let chain: ChainApp;
/** The approval-needed mails queued before the change to the shared ingredient (the import's). */
let mailedBefore = 0;

beforeAll(async () => {
  chain = await startChainApp();
});
afterAll(() => chain?.t.close());

const at: ChainApp['at'] = (...args) => chain.at(...args);
const approvals = async (where: string) => (await at(where, 'GET', '/api/approvals', chain.manager)).json<ApprovalsView>();
const pendingAt = async (where: string) => (await approvals(where)).pending.map((p) => p.product).sort();
const approve = (where: string, products: { product: string; inputHash: string }[]) =>
  at(where, 'POST', '/api/approvals', chain.manager, { products: products.map(({ product, inputHash }) => ({ product, inputHash })) });
const print = (where: string, product: string) =>
  at(where, 'POST', '/api/labels/runs', chain.manager, {
    template: 'ticket',
    items: [{ product, quantity: 2 }],
    productionDate: '2026-12-03',
  });
const declared = async (where: string, product: string) =>
  (await at(where, 'GET', `/api/recipes/${product}/declaration`, chain.manager)).json();
const labels = (groups: { label: string }[]) => groups.map((g) => g.label.toLowerCase()).join(', ');
const outbox = async () =>
  (
    await chain.t.sequelize.query<{ kind: string; recipients: unknown; subject: string; text: string }>(
      "SELECT kind, recipients, subject, text FROM mail_outbox WHERE kind = 'approval-needed' ORDER BY id",
      { type: 'SELECT' as never },
    )
  ).map((m) => ({ ...m, recipients: typeof m.recipients === 'string' ? (JSON.parse(m.recipients) as string[]) : m.recipients }));

it('starts every kitchen with its products never approved, and approves each kitchen apart', async () => {
  expect(await pendingAt('bench')).toEqual(['sesame-snap', 'shortbread']);
  expect(await pendingAt('corner')).toEqual(['shortbread']);
  expect(await pendingAt('market')).toEqual(['shortbread']);
  const bench = await approvals('bench');
  expect(bench.kitchen).toEqual({ id: chain.kitchen.bench, code: 'bench', name: 'Test bench' });
  expect(bench.kitchens).toBe(3);
  // The manager works at all three: what waits at the others is counted; the chef works at the bench only.
  expect(bench.elsewhere).toEqual([
    { kitchen: { id: chain.kitchen.corner, code: 'corner', name: 'Corner Shop' }, waiting: 1 },
    { kitchen: { id: chain.kitchen.market, code: 'market', name: 'Market Stall' }, waiting: 1 },
  ]);
  expect((await at('bench', 'GET', '/api/approvals', chain.chef)).json<ApprovalsView>().elsewhere).toEqual([]);
  // Approving at the bench approves nothing at the corner shop.
  expect((await approve('bench', bench.pending)).statusCode).toBe(201);
  expect(await pendingAt('bench')).toEqual([]);
  expect(await pendingAt('corner')).toEqual(['shortbread']);
  for (const where of ['corner', 'market']) expect((await approve(where, (await approvals(where)).pending)).statusCode).toBe(201);
  for (const where of ['bench', 'corner', 'market']) expect(await pendingAt(where)).toEqual([]);
});

it('sends a change to a shared ingredient to approval at every kitchen it changes, each against its own', async () => {
  mailedBefore = (await outbox()).length;
  const { updatedAt: _updatedAt, revision, ...butter } = (await at('bench', 'GET', '/api/ingredients/butter', chain.chef)).json();
  const saved = await at('bench', 'PUT', '/api/ingredients/butter', chain.chef, {
    ...butter,
    mayContain: ['almond'],
    baseRevision: revision,
  });
  expect(saved.statusCode).toBe(200);

  expect(await pendingAt('bench')).toEqual(['sesame-snap', 'shortbread']);
  expect(await pendingAt('corner')).toEqual(['shortbread']);
  expect((await approvals('bench')).elsewhere.map((e) => [e.kitchen.code, e.waiting])).toEqual([['corner', 1]]);
  // The market stall makes its shortbread with its own farm butter: the shared butter's change does not reach it.
  expect(await pendingAt('market')).toEqual([]);
  expect(labels((await declared('market', 'shortbread')).mayContain)).not.toMatch(/almond|nut/);

  const bench = (await approvals('bench')).pending.find((p) => p.product === 'shortbread')!;
  const corner = (await approvals('corner')).pending.find((p) => p.product === 'shortbread')!;
  for (const p of [bench, corner]) {
    expect(p.reason).toBe('changed');
    expect(p.words.join(' ')).toMatch(/Now may contain .*almond/i);
    expect(p.causes.map((c) => [c.action, c.items.map((i) => i.id)])).toEqual([['ingredient.saved', ['butter']]]);
  }
  // Each kitchen's declaration is its own: the bench shares equipment with sesame, the corner shop's flour may contain soy.
  expect(bench.inputHash).not.toBe(corner.inputHash);
  expect(labels((await declared('bench', 'shortbread')).mayContain)).toMatch(/sesame/);
  expect(labels((await declared('bench', 'shortbread')).mayContain)).not.toMatch(/soy/);
  expect(labels((await declared('corner', 'shortbread')).mayContain)).toMatch(/soy/);
  expect(labels((await declared('corner', 'shortbread')).mayContain)).not.toMatch(/sesame/);
});

it('mails each kitchen’s managers the products waiting there, naming the kitchen', async () => {
  const mails = (await outbox()).slice(mailedBefore);
  expect(mails.map((m) => [m.subject, m.recipients])).toEqual([
    ['2 products wait for your approval at Test bench', ['manager@chain.example']],
    ['Shortbread waits for your approval at Corner Shop', ['manager@chain.example']],
  ]);
  expect(mails[1].text).toContain('Cas Chef saved a change that reaches this product at Corner Shop');
});

it('approves at one kitchen only, refuses another kitchen’s declaration, and prints only where approved', async () => {
  const bench = (await approvals('bench')).pending.find((p) => p.product === 'shortbread')!;
  // The bench's declaration is not the corner shop's: approving it there is refused, nothing saved.
  const wrong = await approve('corner', [{ product: 'shortbread', inputHash: bench.inputHash }]);
  expect(wrong.statusCode).toBe(409);
  expect(wrong.json().message).toMatch(/not one of Shortbread's/);
  expect((await approve('bench', [bench])).statusCode).toBe(201);
  expect(await pendingAt('bench')).toEqual(['sesame-snap']);
  expect(await pendingAt('corner')).toEqual(['shortbread']);

  const printed = await print('bench', 'shortbread');
  expect([printed.statusCode, printed.json().message]).toEqual([201, undefined]);
  const refused = await print('corner', 'shortbread');
  expect(refused.statusCode).toBe(409);
  expect(refused.json().code).toBe('approval-needed');
  expect((await print('market', 'shortbread')).statusCode).toBe(201);

  const corner = (await approvals('corner')).pending[0];
  expect((await approve('corner', [corner])).statusCode).toBe(201);
  expect((await print('corner', 'shortbread')).statusCode).toBe(201);
});

it('counts a change of one kitchen’s settings as a cause at that kitchen only', async () => {
  const changed = await at('corner', 'PATCH', '/api/kitchen', chain.manager, {
    handles: [
      { allergen: 'sesame', controls: 'segregated' },
      { allergen: 'walnut', controls: 'shared-equipment' },
    ],
  });
  expect(changed.statusCode).toBe(200);
  expect(await pendingAt('corner')).toEqual(['shortbread']);
  expect(await pendingAt('bench')).toEqual(['sesame-snap']);
  const corner = (await approvals('corner')).pending[0];
  expect(corner.causes.map((c) => c.action)).toEqual(['kitchen.updated']);
  expect(corner.words.join(' ')).toMatch(/walnut/i);
  // The bench's sesame snap waits for the butter's change alone.
  const snap = (await approvals('bench')).pending[0];
  expect(snap.causes.map((c) => c.action)).toEqual(['ingredient.saved']);
});
