import type { Book, BookIngredient, BookRecipe } from '@crumbproof/shared';
import { QueryTypes, Sequelize } from 'sequelize';
import { TransactionRunner } from '../src/common/transaction';
import { migrator } from '../src/database/migrator';
import { IngredientsRepository } from '../src/ingredients/ingredients.repository';
import { KitchenService } from '../src/kitchen/kitchen.service';
import { multipart } from './fixtures/forms';
import { tableChecksums } from './fixtures/table-checksums';
import { adminQuery, emptyOwnerDatabase, startTestApp, type TestApp } from './support/test-app';

/**
 * An id names one ingredient or recipe, compared exactly everywhere: by the rules engine, by the
 * write path's existence checks and by the database. Spellings that a case- and accent-blind
 * comparison would take for 'sp-case' are refused as ids, on every route that writes by id, and
 * nothing is saved.
 */
const VARIANTS = [
  { variant: 'SP-CASE', productVariant: 'SP-CASE-PRODUCT' },
  { variant: 'Sp-Case', productVariant: 'Sp-Case-Product' },
  { variant: 'sp-cäse', productVariant: 'sp-cäse-product' },
  { variant: 'sp-case ', productVariant: 'sp-case-product ' },
  { variant: 'ｓｐ-case', productVariant: 'ｓｐ-case-product' },
];

const milkIngredient: BookIngredient = {
  id: 'sp-case',
  name: 'Case test cream',
  contains: ['milk'],
  mayContain: [],
  vegan: false,
  vegetarian: true,
};
const plainIngredient = (id: string): BookIngredient => ({
  id,
  name: 'Case test cream without milk',
  contains: [],
  mayContain: [],
  vegan: true,
  vegetarian: true,
});
const product: BookRecipe = {
  id: 'sp-case-product',
  name: 'Case test tart',
  lines: [{ use: 'sp-case', qty: 100, unit: 'g' }],
  sale: { portionG: 100 },
};
const isoDay = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

