// Two API instances over a three-node MariaDB Galera cluster, started by npm run test:cluster
// (api/scripts/test-cluster.mjs): CLUSTER_API_A runs over node 1, CLUSTER_API_B over node 2.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const A = process.env.CLUSTER_API_A ?? '';
const B = process.env.CLUSTER_API_B ?? '';
const NODE2_PID = Number(process.env.CLUSTER_NODE2_PID);
if (!A || !B || !NODE2_PID) throw new Error('Run these tests with npm run test:cluster, which starts the cluster and both instances.');

interface Answer {
  status: number;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- a response body is read as any and asserted at once, as in the other tests
  body: any;
}

async function call(base: string, method: string, path: string, cookie: string, payload?: unknown): Promise<Answer> {
  const res = await fetch(`${base}${path}`, {
    method,
    headers: { cookie, ...kitchen, ...(payload === undefined ? {} : { 'content-type': 'application/json' }) },
    body: payload === undefined ? undefined : JSON.stringify(payload),
    signal: AbortSignal.timeout(30_000),
  });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = JSON.parse(text);
  } catch {
    /* not JSON */
  }
  return { status: res.status, body };
}

/** The demo manager works in both its kitchens: every request names the first (the bakehouse), set at sign-in. */
let kitchen: Record<string, string> = {};

/** The demo manager's session on one instance (every instance reads sessions from the database). */
async function signIn(base: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'manager@example.com', password: 'crumbproof-demo' }),
  });
  expect(res.status).toBe(200);
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const me = (await (await fetch(`${base}/api/me`, { headers: { cookie } })).json()) as { kitchens: { id: number }[] };
  const [first] = me.kitchens;
  if (!first) throw new Error('The demo manager works in no kitchen.');
  kitchen = { 'x-crumbproof-kitchen': String(first.id) };
  return cookie;
}

let onA = '';
let onB = '';
beforeAll(async () => {
  onA = await signIn(A);
  onB = await signIn(B);
});

const sugar = [{ use: 'caster-sugar', qty: 10, unit: 'g' }];

/**
 * How soon an instance serves a write made through another: its change feed polls the kitchen's
 * versions every 200 ms and serves nothing it kept once it has not heard from the database for
 * 1 s (CHANGE_STALE_MS in api/src/database/change-feed.ts); a little more for the requests themselves.
 */
const STALENESS_BOUND_MS = 1000 + 500;

describe('a write through one instance', () => {
  it('is declared and served by the other within the staleness bound', async () => {
    const created = await call(A, 'POST', '/api/ingredients', onA, {
      id: 'cluster-paste',
      name: 'Cluster paste',
      contains: [],
      mayContain: [],
      vegan: true,
      vegetarian: true,
    });
    expect(created.status).toBe(201);
    const bun = await call(A, 'POST', '/api/recipes', onA, {
      id: 'cluster-bun',
      name: 'Cluster bun',
      lines: [...sugar, { use: 'cluster-paste', qty: 20, unit: 'g' }],
      sale: { portionG: 30 },
    });
    expect(bun.status).toBe(201);
    const before = await call(B, 'GET', '/api/recipes/cluster-bun/declaration', onB);
    expect(before.status).toBe(200);
    expect(before.body.contains.map((c: { allergen: string }) => c.allergen)).not.toContain('soybeans');

    for (let round = 1; round <= 5; round++) {
      const paste = await call(B, 'GET', '/api/ingredients/cluster-paste', onB);
      const { revision, updatedAt: _u, ...body } = paste.body;
      // The supplier's statement changes on instance A (soya on odd rounds, none on even ones)…
      const contains = round % 2 === 1 ? ['soy'] : [];
      const saved = await call(A, 'PUT', '/api/ingredients/cluster-paste', onA, { ...body, contains, baseRevision: revision });
      expect(saved.status).toBe(200);
      // …and instance B, over another node, declares it within the bound.
      const savedAt = Date.now();
      const hasSoy = (a: Answer) => a.body.contains.map((c: { allergen: string }) => c.allergen).includes('soybeans');
      let served = await call(B, 'GET', '/api/recipes/cluster-bun/declaration', onB);
      while (served.status === 200 && hasSoy(served) !== (round % 2 === 1) && Date.now() - savedAt < STALENESS_BOUND_MS) {
        await new Promise((r) => setTimeout(r, 20));
        served = await call(B, 'GET', '/api/recipes/cluster-bun/declaration', onB);
      }
      expect(served.status).toBe(200);
      expect(Date.now() - savedAt).toBeLessThanOrEqual(STALENESS_BOUND_MS);
      expect(served.body.contains.map((c: { allergen: string }) => c.allergen).includes('soybeans')).toBe(round % 2 === 1);
      expect(served.body.basis.items.find((i: { id: string }) => i.id === 'cluster-paste').revision).toBe(revision + 1);
    }
  });
});

