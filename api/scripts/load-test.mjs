// npm run test:load: the built app over a throwaway MariaDB with the demo kitchen, loaded on loopback
// by autocannon (60 s, 100 connections; LOAD_SECONDS and LOAD_CONNECTIONS change them) with mixed
// reads and writes, as the pastry chef and the counter use it: every product's declarations, the
// ingredient and recipe lists, the counter's products, and a new ingredient in one request of five.
// It passes when no request failed (no error, no timeout, no answer other than 2xx) and every
// ingredient whose creation was acknowledged is there afterwards, read back through the API once
// the server has finished the requests still unanswered at the deadline, and counted in the
// database; it prints the figures with the machine's core count.
import { spawnSync } from 'node:child_process';
import { availableParallelism, cpus } from 'node:os';
import { ensureMariadbInstalled } from './lib/mariadb.mjs';
import { startThrowawayApp } from './lib/throwaway-app.mjs';
import { ensureNodeModules, ROOT, run, step } from './lib/workspace.mjs';

const SECONDS = Number(process.env.LOAD_SECONDS ?? 60);
const CONNECTIONS = Number(process.env.LOAD_CONNECTIONS ?? 100);
const DEMO_PASSWORD = 'crumbproof-demo';

ensureNodeModules();
ensureMariadbInstalled(step);
step('Building shared and api…');
run('npm', ['run', 'build', '-w', 'shared']);
run('npm', ['run', 'build', '-w', 'api']);

/** @type {string[]} */
let failures = [];
let createdWrites = 0;
/** @type {import('./lib/throwaway-app.mjs').ThrowawayApp | null} */
let app = null;
try {
  app = await startThrowawayApp({ name: 'load' });
  const { url, env, db } = app;
  failures = await load(url);
  const rows = countIngredients(env, db.port);
  if (rows.error !== undefined) failures.push(rows.error);
  else if (rows.count !== createdWrites)
    failures.push(`The database holds ${rows.count} of the load's ingredients, the API lists ${createdWrites}.`);
  else step(`The database holds the ${rows.count} ingredients the load created, as the API lists them.`);
} catch (e) {
  failures.push(e instanceof Error ? e.message : String(e));
} finally {
  await app?.stop();
}
if (failures.length > 0) {
  process.stderr.write(`\nThe load test failed:\n${failures.map((f) => `- ${f}`).join('\n')}\n`);
  process.exit(1);
}
step('The load test passed: no failed request, every acknowledged write present.');

/**
 * Signs in the pastry chef (writes) once, runs autocannon and checks every acknowledged write.
 * @param {string} url
 * @returns {Promise<string[]>} what went wrong, in words
 */
