// npm run bench [-- --quick]: the benchmarks of api/src/cli/bench.ts (see lib/tsx-cli.mjs). Unless
// --quick, the built app is started first over a throwaway MariaDB with the demo kitchen, so that
// the bench can load its routes (BENCH_API_URL, BENCH_API_PID), and the counter's lookup is timed
// in Chromium by tests/e2e/counter-speed.test.ts against it (BENCH_COUNTER_MS).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ensureMariadbInstalled, freePort, instance } from './lib/mariadb.mjs';
import { runCli } from './lib/tsx-cli.mjs';
import {
  buildAll,
  DB_USERS,
  dbEnv,
  ensureChromium,
  ensureNodeModules,
  ROOT,
  run,
  startChild,
  step,
  waitForHttp,
} from './lib/workspace.mjs';

if (process.argv.includes('--quick')) runCli('bench');
else await benchWithApp();

async function benchWithApp() {
  ensureNodeModules();
  ensureMariadbInstalled(step);
  ensureChromium();
  buildAll();
  const scratch = mkdtempSync(join(tmpdir(), 'crumbproof-bench-'));
  const db = instance({ dir: join(scratch, 'mariadb'), port: await freePort() });
  /** @type {import('node:child_process').ChildProcess | null} */
  let server = null;
  const cleanup = async () => {
    if (server && server.exitCode === null) server.kill('SIGTERM');
    await db.stop();
    rmSync(scratch, { recursive: true, force: true });
  };
  process.on('SIGINT', () => void cleanup().then(() => process.exit(130)));
  let status;
  try {
    step(`Starting a throwaway MariaDB on 127.0.0.1:${db.port} and the app over the demo kitchen…`);
    await db.start();
    db.createDatabase({ database: 'crumbproof_bench', ...DB_USERS });
    const appPort = await freePort();
    const env = {
      ...dbEnv({ port: db.port, database: 'crumbproof_bench' }),
      NODE_ENV: 'production',
      HOST: '127.0.0.1',
      PORT: String(appPort),
      JWT_SECRET: 'bench-secret-for-this-machine-only-0123456789abcdef',
      DEMO_KITCHEN: 'true',
      LOG_LEVEL: 'error',
    };
    run('node', ['api/dist/cli/db.js', 'setup'], { env });
    server = startChild('node', ['api/dist/main.js'], env);
    const url = `http://127.0.0.1:${appPort}`;
    await waitForHttp(`${url}/api/health`, 60_000, server);

    step('Timing the counter in Chromium…');
    const counter = spawnSync(
      'node',
      ['node_modules/vitest/vitest.mjs', 'run', '--config', 'tests/vitest.config.ts', 'e2e/counter-speed.test.ts'],
      { cwd: ROOT, env: { ...process.env, CRUMBPROOF_URL: url, FORCE_COLOR: '0' }, encoding: 'utf8' },
    );
    const median = /median ([\d.]+) ms/.exec(counter.stdout ?? '');
    if (!median) process.stderr.write(`The counter's timing did not run:\n${(counter.stdout ?? '') + (counter.stderr ?? '')}\n`);

    const bench = spawnSync(
      join(ROOT, 'node_modules', '.bin', 'tsx'),
      ['--conditions=source', join(ROOT, 'api', 'src', 'cli', 'bench.ts'), ...process.argv.slice(2)],
      {
        cwd: ROOT,
        stdio: 'inherit',
        env: {
          ...process.env,
          BENCH_API_URL: url,
          BENCH_API_PID: String(server.pid),
          ...(median ? { BENCH_COUNTER_MS: median[1] } : {}),
        },
      },
    );
    status = bench.status ?? 1;
  } finally {
    await cleanup();
  }
  process.exit(status);
}
