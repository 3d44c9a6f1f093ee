// The built app (api/dist) over a throwaway MariaDB with the demo kitchen, each on a free loopback
// port, for the scripts that measure or load it; stop() (also run on Ctrl-C) ends both and removes
// the database's files.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { freePort, instance } from './mariadb.mjs';
import { DB_USERS, ROOT, dbEnv, run, startChild, step, waitForHttp } from './workspace.mjs';

/**
 * @typedef {object} ThrowawayApp
 * @property {string} url the app's address, http://127.0.0.1:PORT
 * @property {Record<string, string>} env the app's settings (its database's too)
 * @property {ReturnType<typeof instance>} db the MariaDB
 * @property {import('node:child_process').ChildProcess} server the app's process
 * @property {() => Promise<void>} stop
 */

/**
 * @param {{ name: string }} opts names the scratch folder, the database (crumbproof_NAME) and the signing secret
 * @returns {Promise<ThrowawayApp>}
 */
export async function startThrowawayApp({ name }) {
  const scratch = mkdtempSync(join(tmpdir(), `crumbproof-${name}-`));
  const db = instance({ dir: join(scratch, 'mariadb'), port: await freePort() });
  /** @type {import('node:child_process').ChildProcess | null} */
  let server = null;
  const stop = async () => {
    if (server && server.exitCode === null) server.kill('SIGTERM');
    await db.stop();
    rmSync(scratch, { recursive: true, force: true });
  };
  process.on('SIGINT', () => void stop().then(() => process.exit(130)));
  try {
    step(`Starting a throwaway MariaDB on 127.0.0.1:${db.port} and the built app over the demo kitchen…`);
    await db.start();
    const database = `crumbproof_${name}`;
    db.createDatabase({ database, ...DB_USERS });
    const appPort = await freePort();
    const env = {
      ...dbEnv({ port: db.port, database }),
      NODE_ENV: 'production',
      HOST: '127.0.0.1',
      PORT: String(appPort),
      JWT_SECRET: `${name}-secret-for-this-machine-only-0123456789abcdef`,
      DEMO_KITCHEN: 'true',
      LOG_LEVEL: 'error',
      // The web app too, for what is measured in a browser (the counter's timing).
      WEB_DIST: join(ROOT, 'web', 'dist'),
    };
    run('node', ['api/dist/cli/db.js', 'setup'], { env });
    const started = startChild('node', ['api/dist/main.js'], env);
    server = started;
    const url = `http://127.0.0.1:${appPort}`;
    await waitForHttp(`${url}/api/health`, 60_000, started);
    return { url, env, db, server: started, stop };
  } catch (e) {
    await stop();
    throw e;
  }
}
