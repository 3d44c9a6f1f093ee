import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { ApiErrorBody } from '@crumbproof/shared';
import { freePort, type instance } from '../scripts/lib/mariadb.mjs';
import { DATABASE_UNAVAILABLE_MESSAGE } from '../src/common/database-unavailable';
import { startOwnMariadb } from './support/own-mariadb';
import { startTestApp, type TestApp } from './support/test-app';

const UNAVAILABLE: ApiErrorBody = { statusCode: 503, code: 'database-unavailable', message: DATABASE_UNAVAILABLE_MESSAGE };
/** The health check's own words for the same. */
const HEALTH_DOWN: ApiErrorBody = {
  statusCode: 503,
  code: 'database-unavailable',
  message:
    'Crumbproof is running but cannot reach its database (the connection to it failed): nothing can be read or saved until it answers again.',
};

/**
 * Routes that answer without reading the database: the OpenAPI document and its viewer, the
 * public routes that check their body first (an empty one is refused in words), and the files
 * that are no kitchen's records. Every other route answers 503 while the database is away.
 */
const WITHOUT_DATABASE: Record<string, number> = {
  'POST /api/auth/sign-in': 400,
  'POST /api/auth/first-manager': 400,
  'POST /api/auth/password-reset': 400,
  'POST /api/auth/account-link': 400,
  'POST /api/auth/set-password': 400,
  'GET /p/fonts/:file': 404,
  'GET /api/docs': 200,
  'GET /api/docs/': 200,
  'GET /api/docs/index.html': 200,
  'GET /api/docs/swagger-ui-init.js': 200,
  'GET /api/docs/docs/swagger-ui-init.js': 200,
  'GET /api/docs/LICENSE': 404,
  'GET /api/docs/*': 200,
  'GET /api/docs/docs/*': 200,
  'GET /api/docs-json': 200,
  'GET /api/docs-yaml': 200,
};

/**
 * The API on a MariaDB of its own (api/scripts/lib/mariadb.mjs on a free port, never the shared
 * test database), whose server process is killed (SIGKILL) while requests run: every route then
 * answers 503 in words and the API keeps running; once the server is started again on the same
 * data, the API serves again by itself within 5 s, with every write it acknowledged.
 */
