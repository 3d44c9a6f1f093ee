// npm test: first the checks (lint, format and a full type-check, each counted as one), then the
// same provisioning as npm start on a throwaway datadir and another port, and every suite (api on
// the real MariaDB, web, end-to-end in Chromium), closing with one line "N passed, N failed" over
// all of them. `npm test -- checks|api|web|e2e` runs only the steps named.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runChecks } from './lib/checks.mjs';
import { startDevInbox } from './lib/dev-inbox.mjs';
import { ensureMariadbInstalled, freePort, instance } from './lib/mariadb.mjs';
import {
  buildAll,
  DB_USERS,
  dbEnv,
  ensureChromium,
  ensureNodeModules,
  ensurePoppler,
  ROOT,
  run,
  startChild,
  step,
  waitForHttp,
} from './lib/workspace.mjs';

const STEPS = ['checks', 'api', 'web', 'e2e'];
const named = process.argv.slice(2);
const unknown = named.filter((a) => !STEPS.includes(a));
if (unknown.length > 0) {
  console.error(`npm test: there is no step called ${unknown.join(', ')}. Name checks, api, web or e2e, or none for all of them.`);
  process.exit(2);
}
const all = named.length === 0;
const steps = Object.fromEntries(STEPS.map((s) => [s, all || named.includes(s)]));

/** @typedef {{ name: string; passed: number; failed: number }} Result */
/** @type {Result[]} */
const results = [];
const scratch = mkdtempSync(join(tmpdir(), 'crumbproof-test-'));

/** @typedef {{ numPassedTests?: number; numFailedTests?: number; numRuntimeErrorTestSuites?: number }} Report */

/**
 * @param {string} file
 * @returns {Report | null}
 */
function readJson(file) {
  try {
    /** @type {unknown} */
    const report = JSON.parse(readFileSync(file, 'utf8'));
    return /** @type {Report} */ (report);
  } catch {
    return null;
  }
}

/**
 * Runs a suite; counts come from its JSON report, and a suite that could not report counts as one failure.
 * @param {string} name
 * @param {string} cmd
 * @param {string[]} args
 * @param {NodeJS.ProcessEnv} env
 * @param {string} reportFile
 * @param {(report: Report) => { passed: number; failed: number }} count
 */
function runSuite(name, cmd, args, env, reportFile, count, cwd = ROOT) {
  step(`Suite: ${name}`);
  let exit = 0;
  try {
    run(cmd, args, { env, cwd });
  } catch {
    exit = 1;
  }
  const report = existsSync(reportFile) ? readJson(reportFile) : null;
  const counted = report ? count(report) : { passed: 0, failed: 1 };
  if (exit !== 0 && counted.failed === 0) counted.failed = 1; // the runner failed outside any test
  results.push({ name, ...counted });
}

/** @param {Report} r */
const jestCount = (r) => ({ passed: r.numPassedTests ?? 0, failed: (r.numFailedTests ?? 0) + (r.numRuntimeErrorTestSuites ?? 0) });
const vitestCount = jestCount; // vitest's json reporter writes the same totals

async function main() {
  ensureNodeModules();
  if (steps.checks) {
    step('Checks: lint, format and type-check, before any suite…');
    try {
      for (const r of await runChecks()) results.push({ name: r.label, passed: r.passed ? 1 : 0, failed: r.passed ? 0 : 1 });
    } catch (err) {
      console.error(`\nThe checks could not run: ${err instanceof Error ? err.message : String(err)}`);
      results.push({ name: 'checks', passed: 0, failed: 1 });
    }
  }
  if (steps.api || steps.web || steps.e2e) await suites();
  summarise();
}

