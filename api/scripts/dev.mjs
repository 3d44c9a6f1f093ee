// npm run dev: the private database, the API rebuilt and restarted on every change, and Vite's
// dev server with hot reload for the web app (http://127.0.0.1:5173, /api proxied to :3000).
import { join } from 'node:path';
import { startDevInbox } from './lib/dev-inbox.mjs';
import { chooseDatabasePort, ensureMariadbInstalled, instance } from './lib/mariadb.mjs';
import { DB_USERS, dbEnv, ensureNodeModules, localSecret, ROOT, run, startChild, step } from './lib/workspace.mjs';

const dataDir = join(ROOT, '.data');

ensureNodeModules();
ensureMariadbInstalled((m) => step(m));
const DB_PORT = await chooseDatabasePort(join(dataDir, 'mariadb'), (m) => step(m));
const db = instance({ dir: join(dataDir, 'mariadb'), port: DB_PORT });
db.claim('npm run dev');
/** @type {import('node:child_process').ChildProcess[]} */
const children = [];
/** @type {import('./lib/dev-inbox.mjs').DevInbox | null} */
let inbox = null;
const stop = async () => {
  for (const c of children) if (c.exitCode === null) c.kill('SIGTERM');
  await inbox?.stop();
  await db.stop();
  db.release();
  process.exit(0);
};
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());

try {
  if (db.runningPid()) await db.stop();
  await db.start();
  db.createDatabase({ database: 'crumbproof', ...DB_USERS });
  if (!process.env.SMTP_HOST) inbox = await startDevInbox({ dir: join(dataDir, 'mail'), from: process.env.MAIL_FROM });
  const env = {
    ...dbEnv({ port: DB_PORT, database: 'crumbproof' }),
    NODE_ENV: 'development',
    JWT_SECRET: process.env.JWT_SECRET ?? localSecret(dataDir),
    // Links in mail open the web app with hot reload, which passes /api on to the API.
    PUBLIC_URL: process.env.PUBLIC_URL ?? 'http://127.0.0.1:5173',
    ...(inbox ? inbox.env : {}),
  };
  step('Building shared and api once, then watching…');
  run('npm', ['run', 'build', '-w', 'shared']);
  run('npm', ['run', 'build', '-w', 'api']);
  run('node', ['api/dist/cli/db.js', 'setup'], { env });
  /** @param {string} name */
  const bin = (name) => join(ROOT, 'node_modules', '.bin', name);
  children.push(startChild(bin('tsc'), ['-p', 'shared/tsconfig.build.json', '--watch', '--preserveWatchOutput'], {}));
  children.push(startChild(bin('tsc'), ['-p', 'api/tsconfig.build.json', '--watch', '--preserveWatchOutput'], {}));
  children.push(startChild('node', ['--watch-path=api/dist', '--watch-path=shared/dist', 'api/dist/main.js'], env));
  children.push(startChild(bin('vite'), ['--host', '127.0.0.1'], {}, { cwd: join(ROOT, 'web') }));
  console.log('\n  Web app with hot reload: http://127.0.0.1:5173   API: http://127.0.0.1:3000/api/docs');
  console.log(inbox ? `  Development inbox (the mail the app sends): ${inbox.url}\n` : `  Mail goes through ${process.env.SMTP_HOST}.\n`);
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  await stop();
}
