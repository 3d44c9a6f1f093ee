import { QueryTypes } from 'sequelize';
import type { ApprovalsView, AuditEventDetail, AuditPage, Book, RecallResult, StaleLabel } from '@crumbproof/shared';
import { registeredRoutes } from '../src/app.factory';
import { startAppWith } from './support/app-with-settings';
import { fixture, multipart } from './fixtures/forms';
import { approveAll } from './support/approvals';
import { adminQuery, startTestApp, type TestApp } from './support/test-app';

/**
 * The audit trail on the real MariaDB: append-only in the database itself (the API's runtime user
 * may only read and add its rows), one event per saved write in the write's own transaction and
 * none for a refused one, sign-ins and refused access, the manager's search, export and recall.
 */

interface AuditRow {
  id: string;
  actor_id: number | null;
  actor_name: string | null;
  actor_role: string | null;
  action: string;
  record_kind: string | null;
  record_id: string | null;
  summary: string;
  before: unknown;
  after: unknown;
  address: string | null;
}

const today = (() => {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
})();
const reviewBy = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);

let t: TestApp;
let manager: string;
let chef: string;
let counter: string;
/** A session of the chef's that the sign-out case ends. */
let leaving: string;

const send: TestApp['req'] = (...args) => t.req(...args);

/** The revision an editor would load and name as the base of its save. */
const baseOf = async (kind: 'ingredients' | 'recipes', code: string) =>
  (await send('GET', `/api/${kind}/${code}`, chef)).json<{ revision: number }>().revision;

const sendForm = async (url: string, cookie: string, fields: Record<string, string>, file: { name: string; bytes: Buffer }) => {
  const form = await multipart(fields, file);
  return t.app.inject({ method: 'POST', url, headers: { ...form.headers, cookie }, payload: form.payload });
};

const json = (v: unknown) => (typeof v === 'string' ? (JSON.parse(v) as unknown) : v);