async function suites() {
  ensureMariadbInstalled((m) => step(m));
  if (steps.e2e) ensureChromium();
  if (steps.api || steps.e2e) ensurePoppler();

  const port = await freePort();
  const db = instance({ dir: join(scratch, 'mariadb'), port });
  /** @type {import('node:child_process').ChildProcess | null} */
  let server = null;
  /** @type {import('./lib/dev-inbox.mjs').DevInbox | null} */
  let inbox = null;
  const cleanup = async () => {
    if (server && server.exitCode === null) server.kill('SIGTERM');
    await inbox?.stop();
    await db.stop();
    rmSync(scratch, { recursive: true, force: true });
  };
  process.on('SIGINT', () => void cleanup().then(() => process.exit(130)));

  try {
    step(`Starting a throwaway MariaDB on 127.0.0.1:${port}…`);
    await db.start();
    db.createDatabase({ database: 'crumbproof_test', ...DB_USERS });

    if (steps.api) {
      const report = join(scratch, 'jest.json');
      runSuite(
        'api (jest, real MariaDB)',
        'node',
        ['node_modules/jest/bin/jest.js', '--config', 'api/jest.config.js', '--json', `--outputFile=${report}`],
        { ...dbEnv({ port, database: 'crumbproof_test' }), NODE_OPTIONS: '--experimental-vm-modules --no-warnings' },
        report,
        jestCount,
      );
    }
    if (steps.web) {
      const report = join(scratch, 'vitest-web.json');
      runSuite(
        'web (vitest)',
        'node',
        [join(ROOT, 'node_modules/vitest/vitest.mjs'), 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`],
        { FORCE_COLOR: '0' },
        report,
        vitestCount,
        join(ROOT, 'web'),
      );
    }
    if (steps.e2e) {
      buildAll();
      const appPort = await freePort();
      db.createDatabase({ database: 'crumbproof_test_e2e', ...DB_USERS });
      // The app's mail goes to an inbox on this machine, which the end-to-end tests read.
      inbox = await startDevInbox({ from: 'crumbproof-e2e@localhost.localdomain' });
      const env = {
        ...inbox.env,
        MAIL_POLL_SECONDS: '5',
        ...dbEnv({ port, database: 'crumbproof_test_e2e' }),
        NODE_ENV: 'test',
        HOST: '127.0.0.1',
        PORT: String(appPort),
        JWT_SECRET: 'test-secret-for-the-end-to-end-run-only-0123456789',
        WEB_DIST: join(ROOT, 'web', 'dist'),
        LOG_LEVEL: 'warn',
        SIGN_IN_LIMIT: '50',
      };
      run('node', ['api/dist/cli/db.js', 'setup'], { env });
      server = startChild('node', ['api/dist/main.js'], env);
      await waitForHttp(`http://127.0.0.1:${appPort}/api/health`, 60_000, server);
      const report = join(scratch, 'vitest-e2e.json');
      runSuite(
        'end-to-end and cross-package (vitest + playwright-core on Chromium)',
        'node',
        [
          'node_modules/vitest/vitest.mjs',
          'run',
          '--config',
          'tests/vitest.config.ts',
          '--reporter=default',
          '--reporter=json',
          `--outputFile.json=${report}`,
        ],
        { CRUMBPROOF_URL: `http://127.0.0.1:${appPort}`, DB_TEST_PORT: String(port), MAILDEV_URL: inbox.url, FORCE_COLOR: '0' },
        report,
        vitestCount,
      );
    }
  } catch (err) {
    console.error(`\n${err instanceof Error ? err.message : String(err)}`);
    results.push({ name: 'set-up', passed: 0, failed: 1 });
  } finally {
    await cleanup();
  }
}

function summarise() {
  rmSync(scratch, { recursive: true, force: true });
  console.log('\nSteps:');
  for (const r of results) console.log(`  ${r.name}: ${r.passed} passed, ${r.failed} failed`);
  const passed = results.reduce((n, r) => n + r.passed, 0);
  const failed = results.reduce((n, r) => n + r.failed, 0);
  console.log(`${passed} passed, ${failed} failed`);
  process.exit(failed > 0 || results.length === 0 ? 1 : 0);
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : String(err));
  process.exit(1);
});
