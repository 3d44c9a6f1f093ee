// npm start: installs what is missing, starts the private MariaDB under .data/, migrates,
// seeds the demo kitchens into an empty database, builds the web app and serves it from the API.
import { join } from 'node:path';
import { startDevInbox } from './lib/dev-inbox.mjs';
import { chooseDatabasePort, ensureMariadbInstalled, freePort, instance, isPortFree } from './lib/mariadb.mjs';
import { buildAll, DB_USERS, dbEnv, ensureNodeModules, localSecret, ROOT, run, startChild, step, waitForHttp } from './lib/workspace.mjs';

// Loopback by default. HOST=0.0.0.0 npm start listens on every network: no demo kitchen then,
// and the session cookie is Secure, so serve it over HTTPS (a reverse proxy in front).
const HOST = process.env.HOST ?? '127.0.0.1';
const LOOPBACK = HOST === 'localhost' || HOST === '::1' || /^127(\.\d{1,3}){3}$/.test(HOST);
// The demo kitchen, whose accounts share a published password, on loopback only unless DEMO_KITCHEN=false.
const DEMO = (process.env.DEMO_KITCHEN ?? (LOOPBACK ? 'true' : 'false')) === 'true';
const dataDir = join(ROOT, '.data');

/**
 * PORT when it is set (refused, naming it, when in use); otherwise 3000, or a free port when
 * something else holds 3000 (another copy of Crumbproof), said in the output.
 */
async function appPort() {
  if (process.env.PORT) {
    const port = Number(process.env.PORT);
    if (!(await isPortFree(port))) throw new Error(`Port ${port} on ${HOST} is in use. Stop what uses it, or choose another PORT.`);
    return port;
  }
  if (await isPortFree(3000)) return 3000;
  const port = await freePort();
  step(`Port 3000 is in use (another copy of Crumbproof?): this one serves on port ${port}. Set PORT to choose.`);
  return port;
}

async function main() {
  ensureNodeModules();
  ensureMariadbInstalled((m) => step(m));

  const DB_PORT = await chooseDatabasePort(join(dataDir, 'mariadb'), (m) => step(m));
  const db = instance({ dir: join(dataDir, 'mariadb'), port: DB_PORT });
  db.claim('npm start');
  /** @type {import('node:child_process').ChildProcess | null} */
  let api = null;
  /** @type {import('./lib/dev-inbox.mjs').DevInbox | null} */
  let inbox = null;
  let stopping = false;
  const stop = async (code = 0) => {
    if (stopping) return;
    stopping = true;
    console.log('\nStopping Crumbproof…');
    const child = api;
    if (child && child.exitCode === null) {
      child.kill('SIGTERM');
      await /** @type {Promise<void>} */ (
        new Promise((r) => {
          const t = setTimeout(() => (child.kill('SIGKILL'), r()), 10_000);
          child.once('exit', () => (clearTimeout(t), r()));
        })
      );
    }
    await inbox?.stop();
    await db.stop();
    db.release();
    console.log('Stopped. Your data is kept in .data/ for the next npm start.');
    process.exit(code);
  };
  process.on('SIGINT', () => void stop(0));
  process.on('SIGTERM', () => void stop(0));

  try {
    const PORT = await appPort();
    if (db.runningPid()) {
      step('A database from an earlier run is still up: stopping it first…');
      await db.stop();
    }
    step(`Starting the private MariaDB on 127.0.0.1:${DB_PORT} (data in .data/mariadb)…`);
    await db.start();
    db.createDatabase({ database: 'crumbproof', ...DB_USERS });

    buildAll();

    // Mail goes to the kitchen's own server when SMTP_HOST is set, otherwise to the development inbox here.
    if (!process.env.SMTP_HOST) {
      step('Starting the development inbox (maildev) on 127.0.0.1…');
      inbox = await startDevInbox({ dir: join(dataDir, 'mail'), from: process.env.MAIL_FROM });
    }

    const env = {
      ...dbEnv({ port: DB_PORT, database: 'crumbproof' }),
      NODE_ENV: 'production',
      HOST,
      PORT: String(PORT),
      DEMO_KITCHEN: DEMO ? 'true' : 'false',
      JWT_SECRET: process.env.JWT_SECRET ?? localSecret(dataDir),
      WEB_DIST: join(ROOT, 'web', 'dist'),
      LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
      ...(inbox ? inbox.env : {}),
    };
    step('Migrating and seeding…');
    run('node', ['api/dist/cli/db.js', 'setup'], { env });

    step('Starting the API and web app…');
    api = startChild('node', ['api/dist/main.js'], env);
    api.on('exit', (code) => {
      if (!stopping) {
        console.error(`The API stopped (exit ${code}).`);
        void stop(1);
      }
    });
    await waitForHttp(`http://${HOST}:${PORT}/api/health`, 60_000, api);
    const intro = DEMO
      ? `
  Demo mode: two demo kitchens over one recipe book (Wrenfield Lane Bakehouse and Saltmarsh
  Yard Café), on this machine only. Its accounts share a published password; for your kitchen's
  own installation run DEMO_KITCHEN=false npm start (or listen beyond loopback): no demo
  accounts, and a one-time link sets the first manager's password.

  Demo sign-ins (password for each: crumbproof-demo)
    manager@example.com   Manager at both kitchens
    chef@example.com      Pastry chef at both kitchens
    counter@example.com   Front of house at Wrenfield Lane Bakehouse
    cafe@example.com      Front of house at Saltmarsh Yard Café
    quay@example.com      Manager at the café, front of house at the bakehouse`
      : `
  Your kitchen's own installation: no demo accounts. While no manager can sign in, each start
  prints a one-time link above that sets the first manager's password.${
    LOOPBACK ? '' : '\n  Sessions need HTTPS here (the cookie is Secure): serve Crumbproof through a reverse proxy with TLS.'
  }`;
    console.log(`
  Crumbproof is running at http://${HOST}:${PORT}
${intro}

  API documentation: http://${HOST}:${PORT}/api/docs
${
  inbox
    ? `  Mail (invitations, password links) goes to the development inbox on this machine, read at
  ${inbox.url} (kept in .data/mail); set SMTP_HOST and MAIL_FROM to send it through your mail server.`
    : `  Mail goes through ${process.env.SMTP_HOST}; the manager's Mail page shows what was sent.`
}
  Press Ctrl-C to stop.`);
  } catch (err) {
    console.error(`\n${err instanceof Error ? err.message : String(err)}`);
    await stop(1);
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
