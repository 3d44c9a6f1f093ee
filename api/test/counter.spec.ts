import type { AddressInfo } from 'node:net';
import type { Book, BookIngredient, CounterDayView, CounterProductsView, CounterQuestionView } from '@crumbproof/shared';
import { tableChecksums } from './fixtures/table-checksums';
import { openStream } from './support/event-stream';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * The counter's API on the real MariaDB with the demo kitchen: every product for sale with the
 * declaration its own route serves, the events stream read by a real HTTP client on a listening
 * port, the products on sale by day, and questions asked of the kitchen and answered.
 */

describe('the counter (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;
  let chef: string;
  let counter: string;
  let port: number;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    ({ manager, chef, counter } = await t.signInDemo());
    await t.app.listen(0, '127.0.0.1');
    port = (t.app.getHttpServer().address() as AddressInfo).port;
  });
  afterAll(() => t.close());

  const req: TestApp['req'] = (...args) => t.req(...args);
  const book = async () => (await req('GET', '/api/book', manager)).json<Book>();
  const counterTables = async () => {
    const all = await tableChecksums(t.sequelize);
    return { days: all.counter_days, questions: all.counter_questions };
  };
  const localToday = () => {
    const now = new Date();
    const pad = (n: number) => String(n).padStart(2, '0');
    return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
  };

  describe('GET /api/counter/products', () => {
    it('gives every product for sale with the declaration its own route serves, and one time for the set', async () => {
      const before = Date.now();
      const res = await req('GET', '/api/counter/products', counter);
      expect(res.statusCode).toBe(200);
      const feed = res.json<CounterProductsView>();
      const recipes = (await book()).recipes.filter((r) => r.sale);
      const forSale = recipes.map((r) => r.id);
      expect(feed.products.map((p) => p.id)).toEqual(forSale);
      expect(feed.products.map((p) => p.name)).toEqual(recipes.map((r) => r.name));
      expect([...forSale].sort()).toEqual([
        'apricot-walnut-loaf',
        'lemon-shortbread',
        'strawberry-layer-cake',
        'strawberry-tart',
        'vegan-brownie',
      ]);
      // Taken before the kitchen is read: no later than the answer, no earlier than the request.
      expect(Date.parse(feed.computedAt)).toBeGreaterThanOrEqual(before - 1000);
      expect(Date.parse(feed.computedAt)).toBeLessThanOrEqual(Date.now());
      expect(feed.date).toBe(localToday());
      // The lookup's groups are the kitchen's regime's list: the demo kitchen is in the UK, whose
      // list is the 14 of Regulation (EU) No 1169/2011 Annex II as assimilated in UK law, with the
      // nuts of its point 8 as finer sources a customer can pick one of.
      expect(feed.regime).toBe('UK');
      expect(feed.rules.groups.map((g) => g.code)).toHaveLength(14);
      expect(feed.rules.groups.find((g) => g.code === 'nuts')?.sources).toEqual(
        expect.arrayContaining(['almond', 'hazelnut', 'walnut', 'cashew', 'pecan', 'brazil-nut', 'pistachio', 'macadamia']),
      );
      expect(feed.rules.groups.find((g) => g.code === 'eggs')).toMatchObject({ label: expect.stringMatching(/egg/i), sources: ['egg'] });
      for (const product of feed.products) {
        const own = await req('GET', `/api/recipes/${product.id}/declaration`, counter);
        expect(own.statusCode).toBe(200);
        expect(product.declaration).toEqual(own.json());
      }
      const loaf = feed.products.find((p) => p.id === 'apricot-walnut-loaf')!;
      expect(loaf.declaration.contains.map((a) => a.allergen)).toEqual(expect.arrayContaining(['gluten', 'nuts', 'sesame']));
    });

    it('says which products are marked on sale today', async () => {
      const today = localToday();
      expect((await req('PUT', '/api/counter/today', chef, { date: today, products: ['vegan-brownie'] })).statusCode).toBe(200);
      const feed = (await req('GET', '/api/counter/products', counter)).json<CounterProductsView>();
      expect(feed.products.filter((p) => p.onSale).map((p) => p.id)).toEqual(['vegan-brownie']);
    });

    it('reads the kitchen in the same number of queries for 5 products as for 45 (no query per product)', async () => {
      // The fewest of three reads: on a loaded machine an instance that has not heard from the
      // database for a while reads the kitchen again (change-feed.ts), a query that says nothing
      // of the products; a query per product would show in every read.
      const count = async () => {
        await req('GET', '/api/counter/products', counter); // declares and keeps anything new
        const logging = t.sequelize.options.logging;
        const reads: { queries: number; products: number }[] = [];
        try {
          for (let n = 0; n < 3; n++) {
            let queries = 0;
            t.sequelize.options.logging = () => {
              queries++;
            };
            const res = await req('GET', '/api/counter/products', counter);
            expect(res.statusCode).toBe(200);
            reads.push({ queries, products: res.json<CounterProductsView>().products.length });
          }
        } finally {
          t.sequelize.options.logging = logging;
        }
        return { queries: Math.min(...reads.map((r) => r.queries)), products: reads[0].products };
      };
      const few = await count();
      const { site } = await book();
      const recipes = Array.from({ length: 40 }, (_, i) => ({
        id: `feed-bun-${i}`,
        name: `Feed bun ${i}`,
        lines: [
          { use: 'plain-flour', qty: 100, unit: 'g' },
          { use: 'butter', qty: 20 + i, unit: 'g' },
        ],
        sale: { portionG: 60 },
      }));
      const imported = await req('POST', '/api/book/import', manager, { crumbproofBook: 1, site, ingredients: [], recipes });
      expect(imported.statusCode).toBe(200);
      const many = await count();
      expect([few.products, many.products]).toEqual([5, 45]);
      expect(many.queries).toBe(few.queries);
    });
  });

  describe('GET /api/counter/events', () => {
    it('is a text/event-stream that tells of an ingredient change within a second, naming the products made with it', async () => {
      const stream = await openStream(port, counter);
      try {
        expect(stream.response.statusCode).toBe(200);
        expect(stream.response.headers['content-type']).toMatch(/^text\/event-stream/);
        const walnuts = (await book()).ingredients.find((i) => i.id === 'walnuts')!;
        const since = stream.text().length;
        const changed: BookIngredient = { ...walnuts, mayContain: [...walnuts.mayContain, 'hazelnut'] };
        const { revision } = (await req('GET', '/api/ingredients/walnuts', chef)).json<{ revision: number }>();
        const put = await req('PUT', '/api/ingredients/walnuts', chef, { ...changed, baseRevision: revision });
        expect(put.statusCode).toBe(200);
        const event = await stream.next('declarations-changed', since, 1000);
        expect(event).not.toBeNull();
        expect(event!.data).toEqual({ type: 'declarations-changed', products: ['apricot-walnut-loaf'] });
        // The feed already serves the new declaration.
        const feed = (await req('GET', '/api/counter/products', counter)).json<CounterProductsView>();
        const loaf = feed.products.find((p) => p.id === 'apricot-walnut-loaf')!;
        expect(JSON.stringify(loaf.declaration)).toMatch(/hazelnut/);
      } finally {
        stream.close();
      }
    });

    it('tells of a recipe saved and a book imported, naming the products they touch, and of new kitchen settings, naming none', async () => {
      const stream = await openStream(port, chef);
      try {
        const jam = (await book()).recipes.find((r) => r.id === 'strawberry-jam')!;
        let since = stream.text().length;
        const { revision } = (await req('GET', '/api/recipes/strawberry-jam', chef)).json<{ revision: number }>();
        expect(
          (await req('PUT', '/api/recipes/strawberry-jam', chef, { ...jam, name: 'Strawberry jam (set)', baseRevision: revision }))
            .statusCode,
        ).toBe(200);
        const saved = await stream.next('declarations-changed', since, 1000);
        // The jam itself is named too (a recipe saved may have just been taken off sale).
        expect(saved!.data.type).toBe('declarations-changed');
        expect([...(saved!.data.products as string[])].sort()).toEqual(['strawberry-jam', 'strawberry-layer-cake']);

        since = stream.text().length;
        expect((await req('PATCH', '/api/kitchen', manager, { regime: 'EU' })).statusCode).toBe(200);
        const settings = await stream.next('declarations-changed', since, 1000);
        expect(settings!.data).toEqual({ type: 'declarations-changed' });
        expect((await req('PATCH', '/api/kitchen', manager, { regime: 'UK' })).statusCode).toBe(200);

        // A book import that revises an ingredient names the products made with it.
        const { site, ingredients } = await book();
        const flaxseed = ingredients.find((i) => i.id === 'flaxseed')!;
        since = stream.text().length;
        const imported = await req('POST', '/api/book/import', manager, {
          crumbproofBook: 1,
          site,
          ingredients: [{ ...flaxseed, name: 'Golden flaxseed' }],
          recipes: [],
        });
        expect(imported.statusCode).toBe(200);
        expect((await stream.next('declarations-changed', since, 1000))!.data).toEqual({
          type: 'declarations-changed',
          products: ['vegan-brownie'],
        });
      } finally {
        stream.close();
      }
    });

    it('refuses a caller who is not signed in, and opens no stream', async () => {
      const res = await t.app.inject({ method: 'GET', url: '/api/counter/events' });
      expect(res.statusCode).toBe(401);
    });
  });

  describe('today’s display', () => {
    it('keeps the products on sale per day, and a past day can be looked up', async () => {
      const past = await req('PUT', '/api/counter/today', chef, { date: '2026-11-28', products: ['strawberry-tart', 'lemon-shortbread'] });
      expect(past.statusCode).toBe(200);
      expect((await req('PUT', '/api/counter/today', manager, { date: '2026-11-29', products: ['vegan-brownie'] })).statusCode).toBe(200);

      const day = (await req('GET', '/api/counter/today?date=2026-11-28', counter)).json<CounterDayView>();
      expect(day).toMatchObject({ date: '2026-11-28', products: ['strawberry-tart', 'lemon-shortbread'], setBy: 'Tobiah Quill' });
      expect(Number.isNaN(Date.parse(day.setAt!))).toBe(false);
      expect((await req('GET', '/api/counter/today?date=2026-11-29', counter)).json()).toMatchObject({
        products: ['vegan-brownie'],
        setBy: 'Maren Holloway',
      });
      expect((await req('GET', '/api/counter/today?date=2026-11-27', counter)).json()).toEqual({
        date: '2026-11-27',
        products: [],
        setBy: null,
        setAt: null,
      });

      // Marked again: the day's list is replaced, the other days stay.
      await req('PUT', '/api/counter/today', chef, { date: '2026-11-28', products: ['apricot-walnut-loaf'] });
      expect((await req('GET', '/api/counter/today?date=2026-11-28', counter)).json().products).toEqual(['apricot-walnut-loaf']);
      expect((await req('GET', '/api/counter/today?date=2026-11-29', counter)).json().products).toEqual(['vegan-brownie']);
    });

    it('gives today when no day is asked for', async () => {
      const res = await req('GET', '/api/counter/today', counter);
      expect(res.statusCode).toBe(200);
      expect(res.json().date).toBe(localToday());
    });

    it('tells open counters that a day was marked', async () => {
      const stream = await openStream(port, counter);
      try {
        const since = stream.text().length;
        await req('PUT', '/api/counter/today', chef, { date: '2026-11-30', products: ['strawberry-tart'] });
        expect((await stream.next('display-changed', since, 1000))!.data).toEqual({ type: 'display-changed', date: '2026-11-30' });
      } finally {
        stream.close();
      }
    });
  });

  describe('asking the kitchen', () => {
    it("tells the kitchen's open screens of a new question at once", async () => {
      const stream = await openStream(port, chef);
      try {
        const since = stream.text().length;
        const asked = await req('POST', '/api/counter/questions', counter, { product: 'vegan-brownie', avoid: ['nuts'] });
        expect(asked.statusCode).toBe(201);
        const event = await stream.next('question-asked', since, 1000);
        expect(event!.data).toEqual({ type: 'question-asked', question: asked.json<CounterQuestionView>().id, product: 'vegan-brownie' });
      } finally {
        stream.close();
      }
    });

    it('pushes nothing for a question refused (a sub-recipe is not for sale)', async () => {
      const stream = await openStream(port, chef);
      try {
        const since = stream.text().length;
        const refused = await req('POST', '/api/counter/questions', counter, { product: 'pastry-cream', avoid: ['nuts'] });
        expect(refused.statusCode).toBe(400);
        expect(await stream.next('question-asked', since, 500)).toBeNull();
      } finally {
        stream.close();
      }
    });

    it('records a question with who asked, shows it to the kitchen, and the counter sees the answer', async () => {
      const asked = await req('POST', '/api/counter/questions', counter, {
        product: 'strawberry-tart',
        avoid: ['eggs', 'sesame'],
        note: 'Customer asks about the glaze.',
      });
      expect(asked.statusCode).toBe(201);
      const question = asked.json<CounterQuestionView>();
      expect(question).toMatchObject({
        product: 'strawberry-tart',
        productName: expect.any(String),
        avoid: ['eggs', 'sesame'],
        note: 'Customer asks about the glaze.',
        askedBy: 'Priya Santangelo',
        answer: null,
      });
      expect(Math.abs(Date.parse(question.askedAt) - Date.now())).toBeLessThan(60_000);

      const open = (await req('GET', '/api/counter/questions?open=true', chef)).json<CounterQuestionView[]>();
      expect(open.map((q) => q.id)).toContain(question.id);

      const stream = await openStream(port, counter);
      try {
        const since = stream.text().length;
        const answered = await req('POST', `/api/counter/questions/${question.id}/answer`, chef, {
          answer: 'The glaze has no egg; the tart is baked where sesame is handled on shared equipment.',
        });
        expect(answered.statusCode).toBe(200);
        const event = await stream.next('question-answered', since, 1000);
        expect(event!.data).toEqual({ type: 'question-answered', question: question.id, product: 'strawberry-tart' });
      } finally {
        stream.close();
      }

      const all = (await req('GET', '/api/counter/questions', counter)).json<CounterQuestionView[]>();
      expect(all.find((q) => q.id === question.id)!.answer).toMatchObject({
        text: 'The glaze has no egg; the tart is baked where sesame is handled on shared equipment.',
        by: 'Tobiah Quill',
      });
      const stillOpen = (await req('GET', '/api/counter/questions?open=true', counter)).json<CounterQuestionView[]>();
      expect(stillOpen.map((q) => q.id)).not.toContain(question.id);

      // An answer stands: a second one is refused, naming the answer, and changes nothing.
      const before = await counterTables();
      const again = await req('POST', `/api/counter/questions/${question.id}/answer`, manager, { answer: 'Something else.' });
      expect(again.statusCode).toBe(409);
      expect(again.json().fields).toEqual([{ path: 'answer', message: expect.stringMatching(/answered already, by Tobiah Quill/) }]);
      expect(await counterTables()).toEqual(before);
    });
  });

  describe('who may do what', () => {
    it('refuses front of house setting today’s display or answering, and changes nothing', async () => {
      const asked = (await req('POST', '/api/counter/questions', counter, { product: 'vegan-brownie', avoid: ['milk'] })).json();
      const before = await counterTables();
      const set = await req('PUT', '/api/counter/today', counter, { date: '2026-11-28', products: ['vegan-brownie'] });
      expect(set.statusCode).toBe(403);
      expect(set.json()).toMatchObject({ code: 'forbidden' });
      const answer = await req('POST', `/api/counter/questions/${asked.id}/answer`, counter, { answer: 'It has no milk as recorded.' });
      expect(answer.statusCode).toBe(403);
      expect(await counterTables()).toEqual(before);
    });
  });

  describe('refusals name their field and change nothing', () => {
    it.each([
      ['PUT', '/api/counter/today', { date: '2026-11-31', products: [] }, /^date: 2026-11-31 is not a date that exists/m],
      ['PUT', '/api/counter/today', { date: '28/11/2026', products: [] }, /^date: Write the date as YYYY-MM-DD/m],
      ['PUT', '/api/counter/today', { date: '2026-11-28' }, /^products: /m],
      [
        'PUT',
        '/api/counter/today',
        { date: '2026-11-28', products: ['vegan-brownie', 'no-such-cake'] },
        /^products\.1: There is no product 'no-such-cake'/m,
      ],
      ['PUT', '/api/counter/today', { date: '2026-11-28', products: ['pastry-cream'] }, /^products\.0: .*not for sale/m],
      [
        'PUT',
        '/api/counter/today',
        { date: '2026-11-28', products: ['vegan-brownie', 'vegan-brownie'] },
        /^products: List each product once/m,
      ],
      ['PUT', '/api/counter/today', { date: '2026-11-28', products: ['Vegan-Brownie'] }, /^products\.0: Use lower-case letters/m],
      ['POST', '/api/counter/questions', { product: 'no-such-cake', avoid: ['eggs'] }, /^product: There is no product 'no-such-cake'/m],
      ['POST', '/api/counter/questions', { product: 'pastry-cream', avoid: ['eggs'] }, /^product: .*not for sale/m],
      ['POST', '/api/counter/questions', { product: 'vegan-brownie', avoid: ['chocolate'] }, /^avoid\.0: Unknown allergen 'chocolate'/m],
      ['POST', '/api/counter/questions', { product: 'vegan-brownie', avoid: [] }, /^avoid: Pick at least one allergen/m],
      [
        'POST',
        '/api/counter/questions',
        { product: 'vegan-brownie', avoid: ['eggs'], note: 'a\u0000b' },
        /^note: Leave out control characters/m,
      ],
      ['POST', '/api/counter/questions/999999/answer', { answer: 'Yes.' }, /There is no question 999999/],
      ['POST', '/api/counter/questions/1/answer', { answer: '   ' }, /^answer: Write the answer for the counter/m],
    ] as const)('%s %s %j', async (method, url, body, names) => {
      const before = await tableChecksums(t.sequelize);
      const res = await req(method, url, manager, body);
      expect(res.statusCode).toBeGreaterThanOrEqual(400);
      expect(res.statusCode).toBeLessThan(500);
      const got = res.json<{ message: string; fields?: { path: string; message: string }[] }>();
      const said = [got.message, ...(got.fields ?? []).map((f) => `${f.path}: ${f.message}`)].join('\n');
      expect(said).toMatch(names);
      expect(await tableChecksums(t.sequelize)).toEqual(before);
    });

    it.each([
      ['/api/counter/today?date=2026-13-01', /^date: /m],
      ['/api/counter/questions?open=yes', /^open: Write open as true or false/m],
      ['/api/counter/today?day=2026-11-28', /day/],
    ])('GET %s is refused naming its field', async (url, names) => {
      const res = await req('GET', url, counter);
      expect(res.statusCode).toBe(400);
      const got = res.json<{ message: string; fields?: { path: string; message: string }[] }>();
      expect([got.message, ...(got.fields ?? []).map((f) => `${f.path}: ${f.message}`)].join('\n')).toMatch(names);
    });
  });
});
