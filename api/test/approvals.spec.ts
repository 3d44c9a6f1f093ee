import type {
  ApprovalsGiven,
  ApprovalsView,
  Book,
  BookIngredient,
  CounterProductsView,
  LabelRun,
  PendingApproval,
  StaleLabel,
} from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { tableChecksums } from './fixtures/table-checksums';
import { approveAll } from './support/approvals';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * Approvals on the real MariaDB: whether a product waits for a manager's approval is worked out
 * from the current book (a change to an ingredient reaches every product above it, at any depth),
 * only the manager approves and only what was seen, labels print only from an approved
 * declaration, the counter serves the approved one unless a change adds an allergen, and labels
 * printed before an approved change are listed out of date until a manager marks them handled.
 */
describe('approvals of products’ declarations (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;
  let chef: string;
  let counter: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    ({ manager, chef, counter } = await t.signInDemo());
    const { site } = (await req('GET', '/api/book', manager)).json<Book>();
    // A three-level tree: the spread in a base cream, the cream in a filling, the filling in a
    // slice; the tart takes the base cream directly; the bun uses none of it.
    const imported = await req('POST', '/api/book/import', manager, {
      crumbproofBook: 1,
      site,
      ingredients: [
        {
          id: 'nut-spread',
          name: 'Hazel spread',
          supplier: 'Invented Spreads',
          contains: ['hazelnut', 'milk'],
          mayContain: [],
          composition: 'Sugar, hazelnuts, skimmed milk powder, sunflower oil',
          vegan: false,
          vegetarian: true,
          nutrition: {
            energyKj: 2250,
            energyKcal: 539,
            fat: 31,
            saturates: 5,
            carbohydrate: 57,
            sugars: 56,
            fibre: 2,
            protein: 6,
            salt: 0.1,
            source: 'Invented figures for a test',
          },
        },
      ],
      recipes: [
        {
          id: 'base-cream',
          name: 'Base cream',
          lines: [
            { use: 'nut-spread', qty: 200, unit: 'g' },
            { use: 'double-cream', qty: 200, unit: 'g' },
          ],
        },
        {
          id: 'hazel-filling',
          name: 'Hazel filling',
          lines: [
            { use: 'base-cream', qty: 300, unit: 'g' },
            { use: 'caster-sugar', qty: 50, unit: 'g' },
          ],
        },
        {
          id: 'hazel-slice',
          name: 'Hazel slice',
          lines: [
            { use: 'plain-flour', qty: 180, unit: 'g' },
            { use: 'rapeseed-oil', qty: 60, unit: 'g' },
            { use: 'hazel-filling', qty: 300, unit: 'g' },
          ],
          sale: { portionG: 80, shelfLifeDays: 2, dateMark: 'use-by', storage: 'Keep refrigerated at 0–5 °C.' },
        },
        {
          id: 'hazel-tart',
          name: 'Hazel tart',
          lines: [
            { use: 'plain-flour', qty: 150, unit: 'g' },
            { use: 'rapeseed-oil', qty: 50, unit: 'g' },
            { use: 'base-cream', qty: 200, unit: 'g' },
          ],
          sale: { portionG: 90, shelfLifeDays: 2, dateMark: 'use-by', storage: 'Keep refrigerated at 0–5 °C.' },
        },
        {
          id: 'plain-bun',
          name: 'Plain bun',
          lines: [
            { use: 'plain-flour', qty: 300, unit: 'g' },
            { use: 'water', qty: 180, unit: 'g' },
            { use: 'yeast', qty: 6, unit: 'g' },
          ],
          sale: { portionG: 60, shelfLifeDays: 2, dateMark: 'best-before' },
        },
      ],
    });
    expect(imported.statusCode).toBe(200);
  });
  afterAll(() => t.close());

  const req: TestApp['req'] = (...args) => t.req(...args);
  const pending = async (cookie = manager) => {
    const res = await req('GET', '/api/approvals', cookie);
    expect(res.statusCode).toBe(200);
    return res.json<ApprovalsView>().pending;
  };
  const spread = async () => (await req('GET', '/api/book', chef)).json<Book>().ingredients.find((i) => i.id === 'nut-spread')!;
  /** The revision an editor would load now, named as the base of its save. */
  const baseOf = async (kind: 'ingredients' | 'recipes', code: string) =>
    (await req('GET', `/api/${kind}/${code}`, chef)).json<{ revision: number }>().revision;
  const saveSpread = async (changed: BookIngredient) => {
    const res = await req('PUT', '/api/ingredients/nut-spread', chef, {
      ...changed,
      baseRevision: await baseOf('ingredients', 'nut-spread'),
    });
    expect(res.statusCode).toBe(200);
  };
  /** The spread without its egg: neither in its allergen statement nor in its composition (which the engine reads too). */
  const withoutEgg = (s: BookIngredient): BookIngredient => ({
    ...s,
    contains: (s.contains ?? []).filter((c) => c !== 'egg'),
    composition: s.composition?.replace(', pasteurised egg', ''),
  });
  const feed = async () => (await req('GET', '/api/counter/products', counter)).json<CounterProductsView>();
  const print = (cookie: string, template: string, products: string[], productionDate = '2026-12-02') =>
    req('POST', '/api/labels/runs', cookie, { template, items: products.map((product) => ({ product, quantity: 2 })), productionDate });
  /** The newest mail of a kind in the outbox, once it is there (the approval-needed mail is queued after the write answers). */
  const lastMail = async (kind: string, after = 0) => {
    for (let i = 0; i < 50; i++) {
      const [row] = await t.sequelize.query<{ id: number; recipients: string | string[]; subject: string; text: string }>(
        'SELECT id, recipients, subject, text FROM mail_outbox WHERE kind = ? AND id > ? ORDER BY id DESC LIMIT 1',
        { replacements: [kind, after], type: QueryTypes.SELECT },
      );
      if (row)
        return { ...row, recipients: typeof row.recipients === 'string' ? (JSON.parse(row.recipients) as string[]) : row.recipients };
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`No ${kind} mail was queued.`);
  };
  const lastMailId = async () =>
    Number(
      (await t.sequelize.query<{ id: number | null }>('SELECT MAX(id) AS id FROM mail_outbox', { type: QueryTypes.SELECT }))[0].id ?? 0,
    );
  const auditOf = async (action: string) =>
    t.sequelize.query<{ actor_name: string; actor_role: string; summary: string; after: string }>(
      'SELECT actor_name, actor_role, summary, `after` FROM audit_events WHERE action = ? ORDER BY id',
      { replacements: [action], type: QueryTypes.SELECT },
    );

  it('the demo starts approved, and products never approved wait for a first approval', async () => {
    const waiting = await pending();
    expect(waiting.map((p) => [p.product, p.reason, p.approved])).toEqual([
      ['hazel-slice', 'first-approval', null],
      ['hazel-tart', 'first-approval', null],
      ['plain-bun', 'first-approval', null],
    ]);
    expect(waiting[0].words).toEqual(
      expect.arrayContaining([expect.stringMatching(/^Contains .*milk/), expect.stringMatching(/^Ingredients: /)]),
    );
    // The counter serves a product never approved flagged as such; the demo's own are approved.
    const products = (await feed()).products;
    expect(products.find((p) => p.id === 'hazel-slice')!.approval).toEqual({ state: 'never-approved', serves: 'current' });
    expect(products.find((p) => p.id === 'vegan-brownie')!.approval).toEqual({
      state: 'approved',
      approvedAt: expect.any(String),
      approvedBy: 'Maren Holloway',
    });
    // Never approved, never printed: the labels say why, and nothing is written.
    const before = await tableChecksums(t.sequelize);
    const refused = await print(chef, 'product', ['plain-bun']);
    expect(refused.statusCode).toBe(409);
    expect(refused.json()).toMatchObject({
      code: 'approval-needed',
      fields: [
        { path: 'items.0.product', message: "Plain bun's declaration has never been approved: a manager approves it in Approvals first." },
      ],
    });
    expect(await tableChecksums(t.sequelize)).toEqual(before);
    expect((await approveAll(t, manager)).sort()).toEqual(['hazel-slice', 'hazel-tart', 'plain-bun']);
    expect(await pending()).toEqual([]);
  });

  it('only a manager approves; the pastry chef reads the list, front of house neither', async () => {
    const before = await tableChecksums(t.sequelize);
    expect((await req('GET', '/api/approvals', chef)).statusCode).toBe(200);
    expect((await req('GET', '/api/approvals', counter)).statusCode).toBe(403);
    const body = { products: [{ product: 'hazel-slice', inputHash: 'a'.repeat(64) }] };
    expect((await req('POST', '/api/approvals', chef, body)).statusCode).toBe(403);
    expect((await req('POST', '/api/approvals', counter, body)).statusCode).toBe(403);
    expect(await tableChecksums(t.sequelize)).toEqual(before);
  });

  it('a change that alters nothing a customer or label depends on needs no approval', async () => {
    const was = await spread();
    // The supplier's code and the nutrition figures: no allergen, claim, list or percentage moves.
    await saveSpread({ ...was, supplierCode: 'IS-77', nutrition: { ...was.nutrition!, salt: 0.2 } });
    expect(await pending()).toEqual([]);
    expect((await print(chef, 'product', ['hazel-slice'])).statusCode).toBe(201);
  });

  let printedSlice: LabelRun;
  let printedChart: LabelRun;
  let egg: PendingApproval[];
  it('a supplier’s reformulation below a shared sub-recipe sends every product above it, at any depth, to approval', async () => {
    const slice = await print(chef, 'product', ['hazel-slice', 'hazel-tart']);
    expect(slice.statusCode).toBe(201);
    printedSlice = slice.json<LabelRun>();
    const chart = await print(chef, 'chart', ['hazel-slice', 'plain-bun']);
    expect(chart.statusCode).toBe(201);
    printedChart = chart.json<LabelRun>();

    const was = await spread();
    const mailsBefore = await lastMailId();
    await saveSpread({ ...was, contains: [...(was.contains ?? []), 'egg'], composition: `${was.composition}, pasteurised egg` });
    egg = await pending(chef);
    // One mail to the managers for the write, listing every product it sends to approval.
    const needed = await lastMail('approval-needed', mailsBefore);
    expect(needed.recipients).toEqual(['manager@example.com']);
    expect(needed.subject).toBe('2 products wait for your approval');
    expect(needed.text).toContain('Tobiah Quill saved a change that reaches these products');
    expect(needed.text).toContain('Hazel slice (adds an allergen): Now contains eggs.');
    expect(needed.text).toContain('Hazel tart (adds an allergen): Now contains eggs.');
    // Two levels down (slice ← filling ← base cream ← spread) and one (tart ← base cream); the bun is untouched.
    expect(egg.map((p) => p.product)).toEqual(['hazel-slice', 'hazel-tart']);
    for (const p of egg) {
      expect(p).toMatchObject({ reason: 'changed', addsAllergen: true, approved: { by: 'Maren Holloway', role: 'manager' } });
      expect(p.change!.added).toEqual([{ allergen: 'eggs', label: 'eggs', how: 'contains', sources: ['egg'] }]);
      expect(p.change!.claims).toEqual(expect.arrayContaining([{ claim: 'egg-free', before: 'ok', after: 'fails' }]));
      expect(p.words).toEqual(expect.arrayContaining(['Now contains eggs.', 'Egg-free: holds as recorded before, now does not hold.']));
      // The causes: every write since the approval that reaches it (the supplier's code, then egg), who and when.
      expect(p.causes).toEqual([
        expect.objectContaining({ by: 'Tobiah Quill', action: 'ingredient.saved' }),
        expect.objectContaining({
          by: 'Tobiah Quill',
          role: 'pastry-chef',
          action: 'ingredient.saved',
          summary: expect.stringMatching(/^Revised the ingredient Hazel spread \(nut-spread\)/),
          items: [{ kind: 'ingredient', id: 'nut-spread', name: 'Hazel spread' }],
        }),
      ]);
    }
  });

  it('the counter serves at once a pending change that adds an allergen, flagged; one that adds none waits for approval', async () => {
    const slice = (await feed()).products.find((p) => p.id === 'hazel-slice')!;
    expect(slice.approval).toMatchObject({
      state: 'pending',
      serves: 'current',
      adds: [{ allergen: 'eggs', how: 'contains' }],
      losesClaims: ['egg-free'],
    });
    expect(slice.declaration.contains.map((c) => c.allergen)).toContain('eggs');

    // More water in the bun moves nothing a customer or label depends on (no QUID, the same order).
    const book = (await req('GET', '/api/book', chef)).json<Book>();
    const bun = book.recipes.find((r) => r.id === 'plain-bun')!;
    const wetter = bun.lines.map((l) => (l.use === 'water' ? { ...l, qty: 200 } : l));
    expect(
      (await req('PUT', '/api/recipes/plain-bun', chef, { ...bun, lines: wetter, baseRevision: await baseOf('recipes', 'plain-bun') }))
        .statusCode,
    ).toBe(200);
    expect((await pending()).map((p) => p.product)).toEqual(['hazel-slice', 'hazel-tart']);
    // Salt in the bun changes its list but adds nothing a customer avoids: it keeps the approved declaration.
    const lines = [...wetter, { use: 'sea-salt', qty: 5, unit: 'g' }];
    expect(
      (await req('PUT', '/api/recipes/plain-bun', chef, { ...bun, lines, baseRevision: await baseOf('recipes', 'plain-bun') })).statusCode,
    ).toBe(200);
    const waiting = await pending();
    const bunPending = waiting.find((p) => p.product === 'plain-bun')!;
    expect(bunPending).toMatchObject({ addsAllergen: false, change: { added: [], ingredientsText: expect.any(Object) } });
    const bunOnCounter = (await feed()).products.find((p) => p.id === 'plain-bun')!;
    expect(bunOnCounter.approval).toMatchObject({ state: 'pending', serves: 'approved', adds: [], losesClaims: [] });
    const approved = await t.sequelize.query<{ body: string }>(
      'SELECT a.body FROM product_approvals a JOIN recipes r ON r.id = a.recipe_id WHERE r.code = ? ORDER BY a.id DESC LIMIT 1',
      { replacements: ['plain-bun'], type: QueryTypes.SELECT },
    );
    const body = typeof approved[0].body === 'string' ? JSON.parse(approved[0].body) : approved[0].body;
    // The approved copy, with the basis of its claims worked out today (never kept in the approval).
    expect(body.claimBasis).toBeUndefined();
    const { claimBasis, ...approvedCopy } = bunOnCounter.declaration;
    expect(approvedCopy).toEqual(body);
    expect(claimBasis?.checked).toBe(body.basis.items.filter((i: { kind: string }) => i.kind === 'ingredient').length);
    expect(bunOnCounter.declaration.ingredientsText).not.toBe(
      (await req('GET', '/api/recipes/plain-bun/declaration', chef)).json().ingredientsText,
    );
    expect((await approveAll(t, manager)).includes('plain-bun')).toBe(true);
    // approveAll approved the hazel products too; take them back to pending for the next tests.
    const was = await spread();
    await saveSpread(withoutEgg(was));
    await saveSpread(was);
    egg = await pending();
    expect(egg.map((p) => p.product)).toEqual([]);
  });

  it('printing is refused while a product waits, and released by its approval; a stale inputHash is refused', async () => {
    // Back to the egg-free spread, then egg again: pending against the approval with egg.
    const was = await spread();
    await saveSpread(withoutEgg(was));
    const seen = await pending();
    expect(seen.map((p) => [p.product, p.words[0]])).toEqual([
      ['hazel-slice', 'No longer contains eggs.'],
      ['hazel-tart', 'No longer contains eggs.'],
    ]);
    let before = await tableChecksums(t.sequelize);
    const refused = await print(chef, 'product', ['plain-bun', 'hazel-slice', 'hazel-tart']);
    expect(refused.statusCode).toBe(409);
    expect(refused.json().fields).toEqual([
      {
        path: 'items.1.product',
        message: "Hazel slice's declaration has changed since it was approved: a manager approves it in Approvals first.",
      },
      {
        path: 'items.2.product',
        message: "Hazel tart's declaration has changed since it was approved: a manager approves it in Approvals first.",
      },
    ]);
    const chart = await print(manager, 'chart', ['hazel-slice']);
    expect(chart.statusCode).toBe(409);
    expect(await tableChecksums(t.sequelize)).toEqual(before);

    // The chef changes the spread again while the manager looks: approving what was seen is refused.
    const now = await spread();
    await saveSpread({ ...now, mayContain: ['mustard'] });
    // (A read keeps the new declarations; the refusal below then changes no table at all.)
    await feed();
    before = await tableChecksums(t.sequelize);
    const stale = await req('POST', '/api/approvals', manager, {
      products: seen.map((p) => ({ product: p.product, inputHash: p.inputHash })),
    });
    expect(stale.statusCode).toBe(409);
    expect(stale.json().fields.map((f: { path: string; message: string }) => [f.path, f.message])).toEqual([
      [
        'products.0.inputHash',
        expect.stringMatching(/^Hazel slice's declaration has changed since you looked at it \(Now may contain mustard\.\)/),
      ],
      ['products.1.inputHash', expect.stringMatching(/^Hazel tart's declaration has changed since you looked at it/)],
    ]);
    expect(await tableChecksums(t.sequelize)).toEqual(before);

    const again = await pending();
    const mailsBefore = await lastMailId();
    const given = await req('POST', '/api/approvals', manager, {
      products: again.map((p) => ({ product: p.product, inputHash: p.inputHash })),
      note: 'Checked against the supplier’s new specification.',
    });
    expect(given.statusCode).toBe(201);
    expect(given.json<ApprovalsGiven>().approved.map((a) => [a.product, a.addsAllergen])).toEqual([
      ['hazel-slice', true],
      ['hazel-tart', true],
    ]);
    expect(await pending()).toEqual([]);
    // Every active user, front of house too, is told the approved change adds an allergen.
    const told = await lastMail('allergen-approved', mailsBefore);
    expect([...told.recipients].sort()).toEqual(['chef@example.com', 'counter@example.com', 'manager@example.com']);
    expect(told.subject).toBe('2 products now have allergens they did not have');
    expect(told.text).toContain('Hazel slice: now may contain mustard.');
    // Approving again what is approved already is refused: nothing waits.
    const twice = await req('POST', '/api/approvals', manager, { products: [{ product: 'hazel-slice', inputHash: again[0].inputHash }] });
    expect(twice.statusCode).toBe(400);
    expect((await print(chef, 'product', ['hazel-slice', 'hazel-tart'])).statusCode).toBe(201);
    expect((await feed()).products.find((p) => p.id === 'hazel-slice')!.approval.state).toBe('approved');

    const events = await auditOf('approval.given');
    const last = events[events.length - 1];
    expect(last).toMatchObject({ actor_name: 'Maren Holloway', actor_role: 'manager' });
    expect(last.summary).toBe(
      'Approved the declaration of Hazel slice (hazel-slice), Hazel tart (hazel-tart): Checked against the supplier’s new specification.',
    );
  });

  it('labels printed before an approved change are out of date until a manager marks them handled', async () => {
    const res = await req('GET', '/api/labels/stale', chef);
    expect(res.statusCode).toBe(200);
    const stale = res.json<StaleLabel[]>();
    const mine = stale.filter((s) => s.run === printedSlice.id || s.run === printedChart.id);
    // The first run carried no mustard may-contain: the approval since adds it.
    // Newest print first: the chart (the bun's list changed too), then the slice's and tart's labels.
    expect(mine.map((s) => [s.run, s.product, s.chart])).toEqual([
      [printedChart.id, 'plain-bun', true],
      [printedChart.id, 'hazel-slice', true],
      [printedSlice.id, 'hazel-tart', false],
      [printedSlice.id, 'hazel-slice', false],
    ]);
    const sliceLabels = mine.find((s) => s.run === printedSlice.id && s.product === 'hazel-slice')!;
    expect(sliceLabels.action).toBe(`Withdraw batch ${printedSlice.items[0].batch}'s labels of Hazel slice: they do not say mustard.`);
    expect(mine[1].action).toMatch(/^Reprint the allergen chart printed on \d+ \w+ \d{4} \(run \d+\): Hazel slice has changed since\.$/);

    let before = await tableChecksums(t.sequelize);
    expect((await req('POST', `/api/labels/stale/${sliceLabels.id}/handled`, chef, { note: 'Withdrawn' })).statusCode).toBe(403);
    expect((await req('POST', `/api/labels/stale/${sliceLabels.id}/handled`, manager, { note: '' })).statusCode).toBe(400);
    expect((await req('POST', '/api/labels/stale/999-0/handled', manager, { note: 'Withdrawn' })).statusCode).toBe(404);
    expect(await tableChecksums(t.sequelize)).toEqual(before);
    const done = await req('POST', `/api/labels/stale/${sliceLabels.id}/handled`, manager, {
      note: 'Both trays withdrawn and relabelled.',
    });
    expect(done.statusCode).toBe(200);
    const after = (await req('GET', '/api/labels/stale', manager)).json<StaleLabel[]>();
    expect(after.map((s) => s.id)).not.toContain(sliceLabels.id);
    expect(after.map((s) => s.id)).toContain(mine[0].id);
    before = await tableChecksums(t.sequelize);
    expect((await req('POST', `/api/labels/stale/${sliceLabels.id}/handled`, manager, { note: 'Again' })).statusCode).toBe(404);
    expect(await tableChecksums(t.sequelize)).toEqual(before);
    const [event] = await auditOf('label-stale.handled');
    expect(event).toMatchObject({ actor_name: 'Maren Holloway', actor_role: 'manager' });
    expect(event.summary).toMatch(/^Marked handled: Withdraw batch .* Both trays withdrawn and relabelled\.$/);
    // The append-only tables refuse the API's own user a change.
    await expect(t.sequelize.query('UPDATE product_approvals SET note = NULL')).rejects.toThrow(/UPDATE command denied/);
    await expect(t.sequelize.query('DELETE FROM label_stale_handled')).rejects.toThrow(/DELETE command denied/);
  });
});