describe('the database stops and comes back (a MariaDB of its own)', () => {
  const dir = mkdtempSync(join(tmpdir(), 'crumbproof-outage-'));
  let db: ReturnType<typeof instance>;
  let t: TestApp;
  let manager: string;
  const unhandled: unknown[] = [];
  const onUnhandled = (reason: unknown) => unhandled.push(reason);

  beforeAll(async () => {
    process.on('unhandledRejection', onUnhandled);
    const port = await freePort();
    db = await startOwnMariadb(dir, port);
    t = await startTestApp({ seed: true, settings: { DB_HOST: '127.0.0.1', DB_PORT: String(port) } });
    manager = await t.signIn('manager@example.com');
  }, 120_000);

  afterAll(async () => {
    process.off('unhandledRejection', onUnhandled);
    try {
      // Without its database (a failure while it was away) the app is closed alone: its data goes with the folder.
      if (db.runningPid()) await t?.close();
      else await t?.app.close();
    } finally {
      await db?.stop();
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);

  const ingredient = (n: number) => ({
    id: `outage-flour-${n}`,
    name: `Outage flour ${n}`,
    contains: ['wheat'],
    mayContain: [],
    composition: 'Wheat flour',
    vegan: true,
    vegetarian: true,
  });

  it('answers 503 in words while the database is away, and serves again within 5 s of its return with every acknowledged write', async () => {
    expect((await t.req('GET', '/api/health')).json()).toEqual({ status: 'ok', database: 'up' });

    // Writes and reads run one after another while the server is killed under them.
    const acknowledged: string[] = [];
    const answers: { route: string; status: number; body: string; ms: number }[] = [];
    let stop = false;
    const loop = async (route: string, send: (n: number) => ReturnType<TestApp['req']>, onOk?: (n: number) => void) => {
      for (let n = 0; !stop; n++) {
        const started = Date.now();
        const res = await send(n);
        answers.push({ route, status: res.statusCode, body: res.body, ms: Date.now() - started });
        if (res.statusCode < 300) onOk?.(n);
      }
    };
    const running = [
      loop(
        'POST /api/ingredients',
        (n) => t.req('POST', '/api/ingredients', manager, ingredient(n)),
        (n) => acknowledged.push(ingredient(n).id),
      ),
      loop('GET /api/declarations', () => t.req('GET', '/api/declarations', manager)),
      loop('GET /api/ingredients', () => t.req('GET', '/api/ingredients', manager)),
    ];
    while (acknowledged.length < 3) await new Promise((r) => setTimeout(r, 20));
    const pid = db.runningPid()!;
    expect(pid).toBeGreaterThan(0);
    process.kill(pid, 'SIGKILL');
    while (isAlive(pid)) await new Promise((r) => setTimeout(r, 20));
    const killedAt = answers.length;
    while (answers.slice(killedAt).filter((a) => a.status === 503).length < 9) await new Promise((r) => setTimeout(r, 20));
    stop = true;
    await Promise.all(running);

    // Every answer was a success from before the kill or the 503 in words: never a 500, never a hang.
    for (const a of answers) {
      if (a.status < 300) continue;
      expect({ route: a.route, status: a.status, body: JSON.parse(a.body) as unknown }).toEqual({
        route: a.route,
        status: 503,
        body: UNAVAILABLE,
      });
    }
    expect(Math.max(...answers.map((a) => a.ms))).toBeLessThan(10_000);

    // Every route, as the manager calls it: the 503 in words, nothing internal. (The app's modules
    // are loaded once the app's settings are set: see startTestApp.)
    const { registeredRoutes } = await import('../src/app.factory');
    const got: Record<string, number> = {};
    for (const { method, url } of registeredRoutes(t.app)) {
      const route = `${method} ${url}`;
      const path = url.replace(':code', 'vanilla-sponge').replace(':id', '1').replace(':file', 'font.ttf').replace('*', 'swagger-ui.css');
      const isUpload = method === 'POST' && /\/specifications$|\/ingredients\/import/.test(url);
      const payload = ['POST', 'PUT', 'PATCH'].includes(method) && !isUpload ? {} : undefined;
      const started = Date.now();
      const res = await t.req(method as 'GET', path, manager, payload);
      expect({ route, ms: Date.now() - started < 10_000 }).toEqual({ route, ms: true });
      got[route] = res.statusCode;
      if (res.statusCode === 503)
        expect({ route, body: res.json<unknown>() }).toEqual({ route, body: route === 'GET /api/health' ? HEALTH_DOWN : UNAVAILABLE });
      expect(res.body).not.toMatch(/ECONNREFUSED|SqlError|Sequelize|127\.0\.0\.1|\bat [\w.<>]+ \(/);
    }
    const answeredWithout = Object.fromEntries(Object.entries(got).filter(([, status]) => status !== 503));
    expect(answeredWithout).toEqual(WITHOUT_DATABASE);

    // The health check says so at once, in words.
    const started = Date.now();
    const health = await t.req('GET', '/api/health');
    expect(Date.now() - started).toBeLessThan(3000);
    expect(health.statusCode).toBe(503);
    expect(health.json()).toEqual(HEALTH_DOWN);
    // The API never crashed: nothing was left unhandled.
    expect(unhandled).toEqual([]);

    // The server starts again on the same data; the API serves by itself within 5 s.
    await db.start();
    const back = Date.now();
    let served = false;
    while (!served && Date.now() - back < 5000) {
      const res = await t.req('GET', '/api/ingredients', manager);
      served = res.statusCode === 200;
      if (!served) await new Promise((r) => setTimeout(r, 100));
    }
    expect({ served, within5s: Date.now() - back <= 5000 }).toEqual({ served: true, within5s: true });
    expect((await t.req('GET', '/api/health')).json()).toEqual({ status: 'ok', database: 'up' });

    // Every write acknowledged before the kill is there.
    const ids = new Set((await t.req('GET', '/api/ingredients', manager)).json<{ id: string }[]>().map((i) => i.id));
    expect(acknowledged.length).toBeGreaterThanOrEqual(3);
    expect(acknowledged.filter((id) => !ids.has(id))).toEqual([]);
    // And a write works again.
    expect((await t.req('POST', '/api/ingredients', manager, ingredient(9999))).statusCode).toBe(201);
  }, 120_000);
});

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}
