import { IMPORT_COLUMNS, type ApiErrorBody, type ImportPreview, type ImportResult, type IngredientView } from '@crumbproof/shared';
import ExcelJS from 'exceljs';
import { fixture, multipart } from './fixtures/forms';
import { tableChecksums } from './fixtures/table-checksums';
import { startTestApp, type TestApp } from './support/test-app';

interface Row {
  row: number;
  ingredient: Record<string, unknown> | null;
  action: string;
  problems: string[];
}

const csv = (text: string) => Buffer.from(text, 'utf8');

/** The rows of new-ingredients.csv as an .xlsx workbook, typed the way a spreadsheet program keeps them. */
async function workbookOfNewIngredients(): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet('Ingredients');
  ws.addRow([
    'ID',
    'Name',
    'Supplier',
    'Supplier Code',
    'Contains',
    'May Contain',
    'Composition',
    'Vegan',
    'Vegetarian',
    'g per ml',
    'Fat',
    'Salt',
  ]);
  ws.addRow([
    'pistachio-paste',
    'Pistachio paste',
    'Verdant Nut Co',
    'VN-PP1',
    'pistachio',
    'almond; hazelnut',
    'Roasted pistachios',
    'yes',
    'yes',
    null,
    52,
    0.02,
  ]);
  ws.addRow([
    'oat-drink',
    'Oat drink',
    'Hillfold Farm',
    'HF-OAT',
    'oats',
    'none',
    'Water, oats (10%), rapeseed oil, salt',
    'yes',
    'yes',
    1.03,
    1.5,
    { formula: '0.05*2', result: 0.1 },
  ]);
  ws.addRow([]);
  ws.addRow([
    'wildflower-honey',
    { richText: [{ text: 'Wildflower ' }, { text: 'honey', font: { bold: true } }] },
    'Coombe Apiaries',
    null,
    'none',
    null,
    'Honey',
    false,
    true,
    1.42,
    0,
    0,
  ]);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

