import { readFileSync } from 'node:fs';
import autocannon from 'autocannon';
import Fastify from 'fastify';
import { KITCHEN_HEADER, type Me } from '@crumbproof/shared';
import { syntheticKitchen } from '../rules/core/testing/synthetic-kitchen';

/** One route under load (autocannon), against a bare Fastify route sending the same bytes in the same run. */
export interface LoadFigures {
  path: string;
  bytes: number;
  rps: number;
  p99Ms: number;
  errors: number;
  bareRps: number;
  bareP99Ms: number;
  ratio: number;
}

export interface ApiFigures extends LoadFigures {
  /** The declarations of every product for sale in one request (what the counter reads). */
  allProducts: LoadFigures;
  /** The API process's peak resident memory while under load. */
  rssMb: number | null;
  /** The standard synthetic book imported through POST /api/book/import. */
  importMs: number;
  importStatus: number;
  importRssMb: number | null;
}

const CONNECTIONS = 100;

/** A signed-in demo account: the headers of its requests, and the book id of the kitchen they name. */
interface SignedIn {
  headers: Record<string, string>;
  /** The kitchen's id in the recipe book (null for the one kitchen of a book given as site). */
  kitchenCode: string | null;
}

/**
 * Signs in a demo account and gives the headers of its requests: its session cookie and its first
 * kitchen (the demo manager works in two, and a request must name one).
 */
async function signIn(base: string, email: string): Promise<SignedIn> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base, 'sec-fetch-site': 'same-origin' },
    body: JSON.stringify({ email, password: 'crumbproof-demo' }),
  });
  if (!res.ok) throw new Error(`Signing in ${email} answered ${res.status}: ${await res.text()}`);
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const me = await fetch(`${base}/api/me`, { headers: { cookie } });
  if (!me.ok) throw new Error(`GET /api/me for ${email} answered ${me.status}: ${await me.text()}`);
  const [kitchen] = ((await me.json()) as Me).kitchens;
  return { headers: { cookie, ...(kitchen ? { [KITCHEN_HEADER]: String(kitchen.id) } : {}) }, kitchenCode: kitchen?.code ?? null };
}

/**
 * The standard synthetic book as the import route takes it into a kitchen: given as `site` where
 * the kitchen is the installation's only one (no book id), else as `sites` with the kitchen's id,
 * since a book given as site names no kitchen of several (the demo has two).
 */
export function standardBookFor(kitchenCode: string | null): string {
  const { site, ...book } = syntheticKitchen('standard');
  return JSON.stringify(kitchenCode === null ? { ...book, site } : { ...book, sites: [{ ...site, id: kitchenCode }] });
}

function load(url: string, seconds: number, headers: Record<string, string> = {}): Promise<autocannon.Result> {
  return autocannon({ url, connections: CONNECTIONS, duration: seconds, headers });
}

/** The resident memory (MB) of a process now, from /proc (Linux), or null where it cannot be read. */
function rssMbOf(pid: number): number | null {
  try {
    const kb = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return kb ? Number(kb[1]) / 1024 : null;
  } catch {
    return null;
  }
}

/** Samples a process's resident memory while `work` runs and gives the peak with the work's result. */
async function withPeakRss<T>(pid: number | null, work: () => Promise<T>): Promise<{ result: T; peakMb: number | null }> {
  let peak: number | null = null;
  const sample = () => {
    const mb = pid === null ? null : rssMbOf(pid);
    if (mb !== null) peak = Math.max(peak ?? 0, mb);
  };
  sample();
  const timer = setInterval(sample, 100);
  try {
    const result = await work();
    sample();
    return { result, peakMb: peak };
  } finally {
    clearInterval(timer);
  }
}

/** Loads a route of the app, then a bare Fastify route answering its bytes, `seconds` each. */
async function routeAgainstBare(base: string, path: string, headers: Record<string, string>, seconds: number): Promise<LoadFigures> {
  const one = await fetch(`${base}${path}`, { headers });
  if (!one.ok) throw new Error(`GET ${path} answered ${one.status}: ${await one.text()}`);
  const body = Buffer.from(await one.arrayBuffer());
  const routed = await load(`${base}${path}`, seconds, headers);
  const bare = Fastify();
  bare.get('/bare', (_req, reply) => reply.type('application/json; charset=utf-8').send(body));
  const address = await bare.listen({ host: '127.0.0.1', port: 0 });
  try {
    const plain = await load(`${address}/bare`, seconds);
    return {
      path,
      bytes: body.length,
      rps: routed.requests.average,
      p99Ms: routed.latency.p99,
      errors: routed.errors + routed.timeouts + routed.non2xx,
      bareRps: plain.requests.average,
      bareP99Ms: plain.latency.p99,
      ratio: routed.requests.average / plain.requests.average,
    };
  } finally {
    await bare.close();
  }
}

/**
 * The API as a client sees it, on the app that api/scripts/bench.mjs started over the demo
 * kitchen: a product's declaration (stored) and every product's (the counter's feed) under 100
 * connections, with the process's memory; then the standard synthetic book imported through the
 * API, last, since it changes the kitchen.
 */
export async function measureApi(base: string, pid: number | null, seconds = 10): Promise<ApiFigures> {
  const manager = await signIn(base, 'manager@example.com');
  const counter = await signIn(base, 'counter@example.com');
  const { result: one, peakMb } = await withPeakRss(pid, () =>
    routeAgainstBare(base, '/api/recipes/strawberry-layer-cake/declaration', manager.headers, seconds),
  );
  const allProducts = await routeAgainstBare(base, '/api/counter/products', counter.headers, seconds);
  const book = standardBookFor(manager.kitchenCode);
  const started = performance.now();
  const imported = await withPeakRss(pid, () =>
    fetch(`${base}/api/book/import`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: base, 'sec-fetch-site': 'same-origin', ...manager.headers },
      body: book,
    }).then(async (res) => {
      await res.arrayBuffer();
      return res.status;
    }),
  );
  return {
    ...one,
    allProducts,
    rssMb: peakMb,
    importMs: performance.now() - started,
    importStatus: imported.result,
    importRssMb: imported.peakMb,
  };
}
