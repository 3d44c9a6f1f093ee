// The database `npm run backup` and `npm run restore` work on: the one DB_HOST, DB_PORT, DB_NAME or
// DB_USER names (api/src/config/config.ts), or else npm start's private MariaDB under .data/, used
// as it runs, or started for the command and stopped after it. Node built-ins only.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { aptInstall, chooseDatabasePort, ensureMariadbInstalled, instance } from './mariadb.mjs';
import { runCliStatus } from './tsx-cli.mjs';
import { DB_USERS, dbEnv, ensureNodeModules, ROOT } from './workspace.mjs';

/** The settings that name a database of the kitchen's own choosing. */
const NAMED = ['DB_HOST', 'DB_PORT', 'DB_NAME', 'DB_USER', 'DB_OWNER_USER'];

/** @param {string} message */
const say = (message) => console.error(`▸ ${message}`);

/** mariadb-dump and the mariadb client, from Debian's mariadb-client when they are missing. */
function ensureClient() {
  const missing = ['mariadb-dump', 'mariadb'].filter((p) => spawnSync(p, ['--version'], { stdio: 'ignore' }).error);
  if (missing.length === 0) return;
  say(`${missing.join(' and ')} not found: installing Debian’s mariadb-client…`);
  aptInstall(['mariadb-client']);
}

/**
 * Runs the command (`run`, given the settings to add to its environment) on the kitchen's
 * database and answers its exit code. The private database is started when it is not running
 * (claimed, so an `npm start` meanwhile is told) and stopped again after; a restore on a machine
 * where npm start never ran creates it, empty, for the restore to fill.
 * @param {'backup' | 'restore'} command
 * @param {(env: Record<string, string>) => number} run
 * @returns {Promise<number>}
 */
export async function onKitchenDatabase(command, run) {
  ensureClient();
  if (NAMED.some((name) => process.env[name])) return run({});
  // Arguments the command will refuse (or a restore's archive that is not there) need no database.
  const argv = process.argv.slice(2);
  const cwd = process.env.INIT_CWD ?? process.cwd();
  const argsHold =
    command === 'restore'
      ? argv.length === 1 && !argv[0].startsWith('--') && existsSync(resolve(cwd, argv[0]))
      : argv.length === 0 || (argv.length === 2 && argv[0] === '--out');
  if (!argsHold) return run({});
  const dir = join(ROOT, '.data', 'mariadb');
  const hasData = existsSync(join(dir, 'data', 'mysql'));
  if (!hasData && command === 'backup') {
    throw new Error(
      'There is no database to back up here: npm start has not run in this folder (no .data/mariadb). Set DB_HOST, DB_PORT, DB_NAME and the owner (DB_OWNER_USER, DB_OWNER_PASSWORD) to back up another one.',
    );
  }
  const port = await chooseDatabasePort(dir, say);
  const db = instance({ dir, port });
  const env = dbEnv({ port, database: 'crumbproof' });
  if (db.runningPid()) return run(env);

  if (!hasData) ensureMariadbInstalled(say);
  db.claim(`npm run ${command}`);
  // Ctrl-C reaches the command itself; this process then stops the database it started.
  const ignore = () => {};
  process.on('SIGINT', ignore);
  try {
    say(
      hasData
        ? `Crumbproof’s database is not running: starting it for the ${command} on 127.0.0.1:${port} (data in .data/mariadb)…`
        : `Creating Crumbproof’s database on 127.0.0.1:${port} (data in .data/mariadb), empty, for the restore…`,
    );
    await db.start();
    db.createDatabase({ database: 'crumbproof', ...DB_USERS });
    return run(env);
  } finally {
    say('Stopping the database again…');
    await db.stop();
    db.release();
    process.off('SIGINT', ignore);
  }
}

/**
 * npm run backup / npm run restore: api/src/cli/COMMAND.ts on the kitchen's database, exiting
 * with its exit code.
 * @param {'backup' | 'restore'} command
 */
export function runOnKitchenDatabase(command) {
  ensureNodeModules();
  onKitchenDatabase(command, (env) => runCliStatus(command, env)).then(
    (code) => process.exit(code),
    (err) => {
      console.error(err instanceof Error ? err.message : String(err));
      process.exit(1);
    },
  );
}