describe('ids compare exactly: a case or accent variant never reaches another item (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;

  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    manager = await t.signIn('manager@example.com');
    expect((await send('POST', '/api/ingredients', milkIngredient)).statusCode).toBe(201);
    expect((await send('POST', '/api/ingredients', plainIngredient('sp-case-plain'))).statusCode).toBe(201);
    expect((await send('POST', '/api/recipes', product)).statusCode).toBe(201);
    // The declaration is kept once computed; later reads of it change no table.
    expect(await productAllergens()).toEqual(['milk']);
  });
  afterAll(() => t.close());

  function send(method: 'POST' | 'PUT', url: string, payload: object) {
    return t.app.inject({ method, url, payload, headers: { cookie: manager } });
  }
  async function sendForm(url: string, fields: Record<string, string>, file: { name: string; bytes: Buffer }) {
    const form = await multipart(fields, file);
    return t.app.inject({ method: 'POST', url, payload: form.payload, headers: { ...form.headers, cookie: manager } });
  }
  async function productAllergens(): Promise<string[]> {
    const res = await t.app.inject({ method: 'GET', url: '/api/recipes/sp-case-product/declaration', headers: { cookie: manager } });
    expect(res.statusCode).toBe(200);
    return (res.json().contains as { allergen: string }[]).map((c) => c.allergen);
  }
  async function book(): Promise<Book> {
    return (await t.app.inject({ method: 'GET', url: '/api/book', headers: { cookie: manager } })).json();
  }

  /** The request is refused as a bad id (400, the field named, the rule said), and no table changed. */
  async function expectRefusedUnchanged(request: () => Promise<{ statusCode: number; json: () => unknown }>, field: RegExp) {
    const before = await tableChecksums(t.sequelize);
    const res = await request();
    const body = res.json() as { code: string; message: string; fields?: { path: string; message: string }[] };
    expect({ status: res.statusCode, code: body.code }).toEqual({
      status: 400,
      code: expect.stringMatching(/^(validation|book-invalid)$/),
    });
    expect(body.message).toMatch(/Use lower-case letters, digits and hyphens/);
    expect(body.fields?.some((f) => field.test(f.path) || field.test(f.message))).toBe(true);
    expect(await tableChecksums(t.sequelize)).toEqual(before);
    expect(await productAllergens()).toEqual(['milk']);
  }

  describe.each(VARIANTS)('the variant $variant of sp-case', ({ variant, productVariant }) => {
    it('is refused as the id of a new ingredient', async () => {
      await expectRefusedUnchanged(() => send('POST', '/api/ingredients', plainIngredient(variant)), /^id$/);
    });

    it('is refused as the address and the id of an ingredient update', async () => {
      await expectRefusedUnchanged(
        () => send('PUT', `/api/ingredients/${encodeURIComponent(variant)}`, { ...plainIngredient(variant), baseRevision: 1 }),
        /^(id|code)$/,
      );
      await expectRefusedUnchanged(() => send('PUT', '/api/ingredients/sp-case', { ...plainIngredient(variant), baseRevision: 1 }), /^id$/);
    });

    it('is refused as the id of a new recipe that would contain itself, and as a line of a recipe', async () => {
      await expectRefusedUnchanged(
        () => send('POST', '/api/recipes', { ...product, id: productVariant, lines: [{ use: 'sp-case-product', qty: 10, unit: 'g' }] }),
        /^id$/,
      );
      await expectRefusedUnchanged(
        () => send('POST', '/api/recipes', { ...product, id: 'sp-case-other', lines: [{ use: variant, qty: 10, unit: 'g' }] }),
        /^lines\.0\.use$/,
      );
    });

    it('is refused as the address, the id and a line of a recipe update', async () => {
      await expectRefusedUnchanged(
        () =>
          send('PUT', `/api/recipes/${encodeURIComponent(productVariant)}`, {
            ...product,
            id: productVariant,
            lines: [{ use: 'sp-case-plain', qty: 10, unit: 'g' }],
            baseRevision: 1,
          }),
        /^(id|code)$/,
      );
      await expectRefusedUnchanged(
        () => send('PUT', '/api/recipes/sp-case-product', { ...product, lines: [{ use: variant, qty: 10, unit: 'g' }], baseRevision: 1 }),
        /^lines\.0\.use$/,
      );
    });

    it('is refused in a swap, as what is replaced and as the recipe to swap in', async () => {
      await expectRefusedUnchanged(() => send('POST', '/api/swaps/apply', { from: variant, to: 'sp-case-plain' }), /^from$/);
      await expectRefusedUnchanged(
        () => send('POST', '/api/swaps/apply', { from: 'sp-case', to: 'sp-case-plain', recipe: productVariant }),
        /^recipe$/,
      );
    });

    it('is refused as the id of an ingredient in an imported book', async () => {
      const current = await book();
      await expectRefusedUnchanged(
        () => send('POST', '/api/book/import', { ...current, ingredients: [...current.ingredients, plainIngredient(variant)] }),
        /^ingredients\.\d+ \(.*\)\.id$/,
      );
    });

    it('is refused as the ingredient a specification is attached to', async () => {
      const pdf = Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n', 'latin1');
      await expectRefusedUnchanged(
        () =>
          sendForm(
            `/api/ingredients/${encodeURIComponent(variant)}/specifications`,
            { reviewBy: isoDay(30) },
            { name: 'spec.pdf', bytes: pdf },
          ),
        /^code$/,
      );
    });
  });

  // A spreadsheet's cells are read without the spaces around them, so 'sp-case ' in a cell is sp-case itself.
  it.each(VARIANTS.filter((v) => v.variant.trim() === v.variant))(
    'refuses the variant $variant of sp-case as the id of a row of an imported spreadsheet',
    async ({ variant }) => {
      const csv = Buffer.from(`id,name,contains,vegan,vegetarian\n${variant},Case test cream without milk,none,yes,yes\n`, 'utf8');
      const before = await tableChecksums(t.sequelize);
      const res = await sendForm('/api/ingredients/import', {}, { name: 'ingredients.csv', bytes: csv });
      expect(res.statusCode).toBe(400);
      expect(res.json().message).toMatch(/Use lower-case letters, digits and hyphens, e\.g\. 'sp-case'/);
      expect(await tableChecksums(t.sequelize)).toEqual(before);
      expect(await productAllergens()).toEqual(['milk']);
    },
  );

  it('suggests the id written the canonical way', async () => {
    const res = await send('POST', '/api/ingredients', plainIngredient('Crème Pâtissière (Vanilla)'));
    expect(res.statusCode).toBe(400);
    expect(res.json().fields).toContainEqual({
      path: 'id',
      message: "Use lower-case letters, digits and hyphens, e.g. 'creme-patissiere-vanilla'.",
    });
  });

  it.each(VARIANTS)('reads by the exact id: the variant $variant finds no ingredient', async ({ variant }) => {
    const res = await t.app.inject({ method: 'GET', url: `/api/ingredients/${encodeURIComponent(variant)}`, headers: { cookie: manager } });
    expect(res.statusCode).toBe(404);
  });

  it('never writes a row the database takes for another code: a code with a trailing space is refused and nothing is saved', async () => {
    // The schema refuses such an id long before; the store refuses it too, for any caller.
    const siteId = (await t.app.get(KitchenService).current()).id;
    const repo = t.app.get(IngredientsRepository);
    expect(await repo.findCurrent(siteId, 'sp-case ')).toBeNull();
    expect(await repo.history(siteId, 'sp-case ')).toBeNull();
    const before = await tableChecksums(t.sequelize);
    const { id: _id, ...body } = plainIngredient('sp-case ');
    const write = t.app.get(TransactionRunner).run((tx) => repo.write(siteId, 'sp-case ', body, { authorId: null, note: 'Edited' }, tx));
    await expect(write).rejects.toMatchObject({ code: 'conflict', message: expect.stringMatching(/would reach the existing 'sp-case'/) });
    expect(await tableChecksums(t.sequelize)).toEqual(before);
    expect(await productAllergens()).toEqual(['milk']);
  });

  it('still writes by the exact id: an update of sp-case is revision 2 of sp-case and nothing else', async () => {
    const res = await send('PUT', '/api/ingredients/sp-case', { ...milkIngredient, name: 'Case test cream (double)', baseRevision: 1 });
    expect(res.statusCode).toBe(200);
    expect(res.json()).toMatchObject({ id: 'sp-case', revision: 2 });
    const plain = await t.app.inject({ method: 'GET', url: '/api/ingredients/sp-case-plain', headers: { cookie: manager } });
    expect(plain.json().revision).toBe(1);
    expect(await productAllergens()).toEqual(['milk']);
  });
});