describe('checked writes at once through both instances', () => {
  it('never together make two recipes use each other: one is saved, the other refused in words', async () => {
    const rounds = 12;
    const outcomes: number[][] = [];
    await Promise.all(
      Array.from({ length: rounds }, async (_, round) => {
        const [x, y] = [`cluster-crumb-${round}-a`, `cluster-crumb-${round}-b`];
        for (const id of [x, y]) expect((await call(A, 'POST', '/api/recipes', onA, { id, name: id, lines: sugar })).status).toBe(201);
        const put = (base: string, cookie: string, id: string, other: string) =>
          call(base, 'PUT', `/api/recipes/${id}`, cookie, {
            id,
            name: id,
            lines: [...sugar, { use: other, qty: 5, unit: 'g' }],
            baseRevision: 1,
          });
        const [a, b] = await Promise.all([put(A, onA, x, y), put(B, onB, y, x)]);
        outcomes.push([a.status, b.status]);
        const statuses = [a.status, b.status].sort();
        expect(statuses).toEqual([200, 400]);
        const refused = a.status === 400 ? a : b;
        expect(refused.body.code).toBe('recipe-cycle');
        expect(refused.body.message).toMatch(/contains itself/);
        // What both instances read afterwards holds no cycle: only the saved recipe uses the other.
        for (const [base, cookie] of [
          [A, onA],
          [B, onB],
        ] as const) {
          const uses = await Promise.all(
            [x, y].map(async (id) =>
              (await call(base, 'GET', `/api/recipes/${id}`, cookie)).body.lines.some((l: { use: string }) =>
                l.use.startsWith('cluster-crumb'),
              ),
            ),
          );
          expect(uses.filter(Boolean)).toHaveLength(1);
        }
      }),
    );
    expect(outcomes).toHaveLength(rounds);
    console.log(`cluster: ${rounds} rounds of crossed writes, ${rounds} saved and ${rounds} refused as a recipe cycle, no 5xx`);
  });
});

/** The counter's events stream of one instance, its text read as it arrives, until `close`. */
async function openEvents(base: string, cookie: string) {
  const controller = new AbortController();
  const res = await fetch(`${base}/api/counter/events`, {
    headers: { cookie, ...kitchen, accept: 'text/event-stream' },
    signal: controller.signal,
  });
  expect(res.status).toBe(200);
  const reader = res.body!.getReader();
  const decoder = new TextDecoder();
  let text = '';
  const reading = (async () => {
    try {
      for (;;) {
        const { done, value } = await reader.read();
        if (done) return;
        text += decoder.decode(value, { stream: true });
      }
    } catch {
      /* closed */
    }
  })();
  const until = async (wanted: string, ms: number) => {
    const end = Date.now() + ms;
    while (!text.includes(wanted) && Date.now() < end) await new Promise((r) => setTimeout(r, 25));
    return text.includes(wanted);
  };
  return {
    until,
    close: async () => {
      controller.abort();
      await reading;
    },
  };
}

describe('the counter’s live events', () => {
  it('reach a stream open on one instance from a write through the other, within seconds', async () => {
    for (const [writeVia, writeCookie, listenOn, listenCookie, date] of [
      [A, onA, B, onB, '2026-11-23'],
      [B, onB, A, onA, '2026-11-24'],
    ] as const) {
      const stream = await openEvents(listenOn, listenCookie);
      try {
        expect(await stream.until(': connected', 5000)).toBe(true);
        const started = Date.now();
        const marked = await call(writeVia, 'PUT', '/api/counter/today', writeCookie, { date, products: [] });
        expect(marked.status).toBe(200);
        const event = `event: display-changed\ndata: ${JSON.stringify({ type: 'display-changed', date })}`;
        expect(await stream.until(event, 5000)).toBe(true);
        console.log(`cluster: a counter event written through one instance reached the other's stream in ${Date.now() - started} ms`);
      } finally {
        await stream.close();
      }
    }
  });
});

describe('a database node killed while writes run', () => {
  const acknowledged: string[] = [];
  const failed: { via: string; status: number | string }[] = [];
  afterAll(() => {
    console.log(
      `cluster: ${acknowledged.length} writes acknowledged around the kill, ${failed.length} refused or lost by the instance over the killed node`,
    );
  });

  it('loses no acknowledged write, and the instance over a surviving node keeps serving', async () => {
    let stop = false;
    let n = 0;
    const writer = async (base: string, cookie: string, via: string) => {
      while (!stop) {
        const id = `cluster-kill-${via}-${n++}`;
        try {
          const res = await call(base, 'POST', '/api/ingredients', cookie, {
            id,
            name: id,
            contains: ['milk'],
            mayContain: [],
            vegan: false,
            vegetarian: true,
          });
          if (res.status === 201) acknowledged.push(id);
          else failed.push({ via, status: res.status });
        } catch (err) {
          failed.push({ via, status: (err as Error).message });
          await new Promise((r) => setTimeout(r, 100));
        }
      }
    };
    const writers = [writer(A, onA, 'a'), writer(A, onA, 'a'), writer(B, onB, 'b'), writer(B, onB, 'b')];
    await new Promise((r) => setTimeout(r, 3000));
    process.kill(NODE2_PID, 'SIGKILL');
    const killedAt = acknowledged.length;
    await new Promise((r) => setTimeout(r, 12_000));
    stop = true;
    await Promise.all(writers);

    // Instance A, over node 1, kept writing after node 2 died…
    expect(acknowledged.slice(killedAt).filter((id) => id.startsWith('cluster-kill-a-')).length).toBeGreaterThan(0);
    // …never failing with a 5xx itself…
    expect(failed.filter((f) => f.via === 'a')).toEqual([]);
    // …and every write either instance acknowledged is there.
    const book = await call(A, 'GET', '/api/book', onA);
    expect(book.status).toBe(200);
    const present = new Set((book.body.ingredients as { id: string }[]).map((i) => i.id));
    expect(acknowledged.filter((id) => !present.has(id))).toEqual([]);
    expect(acknowledged.some((id) => id.startsWith('cluster-kill-b-'))).toBe(true);
  });
});
