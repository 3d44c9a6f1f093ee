import type { ApiErrorBody, IngredientView, RecipeView } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from './support/test-app';

/** Two people edit the same item: the second save names the revision it started from and is refused, nothing overwritten. */
describe('saves name the revision they started from (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;
  let manager: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    chef = await t.signIn('chef@example.com');
    manager = await t.signIn('manager@example.com');
  });
  afterAll(() => t.close());

  const req = (method: 'GET' | 'PUT', url: string, cookie: string, payload?: unknown) =>
    t.app.inject({ method, url, headers: { cookie }, ...(payload !== undefined ? { payload: payload as object } : {}) });
  const count = async (table: string) =>
    Number((await t.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table}`, { type: QueryTypes.SELECT }))[0].n);
  const editable = <V extends { revision: number; updatedAt: string }>(view: V) => {
    const { revision, updatedAt: _u, ...body } = view;
    return { body, revision };
  };

  it('refuses the second of two saves from revision 3, naming the first person and what they changed, and overwrites nothing', async () => {
    // Revisions 2 and 3, so that both editors start from revision 3.
    for (const supplier of ['Mill one', 'Mill two']) {
      const { body, revision } = editable((await req('GET', '/api/ingredients/plain-flour', chef)).json<IngredientView>());
      expect((await req('PUT', '/api/ingredients/plain-flour', chef, { ...body, supplier, baseRevision: revision })).statusCode).toBe(200);
    }
    const managerLoaded = editable((await req('GET', '/api/ingredients/plain-flour', manager)).json<IngredientView>());
    const chefLoaded = editable((await req('GET', '/api/ingredients/plain-flour', chef)).json<IngredientView>());
    expect(managerLoaded.revision).toBe(3);
    expect(chefLoaded.revision).toBe(3);

    const first = await req('PUT', '/api/ingredients/plain-flour', manager, {
      ...managerLoaded.body,
      contains: [...(managerLoaded.body.contains ?? []), 'egg'],
      baseRevision: 3,
    });
    expect(first.statusCode).toBe(200);
    expect(first.json<IngredientView>().revision).toBe(4);

    const revisions = await count('ingredient_revisions');
    const events = await count('audit_events');
    const second = await req('PUT', '/api/ingredients/plain-flour', chef, { ...chefLoaded.body, supplier: 'Mill three', baseRevision: 3 });
    expect(second.statusCode).toBe(409);
    const refusal = second.json<ApiErrorBody>();
    expect(refusal.code).toBe('stale-base');
    expect(refusal.message).toMatch(
      /^Someone else saved this ingredient while you were editing: Maren Holloway saved revision 4 at \d{4}-\d\d-\d\d \d\d:\d\d UTC\./,
    );
    expect(refusal.message).toMatch(/Allergens: added egg\. Nothing was saved\./);
    expect(refusal.stale).toMatchObject({
      kind: 'ingredient',
      id: 'plain-flour',
      baseRevision: 3,
      currentRevision: 4,
      saves: [
        {
          revision: 4,
          authorName: 'Maren Holloway',
          note: 'Edited',
          changes: [{ field: 'contains', label: 'Allergens', text: 'Allergens: added egg.' }],
        },
      ],
      changes: [{ field: 'contains', text: 'Allergens: added egg.' }],
      current: { id: 'plain-flour', supplier: 'Mill two', contains: expect.arrayContaining(['egg']) },
    });
    expect(Date.parse(refusal.stale!.saves[0].savedAt)).not.toBeNaN();

    // Nothing saved and nothing recorded: the first person's change stands.
    expect(await count('ingredient_revisions')).toBe(revisions);
    expect(await count('audit_events')).toBe(events);
    const now = (await req('GET', '/api/ingredients/plain-flour', chef)).json<IngredientView>();
    expect(now.revision).toBe(4);
    expect(now.supplier).toBe('Mill two');
    expect(now.contains).toContain('egg');

    // Copying their values over the new revision is a new save with the new base: it passes.
    const again = await req('PUT', '/api/ingredients/plain-flour', chef, { ...chefLoaded.body, supplier: 'Mill three', baseRevision: 4 });
    expect(again.statusCode).toBe(200);
    expect(again.json<IngredientView>()).toMatchObject({ revision: 5, supplier: 'Mill three' });
  });

  it('names every save since the base when there were several, and what they changed together', async () => {
    const start = editable((await req('GET', '/api/ingredients/caster-sugar', chef)).json<IngredientView>());
    let base = start.revision;
    for (const supplier of ['Sugar house', 'Sugar mill']) {
      const saved = await req('PUT', '/api/ingredients/caster-sugar', manager, { ...start.body, supplier, baseRevision: base });
      expect(saved.statusCode).toBe(200);
      base = saved.json<IngredientView>().revision;
    }
    const refused = await req('PUT', '/api/ingredients/caster-sugar', chef, { ...start.body, vegan: false, baseRevision: start.revision });
    expect(refused.statusCode).toBe(409);
    const stale = refused.json<ApiErrorBody>().stale!;
    expect(stale.saves.map((s) => s.revision)).toEqual([start.revision + 1, start.revision + 2]);
    expect(stale.saves[1].changes.map((c) => c.text)).toEqual(['Supplier: changed from “Sugar house” to “Sugar mill”.']);
    expect(stale.changes.map((c) => c.field)).toEqual(['supplier']);
    expect(refused.json<ApiErrorBody>().message).toMatch(/\(2 saves since your revision \d+\)/);
  });

  it('refuses a recipe saved from a revision someone else has replaced, naming them and the line they changed', async () => {
    const managerLoaded = editable((await req('GET', '/api/recipes/vanilla-sponge', manager)).json<RecipeView>());
    const chefLoaded = editable((await req('GET', '/api/recipes/vanilla-sponge', chef)).json<RecipeView>());
    const [line, ...rest] = managerLoaded.body.lines;
    const qty = line.qty!;
    const first = await req('PUT', '/api/recipes/vanilla-sponge', manager, {
      ...managerLoaded.body,
      lines: [{ ...line, qty: qty + 10 }, ...rest],
      baseRevision: managerLoaded.revision,
    });
    expect(first.statusCode).toBe(200);

    const revisions = await count('recipe_revisions');
    const second = await req('PUT', '/api/recipes/vanilla-sponge', chef, {
      ...chefLoaded.body,
      name: 'Vanilla sponge (light)',
      baseRevision: chefLoaded.revision,
    });
    expect(second.statusCode).toBe(409);
    const refusal = second.json<ApiErrorBody>();
    expect(refusal.code).toBe('stale-base');
    expect(refusal.message).toMatch(/Maren Holloway saved revision/);
    expect(refusal.stale!.saves).toHaveLength(1);
    expect(refusal.stale!.saves[0].changes).toEqual([
      expect.objectContaining({
        field: 'lines',
        label: 'Lines',
        text: expect.stringMatching(new RegExp(`^Lines: [A-Z][^:]* ${qty} ${line.unit} → [A-Z][^:]* ${qty + 10} ${line.unit}\\.$`)),
      }),
    ]);
    expect(await count('recipe_revisions')).toBe(revisions);
    const now = (await req('GET', '/api/recipes/vanilla-sponge', chef)).json<RecipeView>();
    expect(now.name).toBe(managerLoaded.body.name);
    expect(now.lines[0].qty).toBe(qty + 10);

    const { body } = editable(now);
    const passes = await req('PUT', '/api/recipes/vanilla-sponge', chef, {
      ...body,
      name: 'Vanilla sponge (light)',
      baseRevision: now.revision,
    });
    expect(passes.statusCode).toBe(200);
    expect(passes.json<RecipeView>()).toMatchObject({ name: 'Vanilla sponge (light)', revision: now.revision + 1 });
  });

  it('refuses a save without its base revision, or naming one that does not exist, and saves nothing', async () => {
    const { body, revision } = editable((await req('GET', '/api/ingredients/sea-salt', chef)).json<IngredientView>());
    const revisions = await count('ingredient_revisions');
    const without = await req('PUT', '/api/ingredients/sea-salt', chef, { ...body, supplier: 'Salt works' });
    expect(without.statusCode).toBe(400);
    expect(without.json<ApiErrorBody>().fields).toEqual([expect.objectContaining({ path: 'baseRevision' })]);
    const future = await req('PUT', '/api/ingredients/sea-salt', chef, { ...body, supplier: 'Salt works', baseRevision: revision + 5 });
    expect(future.statusCode).toBe(400);
    expect(future.json<ApiErrorBody>()).toMatchObject({ code: 'validation', fields: [{ path: 'baseRevision' }] });
    expect(await count('ingredient_revisions')).toBe(revisions);
  });
});
