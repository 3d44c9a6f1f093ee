// npm run test:cluster: a three-node MariaDB Galera cluster on loopback (lib/galera.mjs), the
// built app migrated and seeded with the demo kitchen through the first node, two API instances
// (one over node 1, one over node 2) sharing one JWT secret, and tests/cluster/ run against them
// (CLUSTER_API_A, CLUSTER_API_B, and CLUSTER_NODE2_PID for the node the kill test ends).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { galeraCluster } from './lib/galera.mjs';
import { ensureMariadbInstalled, freePort } from './lib/mariadb.mjs';
import { buildAll, DB_USERS, dbEnv, ensureNodeModules, ROOT, run, startChild, step, waitForHttp } from './lib/workspace.mjs';

const DATABASE = 'crumbproof_cluster';

ensureNodeModules();
ensureMariadbInstalled(step);
if (!process.argv.includes('--no-build')) buildAll();
const scratch = mkdtempSync(join(tmpdir(), 'crumbproof-cluster-'));
const cluster = await galeraCluster({ dir: scratch });
/** @type {import('node:child_process').ChildProcess[]} */
const servers = [];
const cleanup = async () => {
  for (const s of servers) if (s.exitCode === null) s.kill('SIGTERM');
  await cluster.stop();
  rmSync(scratch, { recursive: true, force: true });
};
process.on('SIGINT', () => void cleanup().then(() => process.exit(130)));
/** @type {number} */
let status;
try {
  step(`Starting a three-node Galera cluster on loopback (state transfer by ${cluster.method})…`);
  const started = Date.now();
  await cluster.start();
  const [node1, node2] = cluster.nodes;
  if (!node1 || !node2) throw new Error('The cluster has fewer than two nodes.');
  console.log(`  nodes on ports ${cluster.nodes.map((n) => n.port).join(', ')}, synced in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  node1.db.createDatabase({ database: DATABASE, ...DB_USERS });
  const shared = {
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    JWT_SECRET: 'cluster-secret-for-this-machine-only-0123456789abcdef',
    DEMO_KITCHEN: 'true',
    LOG_LEVEL: 'error',
  };
  run('node', ['api/dist/cli/db.js', 'setup'], { env: { ...dbEnv({ port: node1.port, database: DATABASE }), ...shared } });
  /** @type {string[]} */
  const urls = [];
  for (const node of [node1, node2]) {
    const port = await freePort();
    const server = startChild('node', ['api/dist/main.js'], {
      ...dbEnv({ port: node.port, database: DATABASE }),
      ...shared,
      PORT: String(port),
    });
    servers.push(server);
    const url = `http://127.0.0.1:${port}`;
    await waitForHttp(`${url}/api/health`, 60_000, server);
    console.log(`  API instance on ${url} over node ${node.index} (127.0.0.1:${node.port})`);
    urls.push(url);
  }
  step('Running tests/cluster…');
  const tests = spawnSync('node', ['node_modules/vitest/vitest.mjs', 'run', '--config', 'tests/vitest.cluster.config.ts'], {
    cwd: ROOT,
    stdio: 'inherit',
    env: {
      ...process.env,
      CLUSTER_API_A: urls[0],
      CLUSTER_API_B: urls[1],
      CLUSTER_NODE2_PID: String(node2.db.runningPid() ?? ''),
    },
  });
  status = tests.status ?? 1;
} finally {
  await cleanup();
}
process.exit(status);