async function rowsAfter(id: string | number): Promise<AuditRow[]> {
  const rows = await t.sequelize.query<AuditRow>('SELECT * FROM audit_events WHERE id > ? ORDER BY id', {
    replacements: [String(id)],
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => ({ ...r, id: String(r.id), before: json(r.before), after: json(r.after) }));
}

async function lastId(): Promise<string> {
  const [row] = await t.sequelize.query<{ id: string | null }>('SELECT MAX(id) AS id FROM audit_events', { type: QueryTypes.SELECT });
  return String(row.id ?? 0);
}

const NAMES = { manager: 'Maren Holloway', chef: 'Tobiah Quill', counter: 'Priya Santangelo', invited: 'Audit Invitee' };
const ROLE_OF = { manager: 'manager', chef: 'pastry-chef', counter: 'front-of-house', invited: 'front-of-house' } as const;

beforeAll(async () => {
  t = await startTestApp({ seed: true });
  ({ manager, chef, counter } = await t.signInDemo());
  leaving = await t.signIn('chef@example.com');
});
afterAll(() => t.close());

describe('the audit trail is append-only in MariaDB itself', () => {
  it('lets the runtime user add and read rows, and refuses it UPDATE, DELETE, TRUNCATE and DROP', async () => {
    const [who] = await t.sequelize.query<{ me: string }>('SELECT CURRENT_USER() AS me', { type: QueryTypes.SELECT });
    expect(who.me).toMatch(/^crumbproof_app@/);
    await t.sequelize.query(
      "INSERT INTO audit_events (at, action, summary) VALUES (NOW(3), 'access.refused', 'Written by the privilege test')",
    );
    const [added] = await t.sequelize.query<{ id: string }>("SELECT id FROM audit_events WHERE summary = 'Written by the privilege test'", {
      type: QueryTypes.SELECT,
    });
    expect(added).toBeDefined();
    await expect(t.sequelize.query("UPDATE audit_events SET summary = 'rewritten'")).rejects.toThrow(/UPDATE command denied/);
    await expect(t.sequelize.query('DELETE FROM audit_events')).rejects.toThrow(/DELETE command denied/);
    await expect(t.sequelize.query('TRUNCATE TABLE audit_events')).rejects.toThrow(/DROP command denied|denied/);
    await expect(t.sequelize.query('DROP TABLE audit_events')).rejects.toThrow(/DROP command denied/);
    await expect(t.sequelize.query('ALTER TABLE audit_events ADD COLUMN x INT')).rejects.toThrow(/ALTER command denied/);
    const [still] = await t.sequelize.query<{ summary: string }>('SELECT summary FROM audit_events WHERE id = ?', {
      replacements: [added.id],
      type: QueryTypes.SELECT,
    });
    expect(still.summary).toBe('Written by the privilege test');
  });

  it('holds no database-wide privilege, only table grants (SELECT and INSERT on audit_events)', async () => {
    const grants = (await t.sequelize.query<Record<string, string>>('SHOW GRANTS FOR CURRENT_USER()', { type: QueryTypes.SELECT })).map(
      (g) => Object.values(g)[0],
    );
    expect(grants.filter((g) => /ON `[^`]+`\.\*/.test(g))).toEqual([]);
    const here = grants.filter((g) => g.includes(`\`${process.env.DB_NAME}\`.`));
    expect(here.filter((g) => g.includes('`audit_events`'))).toEqual([
      expect.stringMatching(/^GRANT SELECT, INSERT ON `[^`]+`\.`audit_events`/),
    ]);
    expect(here.some((g) => /^GRANT SELECT, INSERT, UPDATE, DELETE ON `[^`]+`\.`recipes`/.test(g))).toBe(true);
    expect(here.some((g) => /^GRANT SELECT ON `[^`]+`\.`schema_migrations`/.test(g))).toBe(true);
  });

  it('leaves the write undone when its audit event cannot be saved (one transaction)', async () => {
    const db = process.env.DB_NAME!;
    const before = (await send('GET', '/api/ingredients/sea-salt', chef)).json<{ revision: number; supplier?: string }>();
    await adminQuery(`REVOKE INSERT ON \`${db}\`.\`audit_events\` FROM 'crumbproof_app'@'127.0.0.1'`);
    try {
      const ing = (await send('GET', '/api/ingredients/sea-salt', chef)).json<Record<string, unknown>>();
      const { revision, updatedAt: _u, ...body } = ing;
      const res = await send('PUT', '/api/ingredients/sea-salt', chef, { ...body, supplier: 'Never saved', baseRevision: revision });
      expect(res.statusCode).toBe(500);
    } finally {
      await adminQuery(`GRANT INSERT ON \`${db}\`.\`audit_events\` TO 'crumbproof_app'@'127.0.0.1'`);
    }
    const after = (await send('GET', '/api/ingredients/sea-salt', chef)).json<{ revision: number; supplier?: string }>();
    expect(after).toEqual(before);
  });
});

/** How a successful call of each route that writes is made, who makes it and what the trail says of it. */
interface WriteCase {
  route: string;
  call: () => Promise<{ statusCode: number; body: string }>;
  status: number;
  actor: keyof typeof NAMES | null;
  action: string;
  record?: [kind: string, id: string | RegExp];
  /** The same route refused (a validation error or a refusal of the service): no row. */
  refused?: () => Promise<{ statusCode: number }>;
}

const ingredient = { id: 'audit-cream', name: 'Audit cream', contains: ['milk'], mayContain: [], vegan: false, vegetarian: true };
const tart = { id: 'audit-tart', name: 'Audit tart', lines: [{ use: 'butter', qty: 100, unit: 'g' }], sale: { portionG: 80 } };
let newUserId = 0;
let invitedId = 0;
let questionId = 0;

/** The one-time token of the newest invitation mail, read from the outbox (no mail server here, so it waits unsent). */
async function newestInvitationToken(): Promise<string> {
  const [row] = await t.sequelize.query<{ text: string }>(
    "SELECT text FROM mail_outbox WHERE kind = 'invitation' ORDER BY id DESC LIMIT 1",
    {
      type: QueryTypes.SELECT,
    },
  );
  return /\/set-password#token=([A-Za-z0-9_-]+)/.exec(row.text)![1];
}

/** A mail kept as not sent after its last attempt, as the sender leaves one. */
async function failedMail(): Promise<string> {
  await t.sequelize.query(
    `INSERT INTO mail_outbox (kind, recipients, subject, text, html, state, attempts, last_error, next_attempt_at, created_at)
     VALUES ('note', '["chef@example.com"]', 'Audit note', 'Words.', '<p>Words.</p>', 'failed', 5, 'ECONNREFUSED', NOW(3), NOW(3))`,
  );
  const [row] = await t.sequelize.query<{ id: string }>("SELECT MAX(id) AS id FROM mail_outbox WHERE subject = 'Audit note'", {
    type: QueryTypes.SELECT,
  });
  return String(row.id);
}

const CASES: WriteCase[] = [
  {
    route: 'POST /api/ingredients',
    call: () => send('POST', '/api/ingredients', chef, ingredient),
    status: 201,
    actor: 'chef',
    action: 'ingredient.saved',
    record: ['ingredient', 'audit-cream'],
    refused: () => send('POST', '/api/ingredients', chef, { ...ingredient, id: 'audit-cream-2', contains: ['chocolate'] }),
  },
  {
    route: 'PUT /api/ingredients/:code',
    call: async () =>
      send('PUT', '/api/ingredients/audit-cream', chef, {
        ...ingredient,
        supplier: 'Audit dairy',
        baseRevision: await baseOf('ingredients', 'audit-cream'),
      }),
    status: 200,
    actor: 'chef',
    action: 'ingredient.saved',
    record: ['ingredient', 'audit-cream'],
    refused: async () =>
      send('PUT', '/api/ingredients/audit-cream', chef, {
        ...ingredient,
        id: 'other-id',
        baseRevision: await baseOf('ingredients', 'audit-cream'),
      }),
  },
  {
    route: 'POST /api/recipes',
    call: () => send('POST', '/api/recipes', chef, tart),
    status: 201,
    actor: 'chef',
    action: 'recipe.saved',
    record: ['recipe', 'audit-tart'],
    // Refused inside the write's transaction: the rules engine cannot declare a line of nothing known.
    refused: () =>
      send('POST', '/api/recipes', chef, { ...tart, id: 'audit-tart-2', lines: [{ use: 'no-such-thing', qty: 1, unit: 'g' }] }),
  },
  {
    route: 'PUT /api/recipes/:code',
    call: async () =>
      send('PUT', '/api/recipes/audit-tart', chef, {
        ...tart,
        name: 'Audit tart, glazed',
        baseRevision: await baseOf('recipes', 'audit-tart'),
      }),
    status: 200,
    actor: 'chef',
    action: 'recipe.saved',
    record: ['recipe', 'audit-tart'],
    refused: async () =>
      send('PUT', '/api/recipes/audit-tart', chef, { ...tart, finishedWeightG: 5000, baseRevision: await baseOf('recipes', 'audit-tart') }),
  },
  {
    route: 'POST /api/swaps/apply',
    call: () => send('POST', '/api/swaps/apply', chef, { from: 'butter', to: 'plant-spread', recipe: 'audit-tart' }),
    status: 200,
    actor: 'chef',
    action: 'swap.applied',
    record: ['recipe', 'audit-tart'],
    refused: () => send('POST', '/api/swaps/apply', chef, { from: 'butter', to: 'no-such-thing', recipe: 'audit-tart' }),
  },
  {
    route: 'POST /api/book/import',
    call: async () => {
      const book = (await send('GET', '/api/book', manager)).json<Book>();
      return send('POST', '/api/book/import', manager, {
        crumbproofBook: 1,
        site: book.site,
        ingredients: [{ ...ingredient, id: 'audit-honey', name: 'Audit honey', contains: [] }],
        recipes: [],
      });
    },
    status: 200,
    actor: 'manager',
    action: 'book.imported',
    record: ['kitchen', /^\d+$/],
    refused: async () => {
      const book = (await send('GET', '/api/book', manager)).json<Book>();
      return send('POST', '/api/book/import', manager, {
        ...book,
        recipes: [{ ...tart, id: 'audit-loop', lines: [{ use: 'audit-loop', qty: 1, unit: 'g' }] }],
      });
    },
  },
  {
    route: 'POST /api/labels/stale/:id/handled',
    call: async () => {
      const stale = (await send('GET', '/api/labels/stale', manager)).json<StaleLabel[]>();
      const shortbread = stale.find((x) => x.product === 'lemon-shortbread')!;
      return send('POST', `/api/labels/stale/${shortbread.id}/handled`, manager, { note: 'Withdrawn from the shelf and relabelled.' });
    },
    status: 200,
    actor: 'manager',
    action: 'label-stale.handled',
    record: ['label-run', /^\d+$/],
    refused: () => send('POST', '/api/labels/stale/999999-0/handled', manager, { note: 'Nothing printed there.' }),
  },
  {
    route: 'PATCH /api/kitchen',
    call: () => send('PATCH', '/api/kitchen', manager, { regime: 'EU' }),
    status: 200,
    actor: 'manager',
    action: 'kitchen.updated',
    record: ['kitchen', /^\d+$/],
    refused: () => send('PATCH', '/api/kitchen', manager, { regime: 'MARS' }),
  },
  {
    // Under the new regime every product waits for a first approval: the manager approves them all.
    route: 'POST /api/approvals',
    call: async () => {
      const { pending } = (await send('GET', '/api/approvals', manager)).json<ApprovalsView>();
      return send('POST', '/api/approvals', manager, {
        products: pending.map((p) => ({ product: p.product, inputHash: p.inputHash })),
        note: 'Checked under the EU regime.',
      });
    },
    status: 201,
    actor: 'manager',
    action: 'approval.given',
    refused: () => send('POST', '/api/approvals', manager, { products: [{ product: 'vegan-brownie', inputHash: '0'.repeat(64) }] }),
  },
  {
    route: 'POST /api/users',
    call: async () => {
      const res = await send('POST', '/api/users', manager, {
        email: 'audit@example.com',
        name: 'Audit Person',
        role: 'pastry-chef',
        password: 'a-long-pass-phrase-7',
      });
      newUserId = res.json<{ id: number }>().id;
      return res;
    },
    status: 201,
    actor: 'manager',
    action: 'user.created',
    record: ['user', /^\d+$/],
    refused: () =>
      send('POST', '/api/users', manager, {
        email: 'chef@example.com',
        name: 'Twice',
        role: 'pastry-chef',
        password: 'a-long-pass-phrase-7',
      }),
  },
  {
    route: 'POST /api/users/invitations',
    call: async () => {
      const res = await send('POST', '/api/users/invitations', manager, {
        email: 'invited@example.com',
        name: NAMES.invited,
        role: 'front-of-house',
      });
      invitedId = res.json<{ id: number }>().id;
      return res;
    },
    status: 201,
    actor: 'manager',
    action: 'user.invited',
    record: ['user', /^\d+$/],
    refused: () => send('POST', '/api/users/invitations', manager, { email: 'chef@example.com', name: 'Twice', role: 'pastry-chef' }),
  },
  {
    route: 'POST /api/users/:id/invitation',
    call: () => send('POST', `/api/users/${invitedId}/invitation`, manager, {}),
    status: 200,
    actor: 'manager',
    action: 'invitation.resent',
    record: ['user', /^\d+$/],
    refused: () => send('POST', '/api/users/999999/invitation', manager, {}),
  },
  {
    route: 'POST /api/auth/set-password',
    call: async () =>
      send('POST', '/api/auth/set-password', undefined, { token: await newestInvitationToken(), password: 'Audit-invitee-pass-8' }),
    status: 200,
    actor: 'invited',
    action: 'password.set',
    record: ['user', /^\d+$/],
    refused: async () =>
      send('POST', '/api/auth/set-password', undefined, { token: await newestInvitationToken(), password: 'password1234' }),
  },
  {
    route: 'POST /api/auth/password-reset',
    call: () => send('POST', '/api/auth/password-reset', undefined, { email: 'invited@example.com' }),
    status: 202,
    actor: null,
    action: 'password-reset.requested',
    record: ['user', /^\d+$/],
    refused: () => send('POST', '/api/auth/password-reset', undefined, { email: 'not an address' }),
  },
  {
    route: 'POST /api/mail/outbox/:id/retry',
    call: async () => send('POST', `/api/mail/outbox/${await failedMail()}/retry`, manager, {}),
    status: 200,
    actor: 'manager',
    action: 'mail.retried',
    record: ['mail', /^\d+$/],
    refused: () => send('POST', '/api/mail/outbox/999999/retry', manager, {}),
  },
  {
    route: 'PATCH /api/users/:id',
    call: () => send('PATCH', `/api/users/${newUserId}`, manager, { name: 'Audit Person Renamed' }),
    status: 200,
    actor: 'manager',
    action: 'user.updated',
    record: ['user', /^\d+$/],
    refused: () => send('PATCH', '/api/users/999999', manager, { name: 'Nobody' }),
  },
  {
    // The new person leaves this kitchen; their account stays.
    route: 'DELETE /api/users/:id/kitchen',
    call: () => send('DELETE', `/api/users/${newUserId}/kitchen`, manager),
    status: 200,
    actor: 'manager',
    action: 'user.taken-off-kitchen',
    record: ['user', /^\d+$/],
    refused: () => send('DELETE', '/api/users/999999/kitchen', manager),
  },
  {
    route: 'POST /api/ingredients/:code/specifications',
    call: () =>
      sendForm('/api/ingredients/butter/specifications', chef, { reviewBy }, { name: 'spec.pdf', bytes: fixture('almond-paste-spec.pdf') }),
    status: 201,
    actor: 'chef',
    action: 'specification.uploaded',
    record: ['ingredient', 'butter'],
    refused: () =>
      sendForm('/api/ingredients/butter/specifications', chef, { reviewBy }, { name: 'spec.pdf', bytes: fixture('not-really-a.pdf') }),
  },
  {
    route: 'POST /api/ingredients/import',
    call: async () => {
      const file = { name: 'new.csv', bytes: fixture('new-ingredients.csv') };
      const { basis } = (await sendForm('/api/ingredients/import/preview', chef, {}, file)).json<{ basis: string }>();
      return sendForm('/api/ingredients/import', chef, { basis }, file);
    },
    status: 200,
    actor: 'chef',
    action: 'ingredients.imported',
    record: ['spreadsheet', 'new.csv'],
    refused: () => sendForm('/api/ingredients/import', chef, {}, { name: 'bad.csv', bytes: fixture('ingredients-with-mistakes.csv') }),
  },
  {
    route: 'PUT /api/labels/settings',
    call: () =>
      send('PUT', '/api/labels/settings', manager, {
        batchPattern: '{YY}{MM}{DD}-{P}-{N}',
        gs1CompanyPrefix: '9521234',
        ssccExtension: 0,
        caseIndicator: 1,
      }),
    status: 200,
    actor: 'manager',
    action: 'label-settings.saved',
    record: ['label-settings', /^\d+$/],
    refused: () =>
      send('PUT', '/api/labels/settings', manager, {
        batchPattern: '{Q}',
        gs1CompanyPrefix: '9521234',
        ssccExtension: 0,
        caseIndicator: 1,
      }),
  },
  {
    route: 'POST /api/labels/runs',
    call: () =>
      send('POST', '/api/labels/runs', chef, {
        template: 'product',
        items: [{ product: 'vegan-brownie', quantity: 2 }],
        productionDate: today,
      }),
    status: 201,
    actor: 'chef',
    action: 'labels.printed',
    record: ['label-run', /^\d+$/],
    refused: () =>
      send('POST', '/api/labels/runs', chef, { template: 'product', items: [{ product: 'butter', quantity: 2 }], productionDate: today }),
  },
  {
    route: 'PUT /api/counter/today',
    call: () => send('PUT', '/api/counter/today', chef, { date: today, products: ['vegan-brownie', 'lemon-shortbread'] }),
    status: 200,
    actor: 'chef',
    action: 'counter.day-marked',
    record: ['counter-day', today],
    refused: () => send('PUT', '/api/counter/today', chef, { date: today, products: ['butter'] }),
  },
  {
    route: 'POST /api/counter/questions',
    call: async () => {
      const res = await send('POST', '/api/counter/questions', counter, {
        product: 'vegan-brownie',
        avoid: ['eggs', 'walnut'],
        note: 'Asked at the till',
      });
      questionId = res.json<{ id: number }>().id;
      return res;
    },
    status: 201,
    actor: 'counter',
    action: 'counter.question-asked',
    record: ['counter-question', /^\d+$/],
    refused: () => send('POST', '/api/counter/questions', counter, { product: 'butter', avoid: ['eggs'] }),
  },
  {
    route: 'POST /api/counter/questions/:id/answer',
    call: () => send('POST', `/api/counter/questions/${questionId}/answer`, chef, { answer: 'No egg or walnut is recorded in it.' }),
    status: 200,
    actor: 'chef',
    action: 'counter.question-answered',
    record: ['counter-question', /^\d+$/],
    // No such question: refused inside the answer's transaction.
    refused: () => send('POST', '/api/counter/questions/999999/answer', chef, { answer: 'An answer to nothing.' }),
  },
  {
    route: 'PUT /api/public-page/settings',
    call: () => send('PUT', '/api/public-page/settings', manager, { enabled: true, baseUrl: 'https://menu.example.com' }),
    status: 200,
    actor: 'manager',
    action: 'public-page.saved',
    record: ['public-page-settings', /^\d+$/],
    refused: () => send('PUT', '/api/public-page/settings', manager, { enabled: true, baseUrl: 'ftp://menu.example.com' }),
  },
  {
    route: 'POST /api/auth/sign-in',
    call: () => send('POST', '/api/auth/sign-in', undefined, { email: 'chef@example.com', password: 'crumbproof-demo' }),
    status: 200,
    actor: 'chef',
    action: 'sign-in.succeeded',
    record: ['user', /^\d+$/],
  },
  {
    route: 'POST /api/auth/sign-out',
    call: () => send('POST', '/api/auth/sign-out', leaving),
    status: 204,
    actor: 'chef',
    action: 'signed-out',
    record: ['user', /^\d+$/],
  },
];

/** Routes that take a body and write nothing: a successful call leaves no row. */
const READS: { route: string; call: () => Promise<{ statusCode: number }>; status: number }[] = [
  {
    route: 'POST /api/declarations/preview',
    call: () => send('POST', '/api/declarations/preview', chef, { ...tart, id: 'preview-tart' }),
    status: 200,
  },
  {
    route: 'POST /api/swaps/preview',
    call: () => send('POST', '/api/swaps/preview', chef, { from: 'butter', to: 'plant-spread' }),
    status: 200,
  },
  {
    route: 'POST /api/auth/account-link',
    call: async () => send('POST', '/api/auth/account-link', undefined, { token: await newestInvitationToken() }),
    status: 200,
  },
  {
    route: 'POST /api/composition/scan',
    call: () => send('POST', '/api/composition/scan', chef, { text: 'Wheat flour, butter (milk)' }),
    status: 200,
  },
  {
    route: 'POST /api/ingredients/import/preview',
    call: () => sendForm('/api/ingredients/import/preview', chef, {}, { name: 'new.csv', bytes: fixture('new-ingredients.csv') }),
    status: 200,
  },
];

/** Written by its own test below: the first manager exists only in a kitchen's own installation. */
const ELSEWHERE = ['POST /api/auth/first-manager'];

describe('every route that writes leaves one audit event, in its transaction', () => {
  beforeAll(async () => {
    // Labels printed, then an approved change they do not show: out-of-date labels for the handled case.
    const printed = await send('POST', '/api/labels/runs', chef, {
      template: 'product',
      items: [{ product: 'lemon-shortbread', quantity: 3 }],
      productionDate: today,
    });
    expect(printed.statusCode).toBe(201);
    const shortbread = (await send('GET', '/api/book', chef)).json<Book>().recipes.find((r) => r.id === 'lemon-shortbread')!;
    const { id: _id, ...body } = shortbread;
    const withSesame = { ...body, lines: [...body.lines, { use: 'sesame-seeds', qty: 5, unit: 'g' }] };
    expect(
      (
        await send('PUT', '/api/recipes/lemon-shortbread', chef, {
          id: shortbread.id,
          ...withSesame,
          baseRevision: await baseOf('recipes', 'lemon-shortbread'),
        })
      ).statusCode,
    ).toBe(200);
    expect(await approveAll(t, manager)).toEqual(['lemon-shortbread']);
  });

  it('has a case for every route that takes POST, PUT, PATCH or DELETE', () => {
    const writing = registeredRoutes(t.app)
      .filter((r) => ['POST', 'PUT', 'PATCH', 'DELETE'].includes(r.method))
      .map((r) => `${r.method} ${r.url}`);
    expect([...writing].sort()).toEqual([...CASES.map((c) => c.route), ...READS.map((r) => r.route), ...ELSEWHERE].sort());
  });

  it.each(CASES.map((c) => [c.route, c] as const))('%s: one row naming the actor when saved, none when refused', async (_route, c) => {
    if (c.refused) {
      const mark = await lastId();
      const refused = await c.refused();
      expect(refused.statusCode).toBeGreaterThanOrEqual(400);
      expect(refused.statusCode).toBeLessThan(500);
      expect(await rowsAfter(mark)).toEqual([]);
    }
    const mark = await lastId();
    const res = await c.call();
    expect({ status: res.statusCode, body: res.statusCode === c.status ? 'ok' : res.body }).toEqual({ status: c.status, body: 'ok' });
    const rows = await rowsAfter(mark);
    expect(rows.map((r) => r.action)).toEqual([c.action]);
    const [row] = rows;
    expect(row.actor_name).toBe(c.actor ? NAMES[c.actor] : null);
    expect(row.actor_role).toBe(c.actor ? ROLE_OF[c.actor] : null);
    expect(row.address).toBe('127.0.0.1');
    expect(row.summary.length).toBeGreaterThan(5);
    if (c.record) {
      expect(row.record_kind).toBe(c.record[0]);
      expect(row.record_id).toMatch(typeof c.record[1] === 'string' ? new RegExp(`^${c.record[1]}$`) : c.record[1]);
    }
  });

  it.each(READS.map((r) => [r.route, r] as const))('%s writes nothing, so no row', async (_route, r) => {
    const mark = await lastId();
    const res = await r.call();
    expect(res.statusCode).toBe(r.status);
    expect(await rowsAfter(mark)).toEqual([]);
  });

  it('keeps the previous revision and the new one of an edited item', async () => {
    const mark = await lastId();
    const body = { ...ingredient, supplier: 'Second dairy' };
    const baseRevision = await baseOf('ingredients', 'audit-cream');
    expect((await send('PUT', '/api/ingredients/audit-cream', chef, { ...body, baseRevision })).statusCode).toBe(200);
    const [row] = await rowsAfter(mark);
    const { id: _id, ...after } = body;
    expect(row.before).toMatchObject({ name: 'Audit cream', supplier: 'Audit dairy' });
    expect(row.after).toEqual(after);
    expect(row.summary).toMatch(/Revised the ingredient Audit cream \(audit-cream\), revision \d+/);
  });

  it('keeps the name and role the actor had at the time', async () => {
    const mark = await lastId();
    expect((await send('POST', '/api/counter/questions', counter, { product: 'vegan-brownie', avoid: ['milk'] })).statusCode).toBe(201);
    const [asked] = await rowsAfter(mark);
    const [{ id }] = await t.sequelize.query<{ id: number }>("SELECT id FROM users WHERE email = 'counter@example.com'", {
      type: QueryTypes.SELECT,
    });
    expect((await send('PATCH', `/api/users/${id}`, manager, { name: 'Priya S. Moreau' })).statusCode).toBe(200);
    const page = (await send('GET', `/api/audit?record=${asked.record_id}&action=counter.question-asked`, manager)).json<AuditPage>();
    expect(page.items.map((i) => i.actor)).toEqual([{ id, name: NAMES.counter, role: 'front-of-house' }]);
    expect((await send('PATCH', `/api/users/${id}`, manager, { name: NAMES.counter })).statusCode).toBe(200);
  });
});

describe('sign-ins and refused access are recorded', () => {
  it('records a refused sign-in with the email tried and no actor', async () => {
    const mark = await lastId();
    const res = await send('POST', '/api/auth/sign-in', undefined, { email: 'chef@example.com', password: 'not-the-password-at-all' });
    expect(res.statusCode).toBe(401);
    const rows = await rowsAfter(mark);
    expect(rows.map((r) => [r.action, r.actor_id, r.record_kind, r.record_id])).toEqual([
      ['sign-in.failed', null, 'email', 'chef@example.com'],
    ]);
    expect(rows[0].summary).toMatch(/password is not right/);
  });

  it('records a role refused with who asked, and a route the session ended for, but not a first visit without a cookie', async () => {
    let mark = await lastId();
    expect((await send('GET', '/api/audit', counter)).statusCode).toBe(403);
    let rows = await rowsAfter(mark);
    expect(rows.map((r) => [r.action, r.actor_name, r.record_id])).toEqual([['access.refused', NAMES.counter, 'GET /api/audit']]);

    const ended = await t.signIn('chef@example.com');
    expect((await send('POST', '/api/auth/sign-out', ended)).statusCode).toBe(204);
    mark = await lastId();
    expect((await send('GET', '/api/recipes', ended)).statusCode).toBe(401);
    rows = await rowsAfter(mark);
    expect(rows.map((r) => [r.action, r.actor_id, r.record_id])).toEqual([['access.refused', null, 'GET /api/recipes']]);

    mark = await lastId();
    expect((await send('GET', '/api/recipes', undefined)).statusCode).toBe(401);
    expect(await rowsAfter(mark)).toEqual([]);
  });
});

describe('the first manager of a kitchen’s own installation', () => {
  it('is recorded as setting themselves, in the transaction that uses the link', async () => {
    const own = await startAppWith({ DEMO_KITCHEN: 'false' }, { database: `${process.env.DB_NAME}_own` });
    try {
      const token = await own.issueFirstManagerLink();
      const body = { token, email: 'first@example.com', name: 'Wren Ashdown', password: 'a-long-pass-phrase-7' };
      expect((await own.app.inject({ method: 'POST', url: '/api/auth/first-manager', payload: body })).statusCode).toBe(201);
      // Used: refused, and recorded as a refused access, not as a second first manager.
      expect((await own.app.inject({ method: 'POST', url: '/api/auth/first-manager', payload: body })).statusCode).toBe(403);
      const rows = await own.sequelize.query<AuditRow>('SELECT * FROM audit_events ORDER BY id', { type: QueryTypes.SELECT });
      expect(rows.map((r) => [r.action, r.actor_name, r.actor_role])).toEqual([
        ['first-manager.set', 'Wren Ashdown', 'manager'],
        ['access.refused', null, null],
      ]);
    } finally {
      await own.close();
    }
  });
});

describe('the manager reads the trail', () => {
  it('pages it on the server, newest first, with the total', async () => {
    const all = (await send('GET', '/api/audit?pageSize=200', manager)).json<AuditPage>();
    expect(all.total).toBeGreaterThan(20);
    const first = (await send('GET', '/api/audit?pageSize=5', manager)).json<AuditPage>();
    const second = (await send('GET', '/api/audit?pageSize=5&page=2', manager)).json<AuditPage>();
    expect(first).toMatchObject({ total: all.total, page: 1, pageSize: 5 });
    expect([...first.items, ...second.items].map((i) => i.id)).toEqual(all.items.slice(0, 10).map((i) => i.id));
    const times = all.items.map((i) => i.at);
    expect([...times].sort().reverse()).toEqual(times);
    const oldest = (await send('GET', '/api/audit?pageSize=1&sort=oldest', manager)).json<AuditPage>();
    expect(oldest.items[0].at <= times[times.length - 1]).toBe(true);
  });

  it('filters by user, action, record and days', async () => {
    const [{ id: chefId }] = await t.sequelize.query<{ id: number }>("SELECT id FROM users WHERE email = 'chef@example.com'", {
      type: QueryTypes.SELECT,
    });
    const byChef = (await send('GET', `/api/audit?user=${chefId}&pageSize=200`, manager)).json<AuditPage>();
    expect(byChef.items.length).toBeGreaterThan(0);
    expect(new Set(byChef.items.map((i) => i.actor?.id))).toEqual(new Set([chefId]));
    const saved = (await send('GET', '/api/audit?action=recipe.saved&record=audit-tart', manager)).json<AuditPage>();
    expect(saved.items.map((i) => [i.action, i.recordId])).toEqual([
      ['recipe.saved', 'audit-tart'],
      ['recipe.saved', 'audit-tart'],
    ]);
    // The record compares byte for byte: another spelling finds nothing.
    expect((await send('GET', '/api/audit?record=AUDIT-TART', manager)).json<AuditPage>().total).toBe(0);
    expect((await send('GET', `/api/audit?from=${today}&to=${today}`, manager)).json<AuditPage>().total).toBeGreaterThan(0);
    expect((await send('GET', '/api/audit?to=2000-01-01', manager)).json<AuditPage>()).toMatchObject({ total: 0, items: [] });
  });

  it('refuses a filter it cannot read, naming it', async () => {
    for (const [query, field] of [
      ['action=recipe.deleted', 'action'],
      ['from=2026-02-30', 'from'],
      ['from=2026-03-02&to=2026-03-01', 'to'],
      ['pageSize=201', 'pageSize'],
      ['user=someone', 'user'],
      ['sneaky=1', 'sneaky'],
    ]) {
      const res = await send('GET', `/api/audit?${query}`, manager);
      expect({ query, status: res.statusCode }).toEqual({ query, status: 400 });
      expect(res.body).toContain(field);
    }
  });

  it('shows one event with the record before and after', async () => {
    const page = (await send('GET', '/api/audit?action=kitchen.updated', manager)).json<AuditPage>();
    expect(page.items[0].hasChange).toBe(true);
    const event = (await send('GET', `/api/audit/${page.items[0].id}`, manager)).json<AuditEventDetail>();
    expect(event.before).toMatchObject({ regime: 'UK' });
    expect(event.after).toMatchObject({ regime: 'EU' });
    expect((await send('GET', '/api/audit/0', manager)).statusCode).toBe(404);
    expect((await send('GET', '/api/audit/abc', manager)).statusCode).toBe(404);
  });

  it('exports the filtered trail as CSV: byte order mark, RFC 4180 quoting, formula cells kept as text', async () => {
    const risky = { ...ingredient, id: 'formula-cream', name: '=HYPERLINK("http://x.example","Cream, "double"")' };
    expect((await send('POST', '/api/ingredients', chef, risky)).statusCode).toBe(201);
    const res = await send('GET', '/api/audit/export.csv?record=formula-cream', manager);
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="crumbproof-audit-\d{4}-\d{2}-\d{2}\.csv"$/);
    const bytes = res.rawPayload;
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = bytes.subarray(3).toString('utf8');
    const lines = text.split('\r\n');
    expect(lines[0]).toBe('Id,At (UTC),User id,User,Role,Action,What,Record kind,Record,Summary,Address,Before,After');
    expect(lines).toHaveLength(3);
    expect(lines[2]).toBe('');
    // The summary names the ingredient: quoted, inner quotes doubled; the JSON of after holds the name too.
    expect(lines[1]).toContain(',ingredient.saved,Ingredient saved,ingredient,formula-cream,');
    expect(lines[1]).toContain('"Created the ingredient =HYPERLINK(""http://x.example"",""Cream, ""double"""") (formula-cream)');
    expect(lines[1]).toContain(`,${NAMES.chef},pastry-chef,`);

    // A cell that starts with = is text, with an apostrophe before it.
    const [{ id: chefId }] = await t.sequelize.query<{ id: number }>("SELECT id FROM users WHERE email = 'chef@example.com'", {
      type: QueryTypes.SELECT,
    });
    expect((await send('PATCH', `/api/users/${chefId}`, manager, { name: '=cmd|calc' })).statusCode).toBe(200);
    const after = (await send('POST', '/api/ingredients', chef, { ...ingredient, id: 'formula-two' })).statusCode;
    expect(after).toBe(201);
    const csv = (await send('GET', '/api/audit/export.csv?record=formula-two', manager)).rawPayload.subarray(3).toString('utf8');
    expect(csv.split('\r\n')[1]).toContain(`,'=cmd|calc,pastry-chef,`);
    expect((await send('PATCH', `/api/users/${chefId}`, manager, { name: NAMES.chef })).statusCode).toBe(200);
  });

  it('refuses the trail to the pastry chef and front of house', async () => {
    for (const cookie of [chef, counter]) {
      for (const url of ['/api/audit', '/api/audit/export.csv', '/api/audit/recall?batch=X', '/api/audit/1'])
        expect((await send('GET', url, cookie)).statusCode).toBe(403);
    }
  });
});

