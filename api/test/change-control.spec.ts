import type { ParsedMail } from 'mailparser';
import type { ApprovalsView, AuditPage, Book, BookRecipe, CounterProductsView, LabelRun, ReviewsDue, StaleLabel } from '@crumbproof/shared';
import type { Clock } from '../src/common/clock';
import { fixture, multipart } from './fixtures/forms';
import { startFakeSmtp, type FakeSmtp } from './support/fake-smtp';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * Change control as one kitchen lives it, on the real MariaDB with a mail server in this process:
 * a supplier's reformulation reaches a shared sub-recipe, every product above it waits for the
 * manager (who is mailed), the labels printed before stay listed out of date once the change is
 * approved, and nothing prints until it is; two people saving one recipe never overwrite each
 * other; a specification comes due for review; a new colleague's invitation works once; and the
 * audit trail holds every step. The steps run in order and build on each other.
 */

const DAY = 24 * 60 * 60_000;
let smtp: FakeSmtp;
let t: TestApp;
let clock: Clock;
let manager: string;
let chef: string;
let counter: string;
/** The moment the scenario starts: the audit trail is read from here. */
let startedAt: string;

beforeAll(async () => {
  smtp = await startFakeSmtp();
  t = await startTestApp({ seed: true, mail: smtp });
  clock = t.clock;
  ({ manager, chef, counter } = await t.signInDemo());
  startedAt = new Date().toISOString();
});
afterAll(async () => {
  await t?.close();
  await smtp?.close();
});

const req: TestApp['req'] = (...args) => t.req(...args);

/** Sends what is due now and waits until the sender is done, then the mails that reached the server. */
async function delivered(match: (m: ParsedMail) => boolean): Promise<ParsedMail[]> {
  await t.sendDueMail();
  return smtp.mails.filter(match);
}
const to = (m: ParsedMail) => (Array.isArray(m.to) ? m.to : m.to ? [m.to] : []).flatMap((a) => a.value.map((v) => v.address ?? '')).sort();

const book = async () => (await req('GET', '/api/book', manager)).json<Book>();
/** A recipe as its editor loads it: the book's item, and the revision a save starts from. */
const recipe = async (code: string) => {
  const { updatedAt: _updatedAt, ...loaded } = (await req('GET', `/api/recipes/${code}`, chef)).json<
    BookRecipe & { revision: number; updatedAt: string }
  >();
  return loaded;
};
const pending = async () => (await req('GET', '/api/approvals', manager)).json<ApprovalsView>().pending;
const print = (cookie: string, products: string[]) =>
  req('POST', '/api/labels/runs', cookie, {
    template: 'ticket',
    items: products.map((product) => ({ product, quantity: 3 })),
    productionDate: '2026-12-02',
  });
const stale = async () => (await req('GET', '/api/labels/stale', manager)).json<StaleLabel[]>();

/** Products for sale above an item at any depth, worked out here from the book as exported. */
function productsAbove(b: Book, id: string): string[] {
  const found = new Set<string>();
  const walk = (x: string) => {
    for (const r of b.recipes)
      if (r.lines.some((l) => l.use === x) && !found.has(r.id)) {
        found.add(r.id);
        walk(r.id);
      }
  };
  walk(id);
  return b.recipes.filter((r) => r.sale && found.has(r.id)).map((r) => r.id);
}

const SPONGE = 'vanilla-sponge';