async function load(url) {
  const { default: autocannon } = await import('autocannon');
  const signIn = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'chef@example.com', password: DEMO_PASSWORD }),
  });
  const cookie = /cp_session=[^;]+/.exec(signIn.headers.get('set-cookie') ?? '')?.[0];
  if (!signIn.ok || !cookie) return [`The pastry chef could not sign in: ${signIn.status} ${await signIn.text()}`];
  // The demo's pastry chef works in both its kitchens: every request names the first (the bakehouse).
  const me = /** @type {{ kitchens: { id: number }[] }} */ (await (await fetch(`${url}/api/me`, { headers: { cookie } })).json());
  const session = { cookie, 'x-crumbproof-kitchen': String(me.kitchens[0].id) };
  const before = await ingredientIds(url, session);

  /** @type {Set<string>} */
  const acknowledged = new Set();
  let writes = 0;
  let next = 0;
  /** @type {Record<string, number>} */
  const statuses = {};
  const read = (/** @type {string} */ path) => ({ method: /** @type {const} */ ('GET'), path });
  step(`Loading ${url} for ${SECONDS} s over ${CONNECTIONS} connections (reads and one write in five)…`);
  const result = await autocannon({
    url,
    connections: CONNECTIONS,
    duration: SECONDS,
    timeout: 30,
    headers: { ...session, 'content-type': 'application/json' },
    requests: [
      read('/api/declarations'),
      read('/api/ingredients'),
      {
        method: 'POST',
        path: '/api/ingredients',
        setupRequest: (req) => {
          const n = next++;
          const id = `load-flour-${n}`;
          writes++;
          return {
            ...req,
            body: JSON.stringify({
              id,
              name: `Load flour ${n}`,
              contains: ['wheat'],
              mayContain: [],
              composition: 'Wheat flour',
              vegan: true,
              vegetarian: true,
            }),
          };
        },
        onResponse: (status, body) => {
          // A 201 without the ingredient's id is counted below as a write kept without its answer.
          const id = status === 201 ? idOf(body) : null;
          if (id) acknowledged.add(id);
        },
      },
      read('/api/recipes'),
      read('/api/counter/products'),
    ],
  });
  for (const [code, n] of Object.entries(result.statusCodeStats ?? {})) statuses[code] = n.count ?? 0;

  // autocannon stops at the deadline without waiting for the answers still due: those writes are
  // neither acknowledged nor refused, and the server finishes them; read back once it has.
  let after = await ingredientIds(url, session);
  for (let settled = false; !settled;) {
    await new Promise((r) => setTimeout(r, 1000));
    const again = await ingredientIds(url, session);
    settled = again.size === after.size;
    after = again;
  }
  const missing = [...acknowledged].filter((id) => !after.has(id));
  const created = [...after].filter((id) => !before.has(id)).length;
  const cores = availableParallelism();
  const lines = [
    `Machine: ${cores} cores (${cpus()[0]?.model.trim() ?? 'unknown CPU'}), Node ${process.version}, on loopback`,
    `Duration ${result.duration.toFixed(1)} s, ${result.connections} connections`,
    `Requests: ${result.requests.total} (${result.requests.average.toFixed(0)}/s on average)`,
    `Latency: median ${result.latency.p50} ms, p90 ${result.latency.p90} ms, p99 ${result.latency.p99} ms, max ${result.latency.max} ms`,
    `Answers by status: ${JSON.stringify(statuses)}`,
    `Errors ${result.errors}, timeouts ${result.timeouts}, not 2xx ${result.non2xx}`,
    `Writes sent ${writes}, acknowledged ${acknowledged.size} (the rest still unanswered at the deadline), new ingredients read back ${created}, acknowledged but missing ${missing.length}`,
  ];
  process.stdout.write(`\n${lines.join('\n')}\n\n`);

  /** @type {string[]} */
  const failed = [];
  if (result.errors > 0 || result.timeouts > 0) failed.push(`${result.errors} requests failed, ${result.timeouts} of them timed out.`);
  if (result.non2xx > 0) failed.push(`${result.non2xx} answers were not 2xx: ${JSON.stringify(statuses)}.`);
  if (acknowledged.size === 0) failed.push('No write was acknowledged.');
  if (missing.length > 0) failed.push(`${missing.length} acknowledged ingredients are missing, such as ${missing.slice(0, 5).join(', ')}.`);
  if (created > writes) failed.push(`${created} new ingredients are there for ${writes} creations sent.`);
  createdWrites = created;
  return failed;
}

/**
 * The id in a saved ingredient's answer, if it has one.
 * @param {string} body
 * @returns {string | null}
 */
function idOf(body) {
  try {
    /** @type {unknown} */
    const saved = JSON.parse(body);
    return typeof saved === 'object' && saved !== null && 'id' in saved && typeof saved.id === 'string' ? saved.id : null;
  } catch {
    return null;
  }
}

/**
 * The ids of every ingredient, read through the API.
 * @param {string} url
 * @param {Record<string, string>} session the session cookie and the kitchen header
 * @returns {Promise<Set<string>>}
 */
async function ingredientIds(url, session) {
  const res = await fetch(`${url}/api/ingredients`, { headers: session });
  if (!res.ok) throw new Error(`The ingredient list could not be read: ${res.status} ${await res.text()}`);
  const list = /** @type {{ id: string }[]} */ (await res.json());
  return new Set(list.map((i) => i.id));
}

/**
 * The ingredients' rows in the database, counted by the mariadb client as the owner.
 * @param {Record<string, string>} env
 * @param {number} port
 * @returns {{ count: number; error?: undefined } | { error: string; count?: undefined }}
 */
function countIngredients(env, port) {
  const client = spawnSync(
    'mariadb',
    [
      '--no-defaults',
      `--host=127.0.0.1`,
      `--port=${port}`,
      `--user=${env.DB_OWNER_USER}`,
      `--password=${env.DB_OWNER_PASSWORD}`,
      '--batch',
      '--skip-column-names',
      env.DB_NAME,
      '-e',
      "SELECT COUNT(*) FROM ingredients WHERE code LIKE 'load-flour-%'",
    ],
    { cwd: ROOT, encoding: 'utf8' },
  );
  if (client.status !== 0) return { error: `The database could not be counted: ${client.stderr}` };
  return { count: Number(client.stdout.trim()) };
}
