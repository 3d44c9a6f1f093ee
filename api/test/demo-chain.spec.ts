import type { AddressInfo } from 'node:net';
import {
  KITCHEN_HEADER,
  type BookFile,
  type CounterProductsView,
  type CounterQuestionView,
  type LabelRun,
  type ServedDeclaration,
} from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { DEMO_CHAIN } from '../src/database/seed.service';
import { pdfText } from './fixtures/pdf-text';
import { openStream } from './support/event-stream';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * The app's demo chain (demo-chain-book.json) as served: one recipe book declared, printed and
 * answered at the counter for each of its two kitchens, the request's kitchen named by the header
 * (or, for the events stream, `?kitchen=`). Wrenfield Lane Bakehouse (UK rules) handles sesame on
 * shared equipment; Saltmarsh Yard Café (EU rules) keeps it apart and bakes with its own flour.
 */
describe('the demo chain, kitchen by kitchen (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;
  let counter: string;
  let cafeCounter: string;
  let port: number;
  const kitchen = { bakehouse: 0, cafe: 0 };

  beforeAll(async () => {
    t = await startTestApp({ seed: DEMO_CHAIN });
    const sites = await t.sequelize.query<{ id: number; code: string }>('SELECT id, code FROM sites', { type: QueryTypes.SELECT });
    kitchen.bakehouse = sites.find((s) => s.code === 'wrenfield-lane')!.id;
    kitchen.cafe = sites.find((s) => s.code === 'saltmarsh-cafe')!.id;
    manager = await t.signIn('manager@example.com');
    counter = await t.signIn('counter@example.com');
    cafeCounter = await t.signIn('cafe@example.com');
    await t.app.listen(0, '127.0.0.1');
    port = (t.app.getHttpServer().address() as AddressInfo).port;
  });
  afterAll(() => t.close());

  const call = (method: 'GET' | 'POST' | 'PUT', url: string, cookie: string, at?: number, payload?: unknown) =>
    t.app.inject({
      method,
      url,
      headers: { cookie, ...(at !== undefined ? { [KITCHEN_HEADER]: String(at) } : {}) },
      ...(payload !== undefined ? { payload: payload as object } : {}),
    });
  const declared = async (code: string, at: number, query = '') => {
    const res = await call('GET', `/api/recipes/${code}/declaration${query}`, manager, at);
    expect(res.statusCode).toBe(200);
    return res.json<ServedDeclaration>();
  };
  const groups = (list: readonly { allergen: string }[]) => list.map((a) => a.allergen);

  it('declares one shared cake with a may-contain of sesame at the bakehouse and none at the café', async () => {
    const bakehouse = await declared('lemon-shortbread', kitchen.bakehouse);
    const cafe = await declared('lemon-shortbread', kitchen.cafe);
    expect(bakehouse.mayContain.find((m) => m.allergen === 'sesame')?.why).toEqual(['Sesame: shared equipment in this kitchen']);
    expect(groups(cafe.mayContain)).not.toContain('sesame');
    expect([bakehouse.claims['sesame-free'].status, cafe.claims['sesame-free'].status]).toEqual(['fails', 'ok']);
  });

  it('declares in each kitchen’s regime, and another regime gives another allergen list', async () => {
    const bakehouse = await declared('carrot-walnut-cake', kitchen.bakehouse);
    const cafe = await declared('carrot-walnut-cake', kitchen.cafe);
    const us = await declared('carrot-walnut-cake', kitchen.cafe, '?regime=US');
    expect([bakehouse.regime, cafe.regime, us.regime]).toEqual(['UK', 'EU', 'US']);
    expect(groups(cafe.contains)).toContain('gluten');
    expect(groups(us.contains)).toEqual(expect.arrayContaining(['wheat', 'tree-nuts']));
    expect(groups(us.contains)).not.toContain('gluten');
  });

  it('prints each kitchen’s labels from its own declaration and with its own settings', async () => {
    const print = async (at: number, body: object) => {
      const res = await call('POST', '/api/labels/runs', manager, at, body);
      expect(res.statusCode).toBe(201);
      return res.json<LabelRun>();
    };
    const pdf = async (run: LabelRun, at: number) => pdfText((await call('GET', `/api/labels/runs/${run.id}/pdf`, manager, at)).rawPayload);
    const unit = { template: 'product', items: [{ product: 'lemon-shortbread', quantity: 1 }], productionDate: '2026-12-02' };
    const atBakehouse = await print(kitchen.bakehouse, unit);
    const atCafe = await print(kitchen.cafe, unit);
    expect(atBakehouse.items[0].batch).toMatch(/^261202-LEMONS-1$/);
    expect(atCafe.items[0].batch).toMatch(/^SY261202-/);
    expect(await pdf(atBakehouse, kitchen.bakehouse)).toMatch(/may contain[^.]*sesame/i);
    expect(await pdf(atCafe, kitchen.cafe)).not.toMatch(/sesame/i);
    // Each kitchen's print log holds its own runs only.
    const log = async (at: number) => (await call('GET', '/api/labels/runs', manager, at)).json<LabelRun[]>().map((r) => r.id);
    expect(await log(kitchen.bakehouse)).toEqual([atBakehouse.id]);
    expect(await log(kitchen.cafe)).toEqual([atCafe.id]);
    expect((await call('GET', `/api/labels/runs/${atBakehouse.id}/pdf`, manager, kitchen.cafe)).statusCode).toBe(404);
    // Shipment labels: each kitchen's SSCCs start with its own extension digit, so none is printed at both.
    const shipment = {
      template: 'case',
      items: [{ product: 'lemon-shortbread', quantity: 1 }],
      productionDate: '2026-12-02',
      shipment: true,
    };
    const [bakehouseCase, cafeCase] = [await print(kitchen.bakehouse, shipment), await print(kitchen.cafe, shipment)];
    expect(bakehouseCase.items[0].sscc![0]).toMatch(/^09521234/);
    expect(cafeCase.items[0].sscc![0]).toMatch(/^19521234/);
  });

  it('answers each counter for its own kitchen: its products, their declarations and its own questions', async () => {
    const feed = async (cookie: string, at?: number) => {
      const res = await call('GET', '/api/counter/products', cookie, at);
      expect(res.statusCode).toBe(200);
      return res.json<CounterProductsView>();
    };
    const shop = await feed(counter);
    const cafe = await feed(cafeCounter);
    expect([shop.regime, shop.products.length, cafe.regime, cafe.products.length]).toEqual(['UK', 20, 'EU', 18]);
    const cake = (f: CounterProductsView) => f.products.find((p) => p.id === 'strawberry-layer-cake')!.declaration;
    expect(groups(cake(shop).mayContain)).toContain('sesame');
    expect(groups(cake(cafe).mayContain)).not.toContain('sesame');
    const pancakes = cafe.products.find((p) => p.id === 'blueberry-pancakes')!.declaration;
    expect(pancakes.claims.vegan.status).toBe('fails');
    expect(shop.products.map((p) => p.id)).not.toContain('blueberry-pancakes');
    // The café's counter cannot reach the bakehouse's.
    expect((await call('GET', '/api/counter/products', cafeCounter, kitchen.bakehouse)).statusCode).toBe(403);

    const asked = await call('POST', '/api/counter/questions', cafeCounter, undefined, { product: 'granola-pot', avoid: ['sesame'] });
    expect(asked.statusCode).toBe(201);
    const questions = async (at: number) =>
      (await call('GET', '/api/counter/questions', manager, at)).json<CounterQuestionView[]>().map((q) => q.product);
    expect(await questions(kitchen.cafe)).toEqual(['granola-pot']);
    expect(await questions(kitchen.bakehouse)).toEqual([]);
  });

  it('streams to each counter the events of its own kitchen, the kitchen named by ?kitchen= as an EventSource sends no header', async () => {
    const shop = await openStream(port, manager, `/api/counter/events?kitchen=${kitchen.bakehouse}`);
    const cafe = await openStream(port, cafeCounter, '/api/counter/events');
    try {
      expect([shop.response.statusCode, cafe.response.statusCode]).toEqual([200, 200]);
      const [shopSince, cafeSince] = [shop.text().length, cafe.text().length];
      const asked = await call('POST', '/api/counter/questions', counter, undefined, { product: 'seeded-rye-loaf', avoid: ['sesame'] });
      expect(asked.statusCode).toBe(201);
      const heard = await shop.next('question-asked', shopSince, 2000);
      expect(heard?.data).toMatchObject({ type: 'question-asked', product: 'seeded-rye-loaf' });
      expect(await cafe.next('question-asked', cafeSince, 700)).toBeNull();
      // The café's display of the day reaches the café's counter alone.
      const day = { date: '2026-12-02', products: ['granola-pot'] };
      expect((await call('PUT', '/api/counter/today', manager, kitchen.cafe, day)).statusCode).toBe(200);
      expect(await cafe.next('display-changed', cafeSince, 2000)).not.toBeNull();
      expect(await shop.next('display-changed', shopSince, 700)).toBeNull();
    } finally {
      shop.close();
      cafe.close();
    }
    const unnamed = await call('GET', '/api/counter/events', manager);
    expect(unnamed.statusCode).toBe(400);
    expect(unnamed.json().code).toBe('kitchen-required');
  });

  it('publishes each kitchen’s product page at its own address, and says in words that an address naming no kitchen is ambiguous', async () => {
    const book = (await call('GET', '/api/book', manager, kitchen.bakehouse)).json<BookFile>();
    const recipe = book.recipes.find((r) => r.id === 'lemon-shortbread')!;
    const { revision } = (await call('GET', '/api/recipes/lemon-shortbread', manager, kitchen.bakehouse)).json<{ revision: number }>();
    const saved = await call('PUT', '/api/recipes/lemon-shortbread', manager, kitchen.bakehouse, {
      ...recipe,
      sale: { ...recipe.sale, published: true },
      baseRevision: revision,
    });
    expect(saved.statusCode).toBe(200);
    for (const at of [kitchen.bakehouse, kitchen.cafe]) {
      const on = await call('PUT', '/api/public-page/settings', manager, at, { enabled: true, baseUrl: 'https://menu.example.com' });
      expect(on.statusCode).toBe(200);
    }
    const settings = async (at: number) =>
      (await call('GET', '/api/public-page/settings', manager, at)).json<{ kitchen: string }>().kitchen;
    expect([await settings(kitchen.bakehouse), await settings(kitchen.cafe)]).toEqual(['wrenfield-lane', 'saltmarsh-cafe']);
    const page = (url: string) => t.app.inject({ method: 'GET', url });
    const shop = await page('/p/wrenfield-lane/lemon-shortbread');
    const cafe = await page('/p/saltmarsh-cafe/lemon-shortbread');
    expect([shop.statusCode, cafe.statusCode]).toEqual([200, 200]);
    expect(shop.body).toContain('Wrenfield Lane Bakehouse');
    expect(shop.body).toMatch(/sesame/i);
    expect(cafe.body).toContain('Saltmarsh Yard Caf');
    expect(cafe.body).not.toMatch(/sesame/i);
    const ambiguous = await page('/p/lemon-shortbread');
    expect(ambiguous.statusCode).toBe(404);
    expect(ambiguous.body).toContain('names a product but not the kitchen it is made at');
    expect((await page('/p/nowhere/lemon-shortbread')).body).toContain('No product page here');
    // A counter ticket's QR code names the kitchen it was printed at.
    const { PublicPageService } = await import('../src/public-page/public-page.service');
    const { SiteRepository } = await import('../src/kitchen/site.repository');
    const cafeSite = (await t.app.get(SiteRepository).byId(kitchen.cafe))!;
    const urls = await t.app.get(PublicPageService).ticketUrls(cafeSite, [{ id: recipe.id, sale: { ...recipe.sale!, published: true } }]);
    expect(urls.get('lemon-shortbread')).toBe('https://menu.example.com/p/saltmarsh-cafe/lemon-shortbread');
  });

  it('records the daily review of supplier specifications for each kitchen, once a day each', async () => {
    const { SpecificationReviewsJob } = await import('../src/ingredients/specifications/specification-reviews.job');
    const job = t.app.get(SpecificationReviewsJob);
    const first = await job.run();
    expect(first.map((r) => [r.site.id, r.created])).toEqual([
      [kitchen.bakehouse, true],
      [kitchen.cafe, true],
    ]);
    expect((await job.run()).map((r) => r.created)).toEqual([false, false]);
    const runs = await t.sequelize.query<{ siteId: number }>('SELECT site_id AS siteId FROM specification_review_runs ORDER BY site_id', {
      type: QueryTypes.SELECT,
    });
    expect(runs.map((r) => r.siteId)).toEqual([kitchen.bakehouse, kitchen.cafe]);
  });
});