describe('spreadsheet import of ingredients (real MariaDB)', () => {
  let t: TestApp;
  let chef: string;
  let counter: string;

  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    chef = await t.signIn('chef@example.com');
    counter = await t.signIn('counter@example.com');
  });
  afterAll(() => t.close());

  const send = async (url: string, bytes: Buffer, name: string, cookie = chef, fields: Record<string, string> = {}) => {
    const form = await multipart(fields, { name, bytes, type: 'text/csv' });
    return t.app.inject({ method: 'POST', url, payload: form.payload, headers: { ...form.headers, cookie } });
  };
  const preview = (bytes: Buffer, name = 'ingredients.csv', cookie = chef) => send('/api/ingredients/import/preview', bytes, name, cookie);
  /** Imports with the basis of a preview: one made just before, unless one is given. */
  const importFile = async (bytes: Buffer, name = 'ingredients.csv', cookie = chef, basis?: string) => {
    const seen = basis ?? (await preview(bytes, name, cookie)).json<{ basis?: string }>().basis ?? '';
    return send('/api/ingredients/import', bytes, name, cookie, { basis: seen });
  };
  const ingredients = async () =>
    (await t.app.inject({ method: 'GET', url: '/api/ingredients', headers: { cookie: chef } })).json<{ id: string; revision: number }[]>();
  const ingredient = (id: string) => t.app.inject({ method: 'GET', url: `/api/ingredients/${id}`, headers: { cookie: chef } });

  const expectedNew = [
    {
      row: 2,
      action: 'create',
      problems: [],
      ingredient: {
        id: 'pistachio-paste',
        name: 'Pistachio paste',
        supplier: 'Verdant Nut Co',
        supplierCode: 'VN-PP1',
        contains: ['pistachio'],
        mayContain: ['almond', 'hazelnut'],
        composition: 'Roasted pistachios',
        vegan: true,
        vegetarian: true,
        nutrition: { fat: 52, salt: 0.02 },
      },
    },
    {
      row: 3,
      action: 'create',
      problems: [],
      ingredient: {
        id: 'oat-drink',
        name: 'Oat drink',
        supplier: 'Hillfold Farm',
        supplierCode: 'HF-OAT',
        contains: ['oats'],
        mayContain: [],
        composition: 'Water, oats (10%), rapeseed oil, salt',
        vegan: true,
        vegetarian: true,
        gPerMl: 1.03,
        nutrition: { fat: 1.5, salt: 0.1 },
      },
    },
    {
      row: 5,
      action: 'create',
      problems: [],
      ingredient: {
        id: 'wildflower-honey',
        name: 'Wildflower honey',
        supplier: 'Coombe Apiaries',
        contains: [],
        mayContain: [],
        composition: 'Honey',
        vegan: false,
        vegetarian: true,
        gPerMl: 1.42,
        nutrition: { fat: 0, salt: 0 },
      },
    },
  ];

  it('previews a CSV of three new ingredients as create ×3, documents the columns, and saves nothing', async () => {
    const before = (await ingredients()).length;
    const res = await preview(fixture('new-ingredients.csv'));
    expect(res.statusCode).toBe(200);
    const body = res.json();
    expect(body.format).toBe('csv');
    expect(body.problems).toEqual([]);
    // Each row says what it was compared against: here, no ingredient had its id.
    expect(body.rows).toEqual(
      expectedNew.map((r) => ({
        ...r,
        idCell: r.ingredient.id,
        nameCell: r.ingredient.name,
        base: { revision: null, token: expect.stringMatching(/^0\.[\w-]{22}$/) },
      })),
    );
    expect(JSON.parse(body.basis)).toEqual(
      Object.fromEntries(body.rows.map((r: Row & { base: { token: string } }) => [String(r.row), r.base.token])),
    );
    expect(body.summary).toEqual({ create: 3, update: 0, unchanged: 0, withProblems: 0 });
    expect(body.columns.map((c: { header: string }) => c.header)).toEqual(
      expect.arrayContaining([
        'id',
        'name',
        'supplier',
        'supplier code',
        'contains',
        'may contain',
        'composition',
        'vegan',
        'vegetarian',
        'sulphites mg/kg',
        'g per ml',
        'g each',
        'fat',
        'saturates',
        'carbohydrate',
        'sugars',
        'fibre',
        'protein',
        'salt',
      ]),
    );
    expect(body.columns.find((c: { header: string }) => c.header === 'contains').description).toMatch(
      /'none' means .*verified none.*EMPTY cell means .*unknown/,
    );
    expect((await ingredients()).length).toBe(before);
  });

  it('previews the same rows from an .xlsx workbook', async () => {
    const res = await preview(await workbookOfNewIngredients(), 'ingredients.xlsx');
    expect(res.statusCode).toBe(200);
    expect(res.json()).toMatchObject({ format: 'xlsx', problems: [], rows: expectedNew, summary: { create: 3, withProblems: 0 } });
  });

  it('imports the CSV in one go; the ingredients are then listed at revision 1', async () => {
    const before = (await ingredients()).length;
    const res = await importFile(fixture('new-ingredients.csv'), 'new-ingredients.csv');
    expect(res.statusCode).toBe(200);
    expect(res.json()).toEqual({
      create: 3,
      update: 0,
      unchanged: 0,
      withProblems: 0,
      written: [
        { id: 'pistachio-paste', revision: 1 },
        { id: 'oat-drink', revision: 1 },
        { id: 'wildflower-honey', revision: 1 },
      ],
    });
    const list = await ingredients();
    expect(list.length).toBe(before + 3);
    expect((await ingredient('oat-drink')).json()).toMatchObject({ ...expectedNew[1].ingredient, revision: 1 });
    const history = (await t.app.inject({ method: 'GET', url: '/api/ingredients/oat-drink/revisions', headers: { cookie: chef } })).json();
    expect(history[0].note).toBe('Imported from new-ingredients.csv');

    const again = await preview(fixture('new-ingredients.csv'));
    expect(again.json().summary).toEqual({ create: 0, update: 0, unchanged: 3, withProblems: 0 });
  });

  it('names the row, column and value of each problem; the import refuses with 400 and saves nothing', async () => {
    const before = (await ingredients()).length;
    const res = await preview(fixture('ingredients-with-mistakes.csv'));
    expect(res.statusCode).toBe(200);
    const rows = res.json().rows as Row[];
    expect(rows[0]).toMatchObject({ row: 2, action: 'create', problems: [] });
    // The row is named by its id and name cells even though its other cells cannot be read.
    expect(rows[1]).toEqual({
      row: 3,
      idCell: 'praline',
      nameCell: 'Hazelnut praline',
      ingredient: null,
      action: 'create',
      base: { revision: null, token: expect.any(String) },
      problems: [
        "row 3, column contains: 'sugar' is not an allergen source. The sources are: wheat, rye, barley, oats, spelt, khorasan, triticale, almond, hazelnut, walnut, cashew, pecan, brazil-nut, pistachio, macadamia, pine-nut, coconut, peanut, soy, milk, egg, fish, crustacean, mollusc, celery, mustard, sesame, lupin, sulphites.",
        "row 3, column contains: 'hazlenut' is not an allergen source; did you mean 'hazelnut'?",
        "row 3, column vegan: 'maybe' is not yes, no or unknown.",
      ],
    });
    // Only the rows that can be imported are counted as new; the row with problems is counted apart.
    expect(res.json().summary).toEqual({ create: 1, update: 0, unchanged: 0, withProblems: 1 });

    const refused = await importFile(fixture('ingredients-with-mistakes.csv'));
    expect(refused.statusCode).toBe(400);
    expect(refused.json().code).toBe('validation');
    expect(refused.json().message).toMatch(/^Nothing was imported: 1 row needs attention \(row 3\)\. Row 3, column contains: 'sugar'/);
    expect(refused.json().fields).toContainEqual({ path: 'row 3', message: "row 3, column vegan: 'maybe' is not yes, no or unknown." });
    expect((await ingredients()).length).toBe(before);
    expect((await ingredient('rose-water')).statusCode).toBe(404);
  });

  it('reports an id that appears twice on each of its rows, and imports neither', async () => {
    const file = csv(
      'id,name,contains,vegan,vegetarian\nmalt-extract,Malt extract,barley,yes,yes\nflaky-salt,Flaky salt,none,yes,yes\nMalt-Extract,Malt extract (dark),barley,yes,yes\n',
    );
    const rows = (await preview(file)).json().rows as Row[];
    const problem = 'is on rows 2, 4; each ingredient may be on one row only.';
    expect(rows[0].problems).toEqual([`row 2, column id: 'malt-extract' ${problem}`]);
    expect(rows[1].problems).toEqual([]);
    expect(rows[2].problems).toEqual([
      "row 4, column id ('Malt-Extract'): Use lower-case letters, digits and hyphens, e.g. 'malt-extract'.",
      `row 4, column id: 'Malt-Extract' ${problem}`,
    ]);
    const before = (await ingredients()).length;
    const refused = await importFile(file);
    expect(refused.statusCode).toBe(400);
    expect(refused.json().message).toMatch(/2 rows need attention \(rows 2, 4\)/);
    expect((await ingredients()).length).toBe(before);
  });

  it('updates existing ingredients as new revisions, keeping fields the file has no column for', async () => {
    const butter = (await ingredient('butter')).json();
    const file = csv(
      'id,name,supplier,contains,may contain,vegan,vegetarian\n' +
        'caster-sugar,Caster sugar,Brackenridge Sugar Works,none,,yes,yes\n' +
        `butter,${butter.name},Pellow Creamery,milk,,no,yes\n`,
    );
    const body = (await preview(file)).json();
    expect(body.rows.map((r: Row) => [r.row, r.action])).toEqual([
      [2, 'unchanged'],
      [3, 'update'],
    ]);
    const res = await importFile(file);
    expect(res.statusCode).toBe(200);
    expect(res.json()).toEqual({
      create: 0,
      update: 1,
      unchanged: 1,
      withProblems: 0,
      written: [{ id: 'butter', revision: butter.revision + 1 }],
    });
    const after = (await ingredient('butter')).json();
    expect(after).toMatchObject({
      supplier: 'Pellow Creamery',
      revision: butter.revision + 1,
      nutrition: butter.nutrition,
      composition: butter.composition,
    });
    expect((await ingredient('caster-sugar')).json().revision).toBe(1);
  });

  it('refuses a row that would leave a recipe unweighable, naming that row and the column that would weigh it', async () => {
    const file = csv('id,name,contains,vegan,vegetarian,g per ml\nwhole-milk,Whole milk,milk,no,yes,\n');
    const rows = (await preview(file)).json().rows as Row[];
    expect(rows[0].action).toBe('update');
    expect(rows[0].problems).toEqual([
      expect.stringMatching(
        /^row 2, column g per ml: Line 1 of Vanilla pastry cream uses 'whole-milk' in 'ml', but Whole milk has no weight per millilitre/,
      ),
      expect.stringMatching(/^row 2, column g per ml: Line 5 of Vanilla sponge uses 'whole-milk' in 'ml'/),
    ]);
    expect((await importFile(file)).statusCode).toBe(400);
    expect((await ingredient('whole-milk')).json().gPerMl).toBeGreaterThan(0);
  });

  it('names problems with the header, a recipe id and out-of-range values', async () => {
    const body = (await preview(csv('id,name,contians,vegan,fat\nvanilla-sponge,Sponge,,yes,120\nbutter,Butter,,no,5\n'))).json();
    expect(body.problems).toEqual([
      expect.stringMatching(/^The column 'contians' is not one this import understands; did you mean 'contains'\?/),
    ]);
    expect(body.rows[0].problems).toEqual([
      "row 2, column id: 'vanilla-sponge' is already the id of the recipe 'vanilla-sponge'; give the ingredient an id of its own.",
      "row 2, column fat ('120'): Use a number no larger than 100.",
    ]);
    const stray = (await preview(csv('id,name,contains\nrose-water,Rose water,none,,milk\n'))).json();
    expect(stray.rows[0].problems).toEqual(["row 2, column E: 'milk' is under no header; name the column in row 1 or clear the cell."]);
    const refused = await importFile(csv('id,name,contians\nrose-water,Rose water,none\n'));
    expect(refused.statusCode).toBe(400);
    expect(refused.json().fields[0]).toMatchObject({ path: 'file' });
    expect((await ingredient('rose-water')).statusCode).toBe(404);
  });

  it('refuses a file that is neither CSV nor .xlsx, judged by its content', async () => {
    const pdf = await preview(fixture('almond-paste-spec.pdf'), 'ingredients.csv');
    expect(pdf.statusCode).toBe(400);
    expect(pdf.json().message).toBe(
      'Only CSV files and Excel workbooks (.xlsx) can be imported; this file is a PDF file (application/pdf).',
    );
    const latin1 = await preview(Buffer.from('id,name\ncr\xe8me,Cr\xe8me\n', 'latin1'));
    expect(latin1.statusCode).toBe(400);
    expect(latin1.json().message).toMatch(/not UTF-8 text/);
    const empty = await preview(Buffer.alloc(0));
    expect(empty.json().message).toBe('The file is empty.');
  });

  it('refuses the import when a row’s ingredient was saved after the preview, naming the row, who and when, and saves nothing; a new preview imports', async () => {
    const sugar = (await ingredient('caster-sugar')).json<IngredientView>();
    const file = csv(
      'id,name,supplier,contains,may contain,vegan,vegetarian\n' +
        'caster-sugar,Caster sugar,Fenwick Sugar Co,none,,yes,yes\n' +
        'rose-water,Rose water,Attar House,none,,yes,yes\n',
    );
    const seen = (await preview(file)).json<ImportPreview>();
    expect(seen.rows.map((r) => [r.row, r.action, r.base?.revision])).toEqual([
      [2, 'update', sugar.revision],
      [3, 'create', null],
    ]);

    // The manager saves the sugar between the preview and the import.
    const manager = await t.signIn('manager@example.com');
    const { revision, updatedAt: _u, ...body } = sugar;
    const saved = await t.app.inject({
      method: 'PUT',
      url: '/api/ingredients/caster-sugar',
      headers: { cookie: manager },
      payload: { ...body, supplierCode: 'BSW-9', baseRevision: revision },
    });
    expect(saved.statusCode).toBe(200);

    const before = await tableChecksums(t.sequelize);
    const refused = await importFile(file, 'ingredients.csv', chef, seen.basis);
    expect(refused.statusCode).toBe(409);
    const answer = refused.json<ApiErrorBody>();
    expect(answer.code).toBe('stale-preview');
    expect(answer.staleRows).toEqual([
      {
        row: 2,
        id: 'caster-sugar',
        previewRevision: sugar.revision,
        currentRevision: sugar.revision + 1,
        authorName: 'Maren Holloway',
        savedAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT/),
      },
    ]);
    expect(answer.message).toMatch(
      new RegExp(
        `^Nothing was imported: 1 row's ingredient changed since the preview\\. Row 2 \\(caster-sugar\\): Maren Holloway saved revision ${sugar.revision + 1} at .+ UTC\\. Preview the file again`,
      ),
    );
    expect(await tableChecksums(t.sequelize)).toEqual(before);
    expect((await ingredient('rose-water')).statusCode).toBe(404);

    // A new preview compares against the manager's revision; its import passes.
    const res = await importFile(file);
    expect(res.statusCode).toBe(200);
    expect(res.json<ImportResult>().written).toEqual([
      { id: 'caster-sugar', revision: sugar.revision + 2 },
      { id: 'rose-water', revision: 1 },
    ]);
  });

  it('refuses the import when an ingredient a row would create was created after the preview', async () => {
    const file = csv('id,name,contains,vegan,vegetarian\nlavender-sugar,Lavender sugar,none,yes,yes\n');
    const seen = (await preview(file)).json<ImportPreview>();
    expect(seen.rows[0]?.base).toEqual({ revision: null, token: expect.any(String) });
    const created = await t.app.inject({
      method: 'POST',
      url: '/api/ingredients',
      headers: { cookie: chef },
      payload: { id: 'lavender-sugar', name: 'Lavender sugar', contains: [], mayContain: [], vegan: true, vegetarian: true },
    });
    expect(created.statusCode).toBe(201);
    const refused = await importFile(file, 'ingredients.csv', chef, seen.basis);
    expect(refused.statusCode).toBe(409);
    expect(refused.json<ApiErrorBody>().staleRows).toEqual([
      expect.objectContaining({ row: 2, previewRevision: null, currentRevision: 1, authorName: 'Tobiah Quill' }),
    ]);
    expect(refused.json<ApiErrorBody>().message).toMatch(/Row 2 \(lavender-sugar\): Tobiah Quill created it at /);
  });

  it('refuses an import without the preview’s basis, or with one no preview gave, and saves nothing', async () => {
    const file = fixture('new-ingredients.csv');
    const before = await tableChecksums(t.sequelize);
    for (const [basis, names] of [
      ['', /^Preview the file first/],
      ['{"2": 5}', /^The basis is not the one a preview gives/],
      ['not json', /^The basis is not the one a preview gives/],
    ] as const) {
      const res = await importFile(file, 'ingredients.csv', chef, basis);
      expect(res.statusCode).toBe(400);
      expect(res.json<ApiErrorBody>()).toMatchObject({
        code: 'validation',
        message: expect.stringMatching(names),
        fields: [{ path: 'basis' }],
      });
    }
    expect(await tableChecksums(t.sequelize)).toEqual(before);
  });

  it('refuses front of house (403)', async () => {
    expect((await preview(fixture('new-ingredients.csv'), 'x.csv', counter)).statusCode).toBe(403);
    const res = await importFile(fixture('new-ingredients.csv'), 'x.csv', counter);
    expect(res.statusCode).toBe(403);
    expect(res.json()).toMatchObject({ code: 'forbidden' });
  });
  describe('the template', () => {
    const download = (ext: 'csv' | 'xlsx', cookie = chef) =>
      t.app.inject({ method: 'GET', url: `/api/ingredients/import/template.${ext}`, headers: { cookie } });
    const headers = IMPORT_COLUMNS.map((c) => c.header);
    // Filled in as a newcomer would: two new ingredients and a revision of the glucose syrup already in the library.
    const filled: Record<string, string>[] = [
      {
        id: 'hazelnut-praline',
        name: 'Hazelnut praline',
        contains: 'hazelnut; milk',
        'may contain': 'almond',
        vegan: 'no',
        vegetarian: 'yes',
      },
      {
        id: 'glucose-syrup',
        name: 'Glucose syrup',
        contains: 'wheat (glucose-syrup)',
        'may contain': 'none',
        vegan: 'yes',
        vegetarian: 'yes',
      },
      { id: 'rice-flour', name: 'Rice flour', contains: 'none', vegan: '', vegetarian: 'unknown', fat: '1,4' },
    ];
    const expectRows = (body: ImportPreview) => {
      expect(body.problems).toEqual([]);
      expect(
        body.rows.map((r) => ({ row: r.row, idCell: r.idCell, nameCell: r.nameCell, action: r.action, problems: r.problems })),
      ).toEqual([
        { row: 2, idCell: 'hazelnut-praline', nameCell: 'Hazelnut praline', action: 'create', problems: [] },
        { row: 3, idCell: 'glucose-syrup', nameCell: 'Glucose syrup', action: 'update', problems: [] },
        { row: 4, idCell: 'rice-flour', nameCell: 'Rice flour', action: 'create', problems: [] },
      ]);
      expect(body.rows[0].ingredient).toMatchObject({
        contains: ['hazelnut', 'milk'],
        mayContain: ['almond'],
        vegan: false,
        vegetarian: true,
      });
      expect(body.rows[1].ingredient).toMatchObject({
        contains: [{ source: 'wheat', form: 'glucose-syrup' }],
        mayContain: [],
        vegan: true,
      });
      // 'none' is a verified none; the empty cell and 'unknown' stay unknown.
      expect(body.rows[2].ingredient).toMatchObject({ contains: [], vegan: null, vegetarian: null, nutrition: { fat: 1.4 } });
      expect(body.summary).toEqual({ create: 2, update: 1, unchanged: 0, withProblems: 0 });
    };

    it('downloads as CSV: the header row of every column the import reads, nothing more', async () => {
      const res = await download('csv');
      expect(res.statusCode).toBe(200);
      expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
      expect(res.headers['content-disposition']).toBe('attachment; filename="crumbproof-ingredients-template.csv"');
      expect(res.body).toBe(`\uFEFF${headers.join(',')}\r\n`);
      const empty = (await preview(res.rawPayload, 'template.csv')).json<ImportPreview>();
      expect(empty.problems).toEqual(['The file has no ingredient rows under the header.']);
    });

    it('round trip: the CSV template with rows filled in previews as the rows say', async () => {
      const template = (await download('csv')).body;
      const lines = filled.map((row) => headers.map((h) => (/[,;]/.test(row[h] ?? '') ? `"${row[h]}"` : (row[h] ?? ''))).join(','));
      const res = await preview(Buffer.from(template + lines.join('\r\n'), 'utf8'), 'template.csv');
      expect(res.statusCode).toBe(200);
      expectRows(res.json<ImportPreview>());
    });

    it('downloads as XLSX, read back by the import’s own reader; filled in, it previews as the rows say', async () => {
      const res = await download('xlsx');
      expect(res.statusCode).toBe(200);
      expect(res.headers['content-type']).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
      expect(res.headers['content-disposition']).toBe('attachment; filename="crumbproof-ingredients-template.xlsx"');
      const wb = new ExcelJS.Workbook();
      await wb.xlsx.load(res.rawPayload as unknown as ArrayBuffer);
      const sheet = wb.worksheets[0];
      expect(sheet.name).toBe('Ingredients');
      expect((sheet.getRow(1).values as unknown[]).slice(1)).toEqual(headers);
      expect(sheet.rowCount).toBe(1);
      const help = wb.getWorksheet('Columns')!;
      expect(help.getRow(2).values).toEqual([undefined, IMPORT_COLUMNS[0].header, 'yes', IMPORT_COLUMNS[0].description]);
      for (const row of filled) sheet.addRow(headers.map((h) => row[h] ?? null));
      const upload = Buffer.from(await wb.xlsx.writeBuffer());
      const read = await preview(upload, 'template.xlsx');
      expect(read.statusCode).toBe(200);
      expect(read.json<ImportPreview>().format).toBe('xlsx');
      expectRows(read.json<ImportPreview>());
    });

    it('is for the kitchen: front of house is refused (403)', async () => {
      expect((await download('csv', counter)).statusCode).toBe(403);
      expect((await download('xlsx', counter)).statusCode).toBe(403);
    });
  });
});
