import { QueryTypes } from 'sequelize';
import { readAloud, type Book, type CounterProductsView, type RecipeView, type ServedDeclaration } from '@crumbproof/shared';
import { escapeHtml } from '../src/public-page/public-page-html';
import { pdfText } from './fixtures/pdf-text';
import type { Clock } from '../src/common/clock';
import { PAGES_PER_MINUTE, WINDOW_MS } from '../src/public-page/public-page-rate';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * The public product page on the real MariaDB with the demo kitchen: off until the manager turns
 * it on; a product's page only once the product is published; no sign-in; the declaration in the
 * counter's sentences and the caution, with nothing internal; the same 404 page in words for
 * every other address; the shipped font served; and a limit on how fast one address may read.
 */
describe('the public product page (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;
  let chef: string;
  let counter: string;
  let view: CounterProductsView;
  let product: RecipeView;
  let other: RecipeView;

  const page = (path: string, remoteAddress = '192.0.2.10') => t.app.inject({ method: 'GET', url: path, remoteAddress });
  /** Publishes the product, or not, in a save from its current revision (the one an editor would load now). */
  const publish = async (product: RecipeView, published: boolean | undefined) => {
    const { revision, updatedAt: _updatedAt, ...body } = await recipe(product.id);
    const sale = { ...body.sale!, published };
    if (published === undefined) delete sale.published;
    const res = await t.app.inject({
      method: 'PUT',
      url: `/api/recipes/${product.id}`,
      headers: { cookie: chef },
      payload: { ...body, sale, baseRevision: revision },
    });
    expect(res.statusCode).toBe(200);
  };
  const recipe = async (code: string): Promise<RecipeView> =>
    (await t.app.inject({ method: 'GET', url: `/api/recipes/${code}`, headers: { cookie: chef } })).json();
  const settings = (payload: Record<string, unknown>, cookie = manager) =>
    t.app.inject({ method: 'PUT', url: '/api/public-page/settings', headers: { cookie }, payload });

  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    ({ manager, chef, counter } = await t.signInDemo());
    view = (await t.app.inject({ method: 'GET', url: '/api/counter/products', headers: { cookie: counter } })).json();
    expect(view.products.length).toBeGreaterThan(1);
    product = await recipe(view.products[0].id);
    other = await recipe(view.products[1].id);
  });
  afterAll(() => t.close());

  it('is off in a new kitchen: the settings say so and a published product has no page', async () => {
    const got = await t.app.inject({ method: 'GET', url: '/api/public-page/settings', headers: { cookie: manager } });
    expect(got.json()).toEqual({ enabled: false, baseUrl: null, updatedAt: null, kitchen: null });
    await publish(product, true);
    const res = await page(`/p/${product.id}`);
    expect(res.statusCode).toBe(404);
    expect(res.body).toContain('No product page here');
    expect(res.body).not.toContain(product.name);
  });

  it('is turned on by the manager alone, with the address its QR codes point at', async () => {
    expect((await settings({ enabled: true, baseUrl: 'https://menu.example.com' }, chef)).statusCode).toBe(403);
    expect((await t.app.inject({ method: 'GET', url: '/api/public-page/settings', headers: { cookie: counter } })).statusCode).toBe(403);
    const refused = await settings({ enabled: true, baseUrl: null });
    expect(refused.statusCode).toBe(400);
    expect(refused.json().fields).toEqual([expect.objectContaining({ path: 'baseUrl' })]);
    const saved = await settings({ enabled: true, baseUrl: ' https://menu.example.com/ ' });
    expect(saved.statusCode).toBe(200);
    expect(saved.json()).toMatchObject({ enabled: true, baseUrl: 'https://menu.example.com' });
    const got = await t.app.inject({ method: 'GET', url: '/api/public-page/settings', headers: { cookie: manager } });
    expect(got.json()).toEqual(saved.json());
  });

  it('shows a published product without sign-in: the counter’s sentences and the caution, in plain HTML with no script', async () => {
    const res = await page(`/p/${product.id}`);
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(res.headers['cache-control']).toBe('no-store');
    // The app's own security headers hold on the page, and it needs nothing they forbid.
    expect(res.headers['content-security-policy']).toContain("script-src 'self'");
    expect(res.headers['x-frame-options']).toBe('DENY');
    expect(res.body).not.toMatch(/<script|javascript:|\son[a-z]+=/i);

    const declaration: ServedDeclaration = (
      await t.app.inject({ method: 'GET', url: `/api/recipes/${product.id}/declaration`, headers: { cookie: counter } })
    ).json();
    const said = readAloud(declaration, view.rules);
    expect(res.body).toContain(`<h1>${escapeHtml(product.name)}</h1>`);
    expect(res.body).toContain(escapeHtml('Wrenfield Lane Bakehouse'));
    for (const sentence of said.sentences) expect(res.body).toContain(escapeHtml(sentence));
    expect(res.body).toContain('/p/fonts/atkinson-hyperlegible-latin-400.woff2');
    // Small enough for a phone on a poor connection.
    expect(Buffer.byteLength(res.body)).toBeLessThan(16_000);
  });

  it('says nothing internal: no supplier, no id of what it is made from, no revision or quantity', async () => {
    const book: Book = (await t.app.inject({ method: 'GET', url: '/api/book', headers: { cookie: manager } })).json();
    const res = await page(`/p/${product.id}`);
    const text = res.body.replace(/<style>[\s\S]*<\/style>/, '');
    const suppliers = [...new Set(book.ingredients.map((i) => i.supplier).filter((s): s is string => Boolean(s)))];
    expect(suppliers.length).toBeGreaterThan(0);
    for (const supplier of suppliers) expect(text).not.toContain(escapeHtml(supplier));
    const below = [...book.ingredients.map((i) => i.id), ...book.recipes.filter((r) => r.id !== product.id).map((r) => r.id)];
    for (const id of below.filter((id) => id.includes('-'))) expect(text).not.toContain(id);
    expect(text).not.toMatch(/revision|portion|\d+(\.\d+)? ?g\b|kcal|kJ/i);
    expect(text).not.toContain(`/p/${product.id}`);
  });

  it('gives every other address the same page in words with 404: unpublished, not for sale, unknown, malformed', async () => {
    const intermediate = (await t.app.inject({ method: 'GET', url: '/api/recipes', headers: { cookie: chef } }))
      .json()
      .find((r: RecipeView) => !r.sale);
    expect(intermediate).toBeDefined();
    const pages = await Promise.all(
      [other.id, intermediate.id, 'no-such-cake', '%3Cscript%3Ealert(1)%3C%2Fscript%3E', 'x'.repeat(90), 'Vegan-Brownie'].map((code) =>
        page(`/p/${code}`),
      ),
    );
    for (const res of pages) {
      expect(res.statusCode).toBe(404);
      expect(res.headers['content-type']).toBe('text/html; charset=utf-8');
      expect(res.body).toContain('No product page here');
      expect(res.body).toBe(pages[0].body);
    }
  });

  it('stops showing a product once it is no longer published, and all of them once the page is off', async () => {
    await publish(other, true);
    expect((await page(`/p/${other.id}`)).statusCode).toBe(200);
    await publish(other, false);
    expect((await page(`/p/${other.id}`)).statusCode).toBe(404);
    await publish(other, undefined);
    expect((await recipe(other.id)).sale).not.toHaveProperty('published');

    expect((await settings({ enabled: false, baseUrl: 'https://menu.example.com' })).statusCode).toBe(200);
    expect((await page(`/p/${product.id}`)).statusCode).toBe(404);
    expect((await settings({ enabled: true, baseUrl: 'https://menu.example.com' })).statusCode).toBe(200);
    expect((await page(`/p/${product.id}`)).statusCode).toBe(200);
  });

  it('serves the shipped font as woff2, and nothing else from its folder', async () => {
    const font = await page('/p/fonts/atkinson-hyperlegible-latin-700.woff2');
    expect(font.statusCode).toBe(200);
    expect(font.headers['content-type']).toBe('font/woff2');
    expect(font.rawPayload.subarray(0, 4).toString('latin1')).toBe('wOF2');
    for (const path of ['/p/fonts/..%2F..%2Fpackage.json', '/p/fonts/atkinson-hyperlegible-latin-400-normal.woff', '/p/fonts/x']) {
      const res = await page(path);
      expect(res.statusCode).toBe(404);
      expect(res.body).toContain('No product page here');
    }
  });

  it('puts a QR code on the counter ticket of a published product only, while the page is on', async () => {
    const ticketText = async (code: string) => {
      const run = await t.app.inject({
        method: 'POST',
        url: '/api/labels/runs',
        headers: { cookie: chef },
        payload: { template: 'ticket', productionDate: '2026-12-02', items: [{ product: code, quantity: 1 }] },
      });
      expect(run.statusCode).toBe(201);
      const pdf = await t.app.inject({ method: 'GET', url: `/api/labels/runs/${run.json().id}/pdf`, headers: { cookie: chef } });
      return pdfText(pdf.rawPayload).replace(/\s+/g, ' ');
    };
    // The settings as the previous tests left them: on, with product published and other not.
    expect(await ticketText(product.id)).toContain('Allergens on your phone');
    expect(await ticketText(other.id)).not.toContain('Allergens on your phone');
    expect((await settings({ enabled: false, baseUrl: 'https://menu.example.com' })).statusCode).toBe(200);
    expect(await ticketText(product.id)).not.toContain('Allergens on your phone');
    expect((await settings({ enabled: true, baseUrl: 'https://menu.example.com' })).statusCode).toBe(200);
  });

  /** Moves the clocks to just after the start of a minute (the windows start on the minute), so a run of pages falls in one window. */
  const startOfMinute = (...clocks: Clock[]) => {
    const ahead = WINDOW_MS - (Date.now() % WINDOW_MS) + 50;
    for (const clock of clocks) {
      clock.reset();
      clock.advance(ahead);
    }
  };

  it(`lets one address read ${PAGES_PER_MINUTE} pages a minute, then says in words to wait`, async () => {
    startOfMinute(t.clock);
    const address = '198.51.100.7';
    const statuses: number[] = [];
    for (let i = 0; i < PAGES_PER_MINUTE; i++) statuses.push((await page(`/p/${i % 2 ? product.id : 'no-such-cake'}`, address)).statusCode);
    expect(statuses.filter((s) => s === 429)).toEqual([]);
    const refused = await page(`/p/${product.id}`, address);
    expect(refused.statusCode).toBe(429);
    expect(refused.body).toContain('Wait a minute and try again');
    // Another address reads on.
    expect((await page(`/p/${product.id}`, '198.51.100.8')).statusCode).toBe(200);
    // The next minute, the address reads again.
    t.clock.advance(WINDOW_MS);
    expect((await page(`/p/${product.id}`, address)).statusCode).toBe(200);
    t.clock.reset();
  });

  it('counts an address’s pages across two API instances over one database, and prunes past minutes', async () => {
    const { createApp } = await import('../src/app.factory');
    const { Clock: ClockClass } = await import('../src/common/clock');
    const b = await createApp({ logLevel: 'silent' });
    try {
      startOfMinute(t.clock, b.get(ClockClass));
      const address = '198.51.100.20';
      const statuses: number[] = [];
      for (let i = 0; i < PAGES_PER_MINUTE; i++) {
        const app = i % 2 ? b : t.app;
        statuses.push((await app.inject({ method: 'GET', url: `/p/${product.id}`, remoteAddress: address })).statusCode);
      }
      expect(statuses.filter((s) => s !== 200)).toEqual([]);
      // Half the pages went through each instance: both refuse the next one.
      for (const app of [t.app, b]) {
        const refused = await app.inject({ method: 'GET', url: `/p/${product.id}`, remoteAddress: address });
        expect(refused.statusCode).toBe(429);
        expect(refused.body).toContain('Wait a minute and try again');
      }
      const [{ hits }] = await t.sequelize.query<{ hits: number }>('SELECT hits FROM public_page_hits WHERE address = ?', {
        replacements: [address],
        type: QueryTypes.SELECT,
      });
      expect(Number(hits)).toBe(PAGES_PER_MINUTE + 2);
      // Two minutes on, the first page of the new window prunes the windows before the last one.
      t.clock.advance(2 * WINDOW_MS);
      expect((await page(`/p/${product.id}`, address)).statusCode).toBe(200);
      await new Promise((r) => setTimeout(r, 200));
      const windows = await t.sequelize.query<{ window_start: Date }>('SELECT window_start FROM public_page_hits WHERE address = ?', {
        replacements: [address],
        type: QueryTypes.SELECT,
      });
      expect(windows).toHaveLength(1);
    } finally {
      t.clock.reset();
      await b.close();
    }
  });
});
