import { createHash } from 'node:crypto';
import { labelRunSchema, verifyGs1Key, type Book, type BookRecipe, type LabelRun } from '@crumbproof/shared';
import { formatPrintedAt } from '@crumbproof/shared/labels';
import { QueryTypes } from 'sequelize';
import { pdfText } from './fixtures/pdf-text';
import { tableChecksums } from './fixtures/table-checksums';
import { approveAll } from './support/approvals';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * Print runs on the real MariaDB: each run is logged with its PDF, the log is searched as a
 * recall searches it, batch codes and SSCC serials are given out once, every refused run says
 * which field is wrong and changes no table, and a revision no longer current is printed again
 * only with a manager's override and a reason.
 */
describe('label runs and the print log (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;
  let chef: string;
  let counter: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    ({ manager, chef, counter } = await t.signInDemo());
    const site = (await req('GET', '/api/book', manager)).json<Book>().site;
    // A product that claims to be vegan while it holds butter: its declaration has an error.
    const imported = await req('POST', '/api/book/import', manager, {
      crumbproofBook: 1,
      site,
      ingredients: [],
      recipes: [
        {
          id: 'false-vegan-biscuit',
          name: 'Butter biscuit said to be vegan',
          lines: [
            { use: 'plain-flour', qty: 200, unit: 'g' },
            { use: 'butter', qty: 100, unit: 'g' },
          ],
          sale: { portionG: 30, claims: ['vegan'], shelfLifeDays: 10, dateMark: 'best-before' },
        },
        {
          // Its id begins 'strawb', as the demo's strawberry tart's does.
          id: 'strawberry-tartlet',
          name: 'Strawberry tartlet',
          lines: [
            { use: 'plain-flour', qty: 100, unit: 'g' },
            { use: 'butter', qty: 50, unit: 'g' },
            { use: 'strawberries', qty: 80, unit: 'g' },
          ],
          sale: { portionG: 60, shelfLifeDays: 2, dateMark: 'use-by', storage: 'Keep refrigerated at 0–5 °C.' },
        },
      ],
    });
    expect(imported.statusCode).toBe(200);
    // Labels print only from an approved declaration.
    expect((await approveAll(t, manager)).sort()).toEqual(['false-vegan-biscuit', 'strawberry-tartlet']);
  });
  afterAll(() => t.close());

  const req: TestApp['req'] = (...args) => t.req(...args);
  const print = async (cookie: string, body: Record<string, unknown>) => {
    const res = await req('POST', '/api/labels/runs', cookie, body);
    expect({ status: res.statusCode, body: res.statusCode === 201 ? 'printed' : res.json() }).toEqual({ status: 201, body: 'printed' });
    return labelRunSchema.parse(res.json());
  };
  /** One product on product labels. */
  const printOne = (cookie: string, product: string, productionDate: string, quantity: number) =>
    print(cookie, { template: 'product', items: [{ product, quantity }], productionDate });
  const revisionOf = async (code: string) => (await req('GET', `/api/recipes/${code}`, chef)).json<{ revision: number }>().revision;
  const count = async (table: string) =>
    Number((await t.sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${table}\``, { type: QueryTypes.SELECT, plain: true }))!.n);

  it('logs a run with its PDF, its batch code from the kitchen’s pattern and its date from the shelf life', async () => {
    const run = await printOne(chef, 'vegan-brownie', '2026-12-02', 4);
    expect(run).toMatchObject({
      template: 'product',
      productionDate: '2026-12-02',
      printedBy: { name: 'Tobiah Quill' },
      override: null,
      current: true,
      items: [
        {
          product: 'vegan-brownie',
          name: 'Dark chocolate brownie (vegan)',
          revision: await revisionOf('vegan-brownie'),
          quantity: 4,
          // The demo kitchen's pattern {YY}{MM}{DD}-{P}-{N}: the first run of the product that day.
          batch: '261202-VEGANB-1',
          dateMark: 'best-before',
          // Produced 2 December, kept 7 days.
          date: '2026-12-09',
        },
      ],
    });
    const pdf = await req('GET', `/api/labels/runs/${run.id}/pdf`, chef);
    expect(pdf.statusCode).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.headers['content-disposition']).toMatch(/^attachment; filename="labels-run-\d+\.pdf"$/);
    expect(pdf.headers['content-security-policy']).toBe('sandbox');
    expect(pdf.rawPayload.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(createHash('sha256').update(pdf.rawPayload).digest('hex')).toBe(run.sha256);
    expect(pdf.rawPayload.length).toBe(run.pdfBytes);
    // What was logged is what was printed: the product, its batch code and its date in the UK's form.
    const text = pdfText(pdf.rawPayload);
    expect(text).toContain('Dark chocolate brownie (vegan)');
    expect(text).toContain('261202-VEGANB-1');
    expect(text).toContain('Best before 09.12.2026');
    expect(pdf.rawPayload.toString('latin1')).toMatch(/\/BaseFont \/[A-Z]{6}\+AtkinsonHyperlegible-Bold/);
    const declaration = (await req('GET', '/api/recipes/vegan-brownie/declaration', chef)).json<{ basis: { computedAt: string } }>();
    expect(run.items[0].basisComputedAt).toBe(declaration.basis.computedAt);
  });

  it('offers the templates with what each is for and whether it prints a batch code', async () => {
    const res = await req('GET', '/api/labels/templates', chef);
    expect(res.statusCode).toBe(200);
    const templates = res.json<{ id: string; purpose: string; printsBatch: boolean; blocks: unknown[] }[]>();
    expect(templates.map((x) => [x.id, x.purpose, x.printsBatch]).sort()).toEqual([
      ['case', 'case', true],
      ['chart', 'chart', false],
      ['product', 'unit', true],
      ['ticket', 'unit', false],
    ]);
    for (const x of templates) expect(x.blocks.length).toBeGreaterThan(0);
  });

  it('finds runs by product, by batch and by production day, newest first', async () => {
    const a = await printOne(chef, 'lemon-shortbread', '2026-11-20', 2);
    const b = await print(chef, {
      template: 'product',
      items: [
        { product: 'lemon-shortbread', quantity: 3 },
        { product: 'vegan-brownie', quantity: 1 },
      ],
      productionDate: '2026-11-21',
    });
    const c = await printOne(manager, 'vegan-brownie', '2026-11-21', 5);
    const search = async (query: string) => {
      const res = await req('GET', `/api/labels/runs?${query}`, chef);
      expect(res.statusCode).toBe(200);
      const runs = res.json<LabelRun[]>();
      expect(res.headers['x-total-count']).toBe(String(runs.length));
      return runs.map((r) => r.id);
    };
    const shortbread = await search('product=lemon-shortbread');
    expect(shortbread).toEqual([b.id, a.id]);
    expect(await search(`batch=${encodeURIComponent(b.items[1].batch)}`)).toEqual([b.id]);
    expect(b.items.map((i) => i.batch)).toEqual(['261121-LEMONS-1', '261121-VEGANB-1']);
    expect(c.items[0].batch).toBe('261121-VEGANB-2');
    expect(await search('from=2026-11-21&to=2026-11-21')).toEqual([c.id, b.id]);
    expect(await search('product=vegan-brownie&from=2026-11-01&to=2026-11-30')).toEqual([c.id, b.id]);
    expect(await search('product=lemon-shortbread&to=2026-11-20')).toEqual([a.id]);
    expect(await search('batch=261121-LEMONS-9')).toEqual([]);
    const bad = await req('GET', '/api/labels/runs?from=2026-02-30', chef);
    expect(bad.statusCode).toBe(400);
    expect(bad.json().fields).toEqual([expect.objectContaining({ path: 'from' })]);
  });

  it('gives two runs at once of one product and day different batch codes, and never one code to two products', async () => {
    const body = { template: 'product', items: [{ product: 'vegan-brownie', quantity: 1 }], productionDate: '2026-12-10' };
    const [x, y] = await Promise.all([print(chef, body), print(manager, body)]);
    expect([x.items[0].batch, y.items[0].batch].sort()).toEqual(['261210-VEGANB-1', '261210-VEGANB-2']);
    // The tart and the tartlet both begin STRAWB: the second product of the day skips the code the first has.
    const tart = await printOne(chef, 'strawberry-tart', '2026-12-10', 1);
    const tartlet = await printOne(chef, 'strawberry-tartlet', '2026-12-10', 1);
    expect(tart.items[0].batch).toBe('261210-STRAWB-1');
    expect(tartlet.items[0].batch).toBe('261210-STRAWB-2');
    const again = await printOne(chef, 'strawberry-tart', '2026-12-10', 1);
    expect(again.items[0].batch).toBe('261210-STRAWB-3');
    const shared = await t.sequelize.query(
      "SELECT batch FROM label_run_items GROUP BY site_id, batch HAVING batch <> '' AND COUNT(DISTINCT product_code, production_date) > 1",
      { type: QueryTypes.SELECT },
    );
    expect(shared).toEqual([]);
  });

  it('never gives one SSCC twice, whether runs come one after another or at once', async () => {
    const settings = await req('PUT', '/api/labels/settings', manager, {
      batchPattern: '{YY}{MM}{DD}-{P}-{N}',
      gs1CompanyPrefix: '9521234',
      ssccExtension: 3,
      caseIndicator: 1,
    });
    expect(settings.statusCode).toBe(200);
    const body = (quantity: number) => ({
      template: 'case',
      items: [{ product: 'lemon-shortbread', quantity }],
      productionDate: '2026-12-03',
      shipment: true,
    });
    const first = await print(manager, body(3));
    const [second, third] = await Promise.all([print(chef, body(2)), print(manager, body(4))]);
    const ranges = [first, second, third].map((r) => r.items[0].sscc!);
    const serials = ranges.flatMap(([from, to]) => {
      for (const s of [from, to]) {
        expect(verifyGs1Key(s, 'sscc')).toBeNull();
        expect(s.slice(0, 8)).toBe('39521234');
      }
      const [a, b] = [Number(from.slice(8, 17)), Number(to.slice(8, 17))];
      return Array.from({ length: b - a + 1 }, (_, k) => a + k);
    });
    // Each case's label carries its own SSCC, with the content GTIN and the count beside it.
    const text = pdfText((await req('GET', `/api/labels/runs/${first.id}/pdf`, manager)).rawPayload);
    for (const s of ranges[0]) expect(text).toContain(`(00)${s}`);
    expect(text).toContain('(02)09521234000020');
    expect(text).toContain('(37)24');
    expect(text.match(/\(00\)/g)).toHaveLength(3);
    expect(serials).toHaveLength(9);
    expect(new Set(serials).size).toBe(9);
    expect(ranges[0]).toEqual([expect.stringMatching(/^39521234000000001\d$/), expect.stringMatching(/^39521234000000003\d$/)]);
  });

  it('prints trade-item case labels with the case GTIN, and the allergen chart with each product’s revision', async () => {
    const cases = await print(chef, {
      template: 'case',
      items: [{ product: 'vegan-brownie', quantity: 2 }],
      productionDate: '2026-12-07',
      unitsPerCase: 10,
    });
    expect(cases.items[0]).toMatchObject({ batch: '261207-VEGANB-1', date: '2026-12-14', quantity: 2 });
    expect(cases.items[0].sscc).toBeUndefined();
    const text = pdfText((await req('GET', `/api/labels/runs/${cases.id}/pdf`, chef)).rawPayload);
    expect(text).toContain('(01)19521234000034');
    expect(text).toContain('(15)261214');
    expect(text).toContain('(10)261207-VEGANB-1');
    const chart = await print(manager, {
      template: 'chart',
      items: [
        { product: 'vegan-brownie', quantity: 1 },
        { product: 'lemon-shortbread', quantity: 1 },
      ],
      productionDate: '2026-12-07',
    });
    // The chart carries no batch code, so none is given out for it.
    expect(chart.items.map((i) => i.batch)).toEqual(['', '']);
    const chartText = pdfText((await req('GET', `/api/labels/runs/${chart.id}/pdf`, manager)).rawPayload);
    // The time the chart prints is the time the log keeps.
    expect(chartText).toContain(`Printed ${formatPrintedAt(chart.printedAt)}`);
    // Each product with the revision it was printed from (a long name may break over two lines).
    expect(chartText).toContain(`Dark chocolate brownie (vegan) revision ${await revisionOf('vegan-brownie')}`);
    expect(chartText).toMatch(new RegExp(`lemon shortbread revision ${await revisionOf('lemon-shortbread')}`));
  });

  describe('a refused run says which field is wrong and changes no table', () => {
    const cases: [what: string, body: Record<string, unknown>, status: number, path: string, says: RegExp][] = [
      [
        'a product whose declaration has an error',
        { template: 'product', items: [{ product: 'false-vegan-biscuit', quantity: 2 }], productionDate: '2026-12-04' },
        422,
        'items.0.product',
        /vegan/i,
      ],
      [
        'a production date that does not exist',
        { template: 'product', items: [{ product: 'vegan-brownie', quantity: 2 }], productionDate: '2026-02-30' },
        400,
        'productionDate',
        /not a date that exists/,
      ],
      [
        'a count of zero',
        { template: 'product', items: [{ product: 'vegan-brownie', quantity: 0 }], productionDate: '2026-12-04' },
        400,
        'items.0.quantity',
        /at least 1/,
      ],
      [
        'a batch code with characters outside GS1’s character set 82',
        { template: 'product', items: [{ product: 'vegan-brownie', quantity: 2 }], productionDate: '2026-12-04', batch: 'LOT #7' },
        400,
        'batch',
        /character set 82.*a space.*'#'/,
      ],
      [
        'a template that does not exist',
        { template: 'poster', items: [{ product: 'vegan-brownie', quantity: 2 }], productionDate: '2026-12-04' },
        400,
        'template',
        /no label template 'poster'/,
      ],
      [
        'a product that does not exist',
        { template: 'product', items: [{ product: 'no-such-cake', quantity: 2 }], productionDate: '2026-12-04' },
        400,
        'items.0.product',
        /no product 'no-such-cake'/,
      ],
      [
        'a batch code already given to another product',
        {
          template: 'product',
          items: [{ product: 'lemon-shortbread', quantity: 2 }],
          productionDate: '2026-12-02',
          batch: '261202-VEGANB-1',
        },
        409,
        'batch',
        /already the batch of 'vegan-brownie'/,
      ],
    ];
    it.each(cases)('%s', async (_what, body, status, path, says) => {
      const before = await tableChecksums(t.sequelize);
      const res = await req('POST', '/api/labels/runs', chef, body);
      expect(res.statusCode).toBe(status);
      const field = res.json<{ fields?: { path: string; message: string }[] }>().fields?.find((f) => f.path === path);
      expect(field?.message).toMatch(says);
      expect(await tableChecksums(t.sequelize)).toEqual(before);
    });

    it('a unit GTIN with a wrong check digit is refused when the product is saved, naming the field', async () => {
      const book = (await req('GET', '/api/book', chef)).json<Book>();
      const brownie = book.recipes.find((r) => r.id === 'vegan-brownie')!;
      // The print details go in and out with the recipe book.
      expect(brownie.sale).toMatchObject({
        shelfLifeDays: 7,
        dateMark: 'best-before',
        gtin: '9521234000037',
        caseGtin: '19521234000034',
        unitsPerCase: 12,
      });
      const before = await tableChecksums(t.sequelize);
      // 952123400003 has the check digit 7 (GS1 modulo 10); 4 is wrong.
      const res = await req('PUT', '/api/recipes/vegan-brownie', chef, {
        ...brownie,
        sale: { ...brownie.sale, gtin: '9521234000034' },
        baseRevision: await revisionOf('vegan-brownie'),
      });
      expect(res.statusCode).toBe(400);
      expect(res.json().fields).toEqual([expect.objectContaining({ path: 'sale.gtin', message: expect.stringMatching(/should be 7/) })]);
      expect(await tableChecksums(t.sequelize)).toEqual(before);
    });
  });

  it('front of house neither prints nor reads the log', async () => {
    const before = await tableChecksums(t.sequelize);
    const body = { template: 'product', items: [{ product: 'vegan-brownie', quantity: 1 }], productionDate: '2026-12-05' };
    for (const [method, url, payload] of [
      ['POST', '/api/labels/runs', body],
      ['GET', '/api/labels/runs', undefined],
      ['GET', '/api/labels/runs/1/pdf', undefined],
      ['GET', '/api/labels/templates', undefined],
      ['GET', '/api/labels/settings', undefined],
      ['PUT', '/api/labels/settings', { batchPattern: '{YY}{MM}{DD}-{P}-{N}', gs1CompanyPrefix: null, ssccExtension: 0, caseIndicator: 1 }],
    ] as const) {
      const res = await req(method, url, counter, payload);
      expect({ url, status: res.statusCode }).toEqual({ url, status: 403 });
    }
    expect(await tableChecksums(t.sequelize)).toEqual(before);
  });

  it('prints a revision no longer current again only with a manager’s override and a reason', async () => {
    const revision = await revisionOf('lemon-shortbread');
    const first = await print(chef, {
      template: 'product',
      items: [{ product: 'lemon-shortbread', quantity: 6, revision }],
      productionDate: '2026-12-06',
    });
    const book = (await req('GET', '/api/book', chef)).json<Book>();
    const shortbread = book.recipes.find((r) => r.id === 'lemon-shortbread')!;
    const changed: BookRecipe = { ...shortbread, sale: { ...shortbread.sale!, storage: 'Store in an airtight tin.' } };
    expect((await req('PUT', '/api/recipes/lemon-shortbread', chef, { ...changed, baseRevision: revision })).statusCode).toBe(200);
    expect(await revisionOf('lemon-shortbread')).toBe(revision + 1);
    const logged = (await req('GET', `/api/labels/runs?product=lemon-shortbread&from=2026-12-06&to=2026-12-06`, chef)).json<LabelRun[]>();
    expect(logged.map((r) => [r.id, r.current])).toEqual([[first.id, false]]);

    const again = {
      template: 'product',
      items: [{ product: 'lemon-shortbread', quantity: 2, revision }],
      productionDate: '2026-12-06',
      batch: first.items[0].batch,
    };
    const reason = 'Six labels were spoiled in the printer; the biscuits were made under the earlier recipe.';
    const refusals: [who: string, cookie: string, body: Record<string, unknown>, status: number, path: string][] = [
      ['a pastry chef without an override', chef, again, 409, 'items.0.revision'],
      ['a manager without an override', manager, again, 409, 'items.0.revision'],
      ['a pastry chef with an override', chef, { ...again, override: { reason } }, 403, 'override'],
      ['a manager with too short a reason', manager, { ...again, override: { reason: 'spoiled' } }, 400, 'override.reason'],
      [
        'a manager overriding a current revision',
        manager,
        { ...again, items: [{ product: 'lemon-shortbread', quantity: 2 }], override: { reason } },
        400,
        'override',
      ],
    ];
    for (const [who, cookie, body, status, path] of refusals) {
      const before = await tableChecksums(t.sequelize);
      const res = await req('POST', '/api/labels/runs', cookie, body);
      expect({ who, status: res.statusCode, paths: res.json().fields?.map((f: { path: string }) => f.path) }).toEqual({
        who,
        status,
        paths: [path],
      });
      expect(await tableChecksums(t.sequelize)).toEqual(before);
    }

    const reprint = await print(manager, { ...again, override: { reason } });
    expect(reprint).toMatchObject({
      override: { reason },
      current: false,
      printedBy: { name: 'Maren Holloway' },
      items: [
        {
          product: 'lemon-shortbread',
          revision,
          quantity: 2,
          batch: first.items[0].batch,
          basisComputedAt: first.items[0].basisComputedAt,
          date: first.items[0].date,
        },
      ],
    });
    const runs = await count('label_runs');
    // The current revision prints without an override.
    const current = await printOne(chef, 'lemon-shortbread', '2026-12-06', 1);
    expect(current).toMatchObject({ current: true, override: null, items: [{ revision: revision + 1 }] });
    expect(await count('label_runs')).toBe(runs + 1);
  });

  it('keeps the kitchen’s label settings, refusing a pattern that cannot make a batch code', async () => {
    const before = await tableChecksums(t.sequelize);
    const bad = await req('PUT', '/api/labels/settings', manager, {
      batchPattern: '{YYYY}{MM}{DD}-{P}-{P}-{NNN}',
      gs1CompanyPrefix: null,
      ssccExtension: 0,
      caseIndicator: 1,
    });
    expect(bad.statusCode).toBe(400);
    expect(bad.json().fields).toEqual([expect.objectContaining({ path: 'batchPattern', message: expect.stringMatching(/20 characters/) })]);
    expect(await tableChecksums(t.sequelize)).toEqual(before);
    const chefPut = await req('PUT', '/api/labels/settings', chef, {
      batchPattern: '{JJJ}{N}',
      gs1CompanyPrefix: null,
      ssccExtension: 0,
      caseIndicator: 1,
    });
    expect(chefPut.statusCode).toBe(403);
    const good = { batchPattern: 'L{YY}{JJJ}{NN}', gs1CompanyPrefix: '9521234', ssccExtension: 3, caseIndicator: 2 };
    expect((await req('PUT', '/api/labels/settings', manager, good)).json()).toEqual(good);
    expect((await req('GET', '/api/labels/settings', chef)).json()).toEqual(good);
    const run = await printOne(chef, 'vegan-brownie', '2026-02-01', 1);
    expect(run.items[0].batch).toBe('L2603201');
  });
});
