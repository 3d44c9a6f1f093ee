// npm run bench [-- --quick]: the benchmarks of api/src/cli/bench.ts (see lib/tsx-cli.mjs). Unless
// --quick, the built app is started first over a throwaway MariaDB with the demo kitchen, so that
// the bench can load its routes (BENCH_API_URL, BENCH_API_PID), and the counter's lookup is timed
// in Chromium by tests/e2e/counter-speed.test.ts against it (BENCH_COUNTER_MS).
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { ensureMariadbInstalled } from './lib/mariadb.mjs';
import { startThrowawayApp } from './lib/throwaway-app.mjs';
import { runCli } from './lib/tsx-cli.mjs';
import { buildAll, ensureChromium, ensureNodeModules, ROOT, step } from './lib/workspace.mjs';

if (process.argv.includes('--quick')) runCli('bench');
else await benchWithApp();

async function benchWithApp() {
  ensureNodeModules();
  ensureMariadbInstalled();
  ensureChromium();
  buildAll();
  const app = await startThrowawayApp({ name: 'bench' });
  let status;
  try {
    step('Timing the counter in Chromium…');
    const counter = spawnSync(
      'node',
      ['node_modules/vitest/vitest.mjs', 'run', '--config', 'tests/vitest.config.ts', 'e2e/counter-speed.test.ts'],
      { cwd: ROOT, env: { ...process.env, CRUMBPROOF_URL: app.url, FORCE_COLOR: '0' }, encoding: 'utf8' },
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
          BENCH_API_URL: app.url,
          BENCH_API_PID: String(app.server.pid),
          ...(median ? { BENCH_COUNTER_MS: median[1] } : {}),
        },
      },
    );
    status = bench.status ?? 1;
  } finally {
    await app.stop();
  }
  process.exit(status);
}