describe('change control, one scenario (real MariaDB, mail server in this process)', () => {
  it('1. a second product on the shared sponge, three layers down, is approved before anything prints', async () => {
    const fingers = await req('POST', '/api/recipes', chef, {
      id: 'sponge-fingers',
      name: 'Sponge fingers',
      lines: [
        { use: SPONGE, qty: 400, unit: 'g' },
        { use: 'icing-sugar', qty: 20, unit: 'g' },
      ],
    });
    expect(fingers.statusCode).toBe(201);
    const trifle = await req('POST', '/api/recipes', chef, {
      id: 'trifle-cup',
      name: 'Strawberry trifle cup',
      lines: [
        { use: 'sponge-fingers', qty: 120, unit: 'g' },
        { use: 'strawberry-jam', qty: 60, unit: 'g' },
      ],
      sale: { portionG: 180 },
    });
    expect(trifle.statusCode).toBe(201);

    // Never approved: it waits, and its labels do not print.
    const first = await pending();
    expect(first.map((p) => [p.product, p.reason])).toEqual([['trifle-cup', 'first-approval']]);
    const refused = await print(chef, ['trifle-cup']);
    expect(refused.statusCode).toBe(409);
    expect(refused.json()).toMatchObject({ code: 'approval-needed' });
    expect(refused.json().message).toMatch(/Strawberry trifle cup.*a manager approves it in Approvals first/);

    // The pastry chef cannot approve; the manager approves what was seen.
    const body = { products: first.map((p) => ({ product: p.product, inputHash: p.inputHash })) };
    expect((await req('POST', '/api/approvals', chef, body)).statusCode).toBe(403);
    expect((await req('POST', '/api/approvals', manager, body)).statusCode).toBe(201);
    expect(await pending()).toEqual([]);
  });

  let printed: LabelRun;
  it('2. the approved products print', async () => {
    const res = await print(chef, ['trifle-cup']);
    expect(res.statusCode).toBe(201);
    printed = res.json<LabelRun>();
    expect(printed.items.map((i) => i.product)).toEqual(['trifle-cup']);
    expect(await stale()).toEqual([]);
  });

  it('3. almonds in the shared sponge send every product above it to approval, and mail the managers', async () => {
    const almonds = await req('POST', '/api/ingredients', chef, {
      id: 'flaked-almonds',
      name: 'Flaked almonds',
      supplier: 'Invented Nut Mill',
      contains: ['almond'],
      mayContain: [],
      vegan: true,
      vegetarian: true,
    });
    expect(almonds.statusCode).toBe(201);
    // An ingredient that nothing uses yet changes no declaration.
    expect(await pending()).toEqual([]);

    const mailsBefore = (await delivered((m) => (m.subject ?? '').toLowerCase().includes('approv'))).length;
    const sponge = await recipe(SPONGE);
    const { revision, ...body } = sponge;
    const saved = await req('PUT', `/api/recipes/${SPONGE}`, chef, {
      ...body,
      lines: [...body.lines, { use: 'flaked-almonds', qty: 60, unit: 'g' }],
      baseRevision: revision,
    });
    expect(saved.statusCode).toBe(200);

    const above = productsAbove(await book(), SPONGE);
    expect(above.sort()).toEqual(['strawberry-layer-cake', 'trifle-cup']);
    const waiting = await pending();
    expect(waiting.map((p) => p.product).sort()).toEqual(above.sort());
    for (const p of waiting) {
      expect(p.reason).toBe('changed');
      expect(p.addsAllergen).toBe(true);
      expect(p.words.join(' ')).toMatch(/almond/i);
      expect(p.causes.map((c) => c.summary).join(' ')).toContain('Vanilla sponge');
    }

    // The counter answers from the new recipe at once, flagged, rather than wait for the manager.
    const feed = (await req('GET', '/api/counter/products', counter)).json<CounterProductsView>();
    const cup = feed.products.find((p) => p.id === 'trifle-cup')!;
    expect(cup.approval).toMatchObject({ state: 'pending', serves: 'current' });
    expect(cup.declaration.contains.map((c) => c.allergen)).toContain('nuts');

    // One mail to the managers, and to nobody else, listing both products.
    const mails = (await delivered((m) => (m.subject ?? '').toLowerCase().includes('approv'))).slice(mailsBefore);
    expect(mails).toHaveLength(1);
    expect(to(mails[0])).toEqual(['manager@example.com']);
    expect(mails[0].text).toContain('Strawberry trifle cup');
    expect(mails[0].text).toContain('Strawberry and vanilla layer cake');
    expect(mails[0].from?.text).toContain('Wrenfield Lane Bakehouse');
  });

  it('4. nothing prints while the change waits, and yesterday’s labels are not yet out of date', async () => {
    const refused = await print(chef, ['trifle-cup']);
    expect(refused.statusCode).toBe(409);
    expect(refused.json().code).toBe('approval-needed');
    expect(await stale()).toEqual([]);
  });

  it('5. the manager’s approval releases printing, lists the earlier labels out of date and tells everyone of the new allergen', async () => {
    const waiting = await pending();
    const approved = await req('POST', '/api/approvals', manager, {
      products: waiting.map((p) => ({ product: p.product, inputHash: p.inputHash })),
      note: 'Almonds in the sponge from this week',
    });
    expect(approved.statusCode).toBe(201);
    expect((await print(chef, ['trifle-cup'])).statusCode).toBe(201);

    const out = await stale();
    expect(out.map((s) => [s.run, s.product, s.batch]).sort()).toEqual(printed.items.map((i) => [printed.id, i.product, i.batch]).sort());
    for (const s of out) expect(s.action).toMatch(new RegExp(`Withdraw batch ${s.batch}`));

    const told = await delivered((m) => /allergen/i.test(m.subject ?? ''));
    expect(told.length).toBeGreaterThan(0);
    const everyone = told.flatMap(to);
    expect(everyone).toEqual(expect.arrayContaining(['chef@example.com', 'counter@example.com', 'manager@example.com']));
  });

  it('6. the manager marks each out-of-date print handled, with a note, and the list empties', async () => {
    for (const s of await stale()) {
      const res = await req('POST', `/api/labels/stale/${s.id}/handled`, manager, { note: `Batch ${s.batch} taken off the counter` });
      expect(res.statusCode).toBe(200);
    }
    expect(await stale()).toEqual([]);
  });

  it('7. two people save the sponge from one revision: the second is refused with the first one’s change, nothing overwritten', async () => {
    const start = await recipe(SPONGE);
    const { revision, ...body } = start;
    const first = await req('PUT', `/api/recipes/${SPONGE}`, manager, { ...body, name: 'Almond vanilla sponge', baseRevision: revision });
    expect(first.statusCode).toBe(200);
    const chefs = { ...body, lines: body.lines.map((l, i) => (i === 0 ? { ...l, qty: (l.qty ?? 0) + 10 } : l)) };
    const second = await req('PUT', `/api/recipes/${SPONGE}`, chef, { ...chefs, baseRevision: revision });
    expect(second.statusCode).toBe(409);
    expect(second.json().code).toBe('stale-base');
    // It names who saved in between and what they changed.
    expect(second.json().message).toContain('Maren Holloway');
    expect(second.json().message).toContain('Almond vanilla sponge');
    const now = await recipe(SPONGE);
    expect(now.revision).toBe(revision + 1);
    expect(now.name).toBe('Almond vanilla sponge');
    expect(now.lines).toEqual(start.lines);
  });

  it('8. a specification comes due for review within 30 days, then overdue', async () => {
    const form = await multipart(
      { reviewBy: new Date(clock.now().getTime() + 10 * DAY).toISOString().slice(0, 10) },
      { name: 'flaked-almonds.pdf', bytes: fixture('almond-paste-spec.pdf'), type: 'application/pdf' },
    );
    const up = await t.app.inject({
      method: 'POST',
      url: '/api/ingredients/flaked-almonds/specifications',
      payload: form.payload,
      headers: { ...form.headers, cookie: chef },
    });
    expect(up.statusCode).toBe(201);
    const soon = (await req('GET', '/api/specifications/reviews-due', chef)).json<ReviewsDue>();
    expect(soon.dueSoon.map((r) => r.ingredient)).toContain('flaked-almonds');
    clock.advance(11 * DAY);
    const late = (await req('GET', '/api/specifications/reviews-due', manager)).json<ReviewsDue>();
    expect(late.overdue.map((r) => r.ingredient)).toContain('flaked-almonds');
  });

  let invitedToken = '';
  it('9. a new colleague’s invitation link works once, and an unused one expires', async () => {
    clock.reset();
    const invite = await req('POST', '/api/users/invitations', manager, {
      name: 'Ines Varga',
      email: 'ines@bakehouse.example',
      role: 'front-of-house',
    });
    expect(invite.statusCode).toBe(201);
    const [mail] = await delivered((m) => to(m).includes('ines@bakehouse.example'));
    invitedToken = /\/set-password#token=([A-Za-z0-9_-]+)/.exec(mail.text ?? '')![1];
    const set = await t.app.inject({
      method: 'POST',
      url: '/api/auth/set-password',
      payload: { token: invitedToken, password: 'Proving-dough-at-6am' },
    });
    expect(set.statusCode).toBe(200);
    const again = await t.app.inject({
      method: 'POST',
      url: '/api/auth/set-password',
      payload: { token: invitedToken, password: 'Another-dough-at-7am' },
    });
    expect(again.statusCode).toBeGreaterThanOrEqual(400);
    expect((await t.signIn('ines@bakehouse.example', 'Proving-dough-at-6am')).length).toBeGreaterThan(0);

    const late = await req('POST', '/api/users/invitations', manager, {
      name: 'Oskar Bell',
      email: 'oskar@bakehouse.example',
      role: 'pastry-chef',
    });
    expect(late.statusCode).toBe(201);
    const [second] = await delivered((m) => to(m).includes('oskar@bakehouse.example'));
    const token = /\/set-password#token=([A-Za-z0-9_-]+)/.exec(second.text ?? '')![1];
    clock.advance(72 * 60 * 60_000 + 1000);
    const expired = await t.app.inject({
      method: 'POST',
      url: '/api/auth/set-password',
      payload: { token, password: 'Proving-dough-at-6am' },
    });
    expect(expired.statusCode).toBeGreaterThanOrEqual(400);
    clock.reset();
  });

  it('10. the audit trail holds every step of it, in order', async () => {
    const res = await req('GET', `/api/audit?from=${startedAt.slice(0, 10)}&sort=oldest&pageSize=200`, manager);
    expect(res.statusCode).toBe(200);
    const rows = res.json<AuditPage>().items.filter((r) => r.at >= startedAt);
    const steps = rows
      .filter((r) => !r.action.startsWith('sign-in') && r.action !== 'access.refused')
      .map((r) => `${r.action} ${r.recordId ?? ''}`.trim());
    const expected = [
      'recipe.saved sponge-fingers',
      'recipe.saved trifle-cup',
      'approval.given',
      'labels.printed',
      'ingredient.saved flaked-almonds',
      `recipe.saved ${SPONGE}`,
      'approval.given',
      'labels.printed',
      'label-stale.handled',
      `recipe.saved ${SPONGE}`,
      'specification.uploaded',
      'user.invited',
      'password.set',
      'user.invited',
    ];
    // Each step is there, in the order it happened (other events may sit between them).
    let at = 0;
    for (const step of expected) {
      const found = steps.findIndex((s, i) => i >= at && s.startsWith(step));
      expect({ step, found: found >= 0 }).toEqual({ step, found: true });
      at = found + 1;
    }
    // The refused print and the refused approval are kept as refusals, not as writes.
    expect(rows.some((r) => r.action === 'access.refused')).toBe(true);
  });
});