describe('migration 0005: code columns compare byte for byte, and existing codes are never merged (real MariaDB)', () => {
  const database = `${process.env.DB_NAME}_codes`;
  let sequelize: Sequelize;

  beforeAll(async () => {
    sequelize = await emptyOwnerDatabase(database);
    await migrator(sequelize).up({ to: '0004-sessions' });
  });
  afterAll(async () => {
    await sequelize.close();
    await adminQuery(`DROP DATABASE IF EXISTS \`${database}\``);
  });

  const collations = async () =>
    Object.fromEntries(
      (
        await sequelize.query<{ name: string; collation: string }>(
          "SELECT CONCAT(table_name, '.', column_name) AS name, collation_name AS collation FROM information_schema.columns WHERE table_schema = DATABASE() AND column_name IN ('code', 'regime', 'input_hash', 'sha256') AND table_name IN ('ingredients', 'recipes', 'declarations', 'specifications') ORDER BY name",
          { type: QueryTypes.SELECT },
        )
      ).map((r) => [r.name, r.collation]),
    );
  const codes = async () =>
    (
      await sequelize.query<{ code: string }>('SELECT code FROM ingredients UNION ALL SELECT code FROM recipes', {
        type: QueryTypes.SELECT,
      })
    )
      .map((r) => r.code)
      .sort();

  it('refuses, naming them and changing nothing, codes that are not canonical or that an ingredient and a recipe share', async () => {
    await sequelize.query(
      "INSERT INTO sites (name, address, regime, handles, created_at, updated_at) VALUES ('Migration kitchen', '', 'UK', '[]', NOW(3), NOW(3))",
    );
    await sequelize.query(
      "INSERT INTO ingredients (site_id, code, name, created_at, updated_at) VALUES (1, 'SP-Case', 'Cream', NOW(3), NOW(3)), (1, 'crème', 'Crème fraîche', NOW(3), NOW(3)), (1, 'flour', 'Flour', NOW(3), NOW(3)), (1, 'shared-id', 'Sugar', NOW(3), NOW(3))",
    );
    await sequelize.query(
      "INSERT INTO recipes (site_id, code, name, created_at, updated_at) VALUES (1, 'tart', 'Tart', NOW(3), NOW(3)), (1, 'shared-id', 'Sugar syrup', NOW(3), NOW(3))",
    );
    const before = await collations();
    expect(Object.values(before)).toEqual(Array(5).fill('utf8mb4_unicode_ci'));

    const refusal = migrator(sequelize).up();
    await expect(refusal).rejects.toThrow(
      /the ingredient 'SP-Case' of kitchen 1 is not an id written with lower-case letters, digits and hyphens \(it could be 'sp-case'\)/,
    );
    await expect(migrator(sequelize).up()).rejects.toThrow(/the ingredient 'crème' of kitchen 1 .*\(it could be 'creme'\)/);
    await expect(migrator(sequelize).up()).rejects.toThrow(/the ingredient and the recipe 'shared-id' of kitchen 1 share one id/);
    await expect(migrator(sequelize).up()).rejects.toThrow(/Nothing was changed/);
    expect(await collations()).toEqual(before);
    expect(await codes()).toEqual(['SP-Case', 'crème', 'flour', 'shared-id', 'shared-id', 'tart']);
    expect((await migrator(sequelize).executed()).map((m) => m.name)).not.toContain('0005-binary-codes');
  });

  it('once every code names one item, makes each code column utf8mb4_bin, so case and accents tell codes apart', async () => {
    await sequelize.query("UPDATE ingredients SET code = 'sp-case' WHERE code = 'SP-Case'");
    await sequelize.query("UPDATE ingredients SET code = 'creme' WHERE name = 'Crème fraîche'");
    await sequelize.query("UPDATE recipes SET code = 'sugar-syrup' WHERE code = 'shared-id'");
    await migrator(sequelize).up();
    expect(await collations()).toEqual({
      'declarations.input_hash': 'utf8mb4_bin',
      'declarations.regime': 'utf8mb4_bin',
      'ingredients.code': 'utf8mb4_bin',
      'recipes.code': 'utf8mb4_bin',
      'specifications.sha256': 'utf8mb4_bin',
    });
    const found = await sequelize.query<{ code: string }>("SELECT code FROM ingredients WHERE code IN ('SP-CASE', 'sp-cäse', 'crème')", {
      type: QueryTypes.SELECT,
    });
    expect(found).toEqual([]);
    // The unique key now tells them apart too: 'SP-CASE' is another code, not a second 'sp-case'.
    await sequelize.query(
      "INSERT INTO ingredients (site_id, code, name, created_at, updated_at) VALUES (1, 'SP-CASE', 'Another', NOW(3), NOW(3))",
    );
    expect(await codes()).toEqual(expect.arrayContaining(['sp-case', 'SP-CASE']));
  });
});
