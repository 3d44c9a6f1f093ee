// Helpers shared by npm start and npm test. Node built-ins only.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { aptInstall } from './mariadb.mjs';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../../..');

/** @param {string} message */
export function step(message) {
  console.log(`\n▸ ${message}`);
}

/**
 * Runs a command in the foreground; throws with its name when it fails.
 * @param {string} cmd
 * @param {string[]} args
 * @param {import('node:child_process').SpawnSyncOptions} [opts]
 */
export function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { cwd: ROOT, stdio: 'inherit', ...opts, env: { ...process.env, ...(opts.env ?? {}) } });
  if (r.status !== 0) throw new Error(`${[cmd, ...args].join(' ')} failed (exit ${r.status ?? r.signal}).`);
  return r;
}

/** npm ci when node_modules is absent (or older than the lock file). */
export function ensureNodeModules() {
  const marker = join(ROOT, 'node_modules', '.package-lock.json');
  const lock = join(ROOT, 'package-lock.json');
  if (existsSync(marker) && readFileSync(marker, 'utf8').length > 0) return;
  step('Installing packages (npm ci)…');
  run('npm', ['ci', '--no-audit', '--no-fund'], { env: { CI: process.env.CI ?? '' } });
  if (!existsSync(lock)) throw new Error('package-lock.json is missing.');
}

/** @param {string[]} packages Debian packages the tests need, each installed when its program is missing. */
function ensureDebian(packages) {
  /** @type {Record<string, string>} */
  const programs = { chromium: '/usr/bin/chromium', 'poppler-utils': '/usr/bin/pdftoppm' };
  const missing = packages.filter((p) => !existsSync(programs[p] ?? p));
  if (missing.length === 0) return;
  step(`Not found: installing Debian’s ${missing.join(' and ')} for the tests…`);
  aptInstall(missing);
}

/** Chromium for the browser tests. */
export function ensureChromium() {
  ensureDebian(['chromium']);
}

/** poppler-utils' pdftoppm, which turns label PDFs into images for the barcode tests. */
export function ensurePoppler() {
  ensureDebian(['poppler-utils']);
}

/** Builds shared, api and web. */
export function buildAll() {
  step('Building shared, api and web…');
  run('npm', ['run', 'build', '-w', 'shared']);
  run('npm', ['run', 'build', '-w', 'api']);
  run('npm', ['run', 'build', '-w', 'web']);
}

/**
 * A signing secret kept under .data so that sessions survive a restart.
 * @param {string} dir
 */
export function localSecret(dir) {
  mkdirSync(dir, { recursive: true });
  const file = join(dir, 'jwt-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

/**
 * Starts a long-running child by its binary (so its pid is the server's own).
 * @param {string} cmd
 * @param {string[]} args
 * @param {NodeJS.ProcessEnv} env
 * @param {{ cwd?: string; stdio?: import('node:child_process').StdioOptions }} [opts]
 * @returns {import('node:child_process').ChildProcess}
 */
export function startChild(cmd, args, env, opts = {}) {
  return spawn(cmd, args, { cwd: opts.cwd ?? ROOT, env: { ...process.env, ...env }, stdio: opts.stdio ?? 'inherit' });
}

/**
 * Waits until `url` answers 2xx, failing at once if `child` (the server) stops first.
 * @param {string} url
 * @param {number} [timeoutMs]
 * @param {import('node:child_process').ChildProcess} [child]
 */
export async function waitForHttp(url, timeoutMs = 60_000, child) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child && child.exitCode !== null) throw new Error(`The server stopped (exit ${child.exitCode}) before answering ${url}.`);
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      /* not yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`No answer from ${url} within ${timeoutMs / 1000} s.`);
}

/**
 * The private database's two users: the owner migrates (and grants), the API runs as the runtime
 * user, who may only read and add audit_events rows (see mariadb.mjs createDatabase).
 */
export const DB_USERS = {
  user: 'crumbproof',
  password: 'crumbproof-local',
  runtimeUser: 'crumbproof_app',
  runtimePassword: 'crumbproof-app-local',
};

/** @param {{ port: number; database: string }} where */
export function dbEnv({ port, database }) {
  return {
    DB_HOST: '127.0.0.1',
    DB_PORT: String(port),
    DB_NAME: database,
    DB_USER: DB_USERS.runtimeUser,
    DB_PASSWORD: DB_USERS.runtimePassword,
    DB_OWNER_USER: DB_USERS.user,
    DB_OWNER_PASSWORD: DB_USERS.password,
  };
}