describe('recall from a batch code', () => {
  it('lists every print of the batch, the declaration it carried and what has changed in the product since', async () => {
    const print = await send('POST', '/api/labels/runs', chef, {
      template: 'product',
      items: [{ product: 'lemon-shortbread', quantity: 12 }],
      productionDate: today,
    });
    expect(print.statusCode).toBe(201);
    const run = print.json<{ id: number; items: { batch: string; revision: number }[] }>();
    const batch = run.items[0].batch;
    const again = await send('POST', '/api/labels/runs', chef, {
      template: 'product',
      items: [{ product: 'lemon-shortbread', quantity: 6 }],
      productionDate: today,
      batch,
    });
    expect(again.statusCode).toBe(201);

    const unchanged = (await send('GET', `/api/audit/recall?batch=${encodeURIComponent(batch)}`, manager)).json<RecallResult>();
    expect(unchanged.prints.map((p) => [p.run, p.quantity, p.product])).toEqual([
      [run.id, 12, 'lemon-shortbread'],
      [again.json<{ id: number }>().id, 6, 'lemon-shortbread'],
    ]);
    expect(unchanged.products[0].changes).toEqual([]);
    expect(unchanged.message).toBe(`Batch ${batch}: 18 labels in 2 print runs. Nothing a label shows has changed since it was printed.`);

    // The sugar's supplier now declares mustard: the shortbread's declaration changes.
    const sugar = (await send('GET', '/api/ingredients/caster-sugar', chef)).json<Record<string, unknown>>();
    const { revision, updatedAt: _u, ...body } = sugar;
    const saved = await send('PUT', '/api/ingredients/caster-sugar', chef, {
      ...body,
      baseRevision: revision,
      contains: [...(body.contains as string[]), 'mustard'],
    });
    expect(saved.statusCode).toBe(200);

    const recall = (await send('GET', `/api/audit/recall?batch=${encodeURIComponent(batch)}`, manager)).json<RecallResult>();
    expect(recall.prints[0].declaration.contains.map((g) => g.allergen)).not.toContain('mustard');
    expect(recall.prints[0].revision).toBe(run.items[0].revision);
    expect(recall.products[0].declaration?.contains.map((g) => g.allergen)).toContain('mustard');
    expect(recall.products[0].diff?.containsAdded.map((g) => g.allergen)).toEqual(['mustard']);
    expect(recall.products[0].changes[0]).toMatch(/^Now contains Mustard, which the label does not declare\.$/i);
    expect(recall.message).toMatch(/has changed since it was printed/);
  });

  it('says so when the batch was never printed, and refuses an empty or overlong code', async () => {
    const none = await send('GET', '/api/audit/recall?batch=NO-SUCH-1', manager);
    expect(none.json()).toEqual({ batch: 'NO-SUCH-1', prints: [], products: [], message: 'No print of batch NO-SUCH-1.' });
    expect((await send('GET', '/api/audit/recall?batch=', manager)).statusCode).toBe(400);
    expect((await send('GET', `/api/audit/recall?batch=${'X'.repeat(21)}`, manager)).statusCode).toBe(400);
  });
});
