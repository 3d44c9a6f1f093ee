import type { ApiErrorBody, ApprovalsView, Book, BookIngredient, CounterEvent, ImportPreview } from '@crumbproof/shared';
import { QueryTypes } from 'sequelize';
import { DATABASE_UNAVAILABLE_MESSAGE } from '../src/common/database-unavailable';
import { CounterChannel, POLL_MS } from '../src/counter/counter-channel';
import { CounterEvents } from '../src/counter/counter-events';
import { multipart } from './fixtures/forms';
import { tableChecksums } from './fixtures/table-checksums';
import { failInsert, type FaultKind } from './support/faults';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * The kitchen's compound writes (a recipe book import, a spreadsheet import, a swap, approvals)
 * are all or nothing: a fault half-way, after some of their rows were sent, answers an error in
 * words and leaves no trace: no table changed, no audit event, no mail queued, no counter event
 * (written in the write's own transaction, heard by every instance's open streams),
 * and the kitchen's book version where it was (so no reader keeps a copy of a state that never was).
 */
describe('a fault half-way through a write leaves no trace (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;
  let chef: string;
  const events: CounterEvent[] = [];
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    ({ manager, chef } = await t.signInDemo());
    // As an open counter does: every write that changes a declaration publishes an event here.
    await t.app.get(CounterEvents).subscribe((e) => events.push(e));
  });
  afterAll(() => t.close());

  const json = async (method: 'GET' | 'POST' | 'PUT', url: string, cookie: string, payload?: unknown) =>
    t.req(method, url, cookie, payload);
  const count = async (sql: string) => Number((await t.sequelize.query<{ n: number | bigint }>(sql, { type: QueryTypes.SELECT }))[0].n);

  /** Everything a write could leave behind. */
  async function trace() {
    // Counter events are written in the write's transaction, and heard here at the next read of them.
    await new Promise((r) => setTimeout(r, POLL_MS + 100));
    await t.app.get(CounterChannel).idle();
    return {
      tables: await tableChecksums(t.sequelize),
      auditEvents: await count('SELECT COUNT(*) AS n FROM audit_events'),
      mails: await count('SELECT COUNT(*) AS n FROM mail_outbox'),
      bookVersion: await count('SELECT book_version AS n FROM sites ORDER BY id LIMIT 1'),
      counterEvents: events.length,
      counterEventRows: await count('SELECT COUNT(*) AS n FROM counter_events'),
      book: (await json('GET', '/api/book', manager)).json<Book>(),
    };
  }

  const ANSWER: Record<FaultKind, ApiErrorBody> = {
    refused: { statusCode: 500, code: 'internal', message: 'Something went wrong on the server. It has been logged; try again.' },
    'connection-lost': { statusCode: 503, code: 'database-unavailable', message: DATABASE_UNAVAILABLE_MESSAGE },
  };

  /**
   * Sends the write with the nth row of `table` failing, and checks the answer and that nothing
   * changed; the fault must strike after rows before it were written (`after` of them).
   */
  async function faulted(
    send: () => Promise<{ statusCode: number; json<T>(): T; body: string }>,
    fault: { table: string; nth: number; kind: FaultKind },
  ) {
    const before = await trace();
    const injected = await failInsert(fault.table, fault.nth, fault.kind);
    // Sequelize warns on the console that the ROLLBACK of a lost connection failed (MariaDB rolls
    // the transaction back as the connection closes).
    const warned = jest.spyOn(console, 'warn').mockImplementation(() => undefined);
    let res;
    try {
      res = await send();
    } finally {
      warned.mockRestore();
    }
    const struck = await injected.struck();
    const seen = await injected.seen();
    await injected.remove();
    for (const [said] of warned.mock.calls) expect(String(said)).toMatch(/^Rolling back transaction .* failed/);
    expect({ struck, seen }).toEqual({ struck: true, seen: fault.nth - 1 });
    expect({ status: res.statusCode, body: res.json<ApiErrorBody>() }).toEqual({
      status: ANSWER[fault.kind].statusCode,
      body: ANSWER[fault.kind],
    });
    // Nothing internal reaches the person: not the fault's words, no stack, no SQL.
    expect(res.body).not.toMatch(/refused row|stack|\bat [\w.]+ \(|INSERT|Sequelize|SqlError|mariadb/i);
    expect(await trace()).toEqual(before);
  }

  /** The write succeeds once the fault is gone, and then leaves its traces: the checks above could fail. */
  async function succeeds(send: () => Promise<{ statusCode: number; body: string }>, status: number) {
    const before = await trace();
    const res = await send();
    expect({ status: res.statusCode, body: res.statusCode === status ? '' : res.body }).toEqual({ status, body: '' });
    const after = await trace();
    expect(after.auditEvents).toBe(before.auditEvents + 1);
    expect(after.bookVersion).toBeGreaterThan(before.bookVersion);
    expect(after.counterEvents).toBeGreaterThan(before.counterEvents);
    expect(after.counterEventRows).toBe(before.counterEventRows + after.counterEvents - before.counterEvents);
    expect(after.tables).not.toEqual(before.tables);
    return after;
  }

  const ingredient = (id: string, name: string): BookIngredient => ({
    id,
    name,
    contains: [],
    mayContain: [],
    composition: name,
    vegan: true,
    vegetarian: true,
  });

  it('imports a recipe book whole or not at all', async () => {
    const { site } = (await json('GET', '/api/book', manager)).json<Book>();
    const book: Book = {
      crumbproofBook: 1,
      site,
      ingredients: [
        ingredient('rose-syrup', 'Rose syrup'),
        ingredient('pistachio-crumb', 'Pistachio crumb'),
        ingredient('oat-base', 'Oat base'),
      ],
      recipes: [
        {
          id: 'rose-glaze',
          name: 'Rose glaze',
          lines: [
            { use: 'rose-syrup', qty: 100, unit: 'g' },
            { use: 'icing-sugar', qty: 200, unit: 'g' },
          ],
        },
        {
          id: 'rose-oat-bar',
          name: 'Rose oat bar',
          sale: { portionG: 60, claims: [], quid: [] },
          lines: [
            { use: 'oat-base', qty: 300, unit: 'g' },
            { use: 'rose-glaze', qty: 60, unit: 'g' },
            { use: 'pistachio-crumb', qty: 20, unit: 'g' },
          ],
        },
      ],
    };
    const send = () => json('POST', '/api/book/import', manager, book);
    await faulted(send, { table: 'ingredient_revisions', nth: 2, kind: 'refused' });
    await faulted(send, { table: 'recipe_revisions', nth: 2, kind: 'connection-lost' });
    await faulted(send, { table: 'audit_events', nth: 1, kind: 'refused' });
    // The counter's event is the write's last row: the whole import goes with it.
    await faulted(send, { table: 'counter_events', nth: 1, kind: 'refused' });
    const after = await succeeds(send, 200);
    expect(after.book.recipes.map((r) => r.id)).toEqual(expect.arrayContaining(['rose-glaze', 'rose-oat-bar']));
  });

  it('imports a spreadsheet of ingredients whole or not at all', async () => {
    const bytes = Buffer.from(
      'id,name,contains,vegan,vegetarian\nlavender-sugar,Lavender sugar,none,yes,yes\nhemp-seeds,Hemp seeds,none,yes,yes\nbarley-malt,Barley malt,barley,yes,yes\nsea-salt,Sea salt flakes,none,yes,yes\n',
      'utf8',
    );
    const upload = async (url: string, fields: Record<string, string> = {}) => {
      const form = await multipart(fields, { name: 'ingredients.csv', bytes, type: 'text/csv' });
      return t.app.inject({ method: 'POST', url, payload: form.payload, headers: { ...form.headers, cookie: chef } });
    };
    const seen = (await upload('/api/ingredients/import/preview')).json<ImportPreview>();
    expect(seen.summary).toMatchObject({ create: 3, update: 1 });
    const send = () => upload('/api/ingredients/import', { basis: seen.basis });
    await faulted(send, { table: 'ingredient_revisions', nth: 3, kind: 'refused' });
    await faulted(send, { table: 'ingredients', nth: 2, kind: 'connection-lost' });
    await faulted(send, { table: 'audit_events', nth: 1, kind: 'connection-lost' });
    await faulted(send, { table: 'counter_events', nth: 1, kind: 'connection-lost' });
    const after = await succeeds(send, 200);
    expect(after.book.ingredients.map((i) => i.id)).toEqual(expect.arrayContaining(['lavender-sugar', 'hemp-seeds', 'barley-malt']));
  });

  it('applies a swap to every recipe or to none', async () => {
    const uses = (await trace()).book.recipes.filter((r) => r.lines.some((l) => l.use === 'butter')).map((r) => r.id);
    expect(uses.length).toBeGreaterThan(2);
    const send = () => json('POST', '/api/swaps/apply', chef, { from: 'butter', to: 'plant-spread' });
    await faulted(send, { table: 'recipe_revisions', nth: 2, kind: 'refused' });
    await faulted(send, { table: 'recipe_revisions', nth: uses.length, kind: 'connection-lost' });
    await faulted(send, { table: 'counter_events', nth: 1, kind: 'refused' });
    const after = await succeeds(send, 200);
    expect(after.book.recipes.filter((r) => r.lines.some((l) => l.use === 'butter'))).toEqual([]);
  });

  it('approves every product asked for or none, with its mail', async () => {
    // Mustard in the sugar reaches every product: each waits, and its approval adds an allergen (a mail to everyone).
    const sugar = (await trace()).book.ingredients.find((i) => i.id === 'caster-sugar')!;
    const { revision } = (await json('GET', '/api/ingredients/caster-sugar', chef)).json<{ revision: number }>();
    const saved = await json('PUT', '/api/ingredients/caster-sugar', chef, {
      ...sugar,
      contains: [...(sugar.contains ?? []), 'mustard'],
      baseRevision: revision,
    });
    expect(saved.statusCode).toBe(200);
    // The list a manager reads before approving keeps every current declaration.
    const { pending } = (await json('GET', '/api/approvals', manager)).json<ApprovalsView>();
    expect(pending.length).toBeGreaterThan(2);
    const send = () =>
      json('POST', '/api/approvals', manager, { products: pending.map((p) => ({ product: p.product, inputHash: p.inputHash })) });
    await faulted(send, { table: 'product_approvals', nth: 2, kind: 'refused' });
    await faulted(send, { table: 'mail_outbox', nth: 1, kind: 'refused' });
    await faulted(send, { table: 'audit_events', nth: 1, kind: 'connection-lost' });
    await faulted(send, { table: 'counter_events', nth: 1, kind: 'refused' });
    const mails = await count('SELECT COUNT(*) AS n FROM mail_outbox');
    await succeeds(send, 201);
    expect(await count('SELECT COUNT(*) AS n FROM mail_outbox')).toBe(mails + 1);
    expect((await json('GET', '/api/approvals', manager)).json<ApprovalsView>().pending).toEqual([]);
  });

  it('answers saved for a write that is saved, even when keeping its declaration afterwards fails', async () => {
    const shortbread = (await trace()).book.recipes.find((r) => r.id === 'lemon-shortbread')!;
    const { revision } = (await json('GET', '/api/recipes/lemon-shortbread', chef)).json<{ revision: number }>();
    // The declaration of the new revision is kept after the commit: a failure there is no failure of the save.
    const injected = await failInsert('declarations', 1, 'refused');
    let res;
    try {
      res = await json('PUT', '/api/recipes/lemon-shortbread', chef, {
        ...shortbread,
        name: 'Lemon shortbread fingers',
        baseRevision: revision,
      });
    } finally {
      expect(await injected.struck()).toBe(true);
      await injected.remove();
    }
    expect(res.statusCode).toBe(200);
    expect((await json('GET', '/api/recipes/lemon-shortbread', chef)).json()).toMatchObject({
      revision: revision + 1,
      name: 'Lemon shortbread fingers',
    });
    // The declaration is worked out and kept at its next read.
    const declared = await json('GET', '/api/recipes/lemon-shortbread/declaration', chef);
    expect(declared.statusCode).toBe(200);
    expect(declared.json()).toMatchObject({ name: 'Lemon shortbread fingers' });
  });
});
