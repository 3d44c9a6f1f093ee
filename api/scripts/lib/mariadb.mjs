// A private MariaDB instance on loopback: its own datadir, socket, port and option file,
// never the system service. Node built-ins only: it runs before npm ci has installed anything.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { createHash } from 'node:crypto';

const SOCKET_MAX = 100; // sun_path is at most 107 bytes

export function findServerBinary() {
  for (const dir of ['/usr/sbin', '/usr/bin', '/usr/local/sbin', '/usr/local/bin']) {
    for (const name of ['mariadbd', 'mysqld']) {
      const p = join(dir, name);
      if (existsSync(p)) return p;
    }
  }
  return null;
}

/**
 * Installs Debian's mariadb-server when no server binary is found.
 * @param {(message: string) => void} [log]
 */
export function ensureMariadbInstalled(log = console.log) {
  if (findServerBinary() && existsSync('/usr/bin/mariadb-install-db')) return;
  log('MariaDB server not found: installing Debian’s mariadb-server (about a minute)…');
  aptInstall(['mariadb-server', 'mariadb-client']);
  if (!findServerBinary()) throw new Error('mariadb-server was installed but no server binary was found.');
}

/** @param {string[]} packages */
export function aptInstall(packages) {
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const upd = spawnSync('apt-get', ['update'], { stdio: 'inherit', env });
  if (upd.status !== 0) throw new Error('apt-get update failed.');
  const r = spawnSync('apt-get', ['install', '-y', '--no-install-recommends', ...packages], { stdio: 'inherit', env });
  if (r.status !== 0) throw new Error(`apt-get install ${packages.join(' ')} failed.`);
}

/**
 * Finds a free TCP port on 127.0.0.1.
 * @returns {Promise<number>}
 */
export function freePort() {
  return new Promise((res, rej) => {
    const srv = createServer();
    srv.unref();
    srv.on('error', rej);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = /** @type {import('node:net').AddressInfo} */ (srv.address());
      srv.close(() => res(port));
    });
  });
}

/**
 * @param {number} port
 * @returns {Promise<boolean>}
 */
export function isPortFree(port) {
  return new Promise((res) => {
    const srv = createServer();
    srv.once('error', () => res(false));
    srv.listen(port, '127.0.0.1', () => srv.close(() => res(true)));
  });
}

/** @param {string} dir */
function socketPath(dir) {
  const p = join(dir, 'mysqld.sock');
  if (Buffer.byteLength(p) <= SOCKET_MAX) return p;
  const short = createHash('sha1').update(dir).digest('hex').slice(0, 12);
  return join(tmpdir(), `crumbproof-${short}.sock`);
}

/**
 * Describes an instance rooted at `dir` (the datadir is dir/data).
 * @param {{dir: string, port: number}} opts
 */
export function instance({ dir, port }) {
  dir = resolve(dir);
  const cnf = join(dir, 'my.cnf');
  const socket = socketPath(dir);
  const pidFile = join(dir, 'mysqld.pid');
  const errLog = join(dir, 'mysqld.err');
  const datadir = join(dir, 'data');
  const lockFile = join(dir, 'owner.lock');

  function writeConfig() {
    mkdirSync(dir, { recursive: true });
    writeFileSync(
      cnf,
      [
        '[mysqld]',
        `datadir=${datadir}`,
        `port=${port}`,
        'bind-address=127.0.0.1',
        `socket=${socket}`,
        `pid-file=${pidFile}`,
        `log-error=${errLog}`,
        'user=root',
        'skip-name-resolve',
        'skip-log-bin',
        'character-set-server=utf8mb4',
        'collation-server=utf8mb4_unicode_ci',
        'innodb_buffer_pool_size=128M',
        'innodb_flush_log_at_trx_commit=2',
        '',
        '[client]',
        `socket=${socket}`,
        `port=${port}`,
        'user=root',
        '',
      ].join('\n'),
    );
  }

  /**
   * @param {string} bin
   * @param {string[]} args
   * @param {string} [input]
   */
  function run(bin, args, input) {
    return spawnSync(bin, [`--defaults-file=${cnf}`, ...args], { encoding: 'utf8', input });
  }

  /**
   * Runs one SQL text as root over the socket, its rows tab-separated without a header.
   * @param {string} text
   */
  function sql(text) {
    return run('mariadb', ['--batch', '--skip-column-names', '--connect-timeout=2'], text);
  }

  function ping() {
    return run('mariadb-admin', ['--connect-timeout=1', 'ping']).status === 0;
  }

  function runningPid() {
    if (!existsSync(pidFile)) return null;
    const pid = Number(readFileSync(pidFile, 'utf8').trim());
    if (!pid) return null;
    try {
      process.kill(pid, 0);
      return pid;
    } catch {
      return null;
    }
  }

  /** @param {string} file */
  function tail(file, n = 15) {
    if (!existsSync(file)) return '(no log)';
    return readFileSync(file, 'utf8').trim().split('\n').slice(-n).join('\n');
  }

  async function start() {
    writeConfig();
    if (runningPid()) {
      throw new Error(`A MariaDB instance already runs on ${datadir} (pid ${runningPid()}). Stop it first.`);
    }
    if (!(await isPortFree(port))) {
      throw new Error(`Port ${port} on 127.0.0.1 is already in use. Set DB_PORT to another port.`);
    }
    if (!existsSync(join(datadir, 'mysql'))) {
      mkdirSync(datadir, { recursive: true });
      const r = run('mariadb-install-db', ['--auth-root-authentication-method=normal', '--skip-test-db', '--skip-name-resolve']);
      if (r.status !== 0) throw new Error(`mariadb-install-db failed:\n${r.stderr || r.stdout}`);
    }
    const server = findServerBinary();
    if (!server) throw new Error('No MariaDB server binary (mariadbd or mysqld) was found.');
    const child = spawn(server, [`--defaults-file=${cnf}`], {
      detached: true,
      stdio: 'ignore',
    });
    /** @type {{ code: number | null }} */
    const exited = { code: null };
    child.on('exit', (code) => (exited.code = code ?? -1));
    child.unref();
    const deadline = Date.now() + 30_000;
    while (Date.now() < deadline) {
      if (exited.code !== null) throw new Error(`MariaDB stopped at start (exit ${exited.code}). Its log says:\n${tail(errLog)}`);
      if (ping()) return { pid: child.pid };
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`MariaDB did not answer within 30 s. Its log says:\n${tail(errLog)}`);
  }

  /**
   * Creates the database and its two TCP users for 127.0.0.1, idempotently: the owner (`user`),
   * who migrates and holds every privilege on the database (and on `database_*`, the tests'
   * databases) with the grant option, and the API's runtime user (`runtimeUser`), who gets no
   * database-wide privilege here: after every migration run the owner grants it table by table
   * (api/src/database/runtime-grants.ts), only SELECT and INSERT on audit_events. An existing
   * install gains the runtime user and the owner's grant option on its next start.
   * @param {{ database: string; user: string; password: string; runtimeUser?: string; runtimePassword?: string }} grant
   */
  function createDatabase({ database, user, password, runtimeUser, runtimePassword }) {
    /** @param {string} s */
    const q = (s) => s.replace(/[`'\\]/g, '');
    const sql = [
      `CREATE DATABASE IF NOT EXISTS \`${q(database)}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
      `CREATE USER IF NOT EXISTS '${q(user)}'@'127.0.0.1' IDENTIFIED BY '${q(password)}';`,
      `GRANT ALL PRIVILEGES ON \`${q(database)}\`.* TO '${q(user)}'@'127.0.0.1' WITH GRANT OPTION;`,
      `GRANT ALL PRIVILEGES ON \`${q(database)}\\_%\`.* TO '${q(user)}'@'127.0.0.1' WITH GRANT OPTION;`,
      ...(runtimeUser && runtimeUser !== user
        ? [`CREATE USER IF NOT EXISTS '${q(runtimeUser)}'@'127.0.0.1' IDENTIFIED BY '${q(runtimePassword ?? '')}';`]
        : []),
      'FLUSH PRIVILEGES;',
    ].join('\n');
    const r = run('mariadb', [], sql);
    if (r.status !== 0) throw new Error(`Could not create the database: ${r.stderr}`);
  }

  /** @param {string} database */
  function dropDatabase(database) {
    run('mariadb', [], `DROP DATABASE IF EXISTS \`${database.replace(/`/g, '')}\`;`);
  }

  async function stop() {
    const pid = runningPid();
    if (!pid) return;
    run('mariadb-admin', ['shutdown']);
    const deadline = Date.now() + 30_000;
    while (Date.now() < deadline) {
      try {
        process.kill(pid, 0);
      } catch {
        return;
      }
      await new Promise((r) => setTimeout(r, 100));
    }
    try {
      process.kill(pid, 'SIGKILL');
    } catch {
      /* gone */
    }
  }

  /**
   * Claims the instance for this process: a second starter is told clearly.
   * @param {string} what
   */
  function claim(what) {
    mkdirSync(dir, { recursive: true });
    if (existsSync(lockFile)) {
      const [pidText] = readFileSync(lockFile, 'utf8').split('\n');
      const other = Number(pidText);
      let alive = false;
      try {
        if (other) {
          process.kill(other, 0);
          alive = true;
        }
      } catch {
        alive = false;
      }
      if (alive && other !== process.pid) {
        throw new Error(
          `Crumbproof is already running from this folder (process ${other}). ` +
            'Use that one, or stop it with Ctrl-C before starting again.',
        );
      }
    }
    writeFileSync(lockFile, `${process.pid}\n${what}\n`);
  }

  function release() {
    try {
      const [pidText] = readFileSync(lockFile, 'utf8').split('\n');
      if (Number(pidText) === process.pid) rmSync(lockFile);
    } catch {
      /* already gone */
    }
  }

  return { dir, cnf, port, socket, datadir, writeConfig, start, stop, ping, sql, createDatabase, dropDatabase, runningPid, claim, release };
}

/**
 * The private database's port for a data folder: DB_PORT when it is set; otherwise the one
 * remembered in the folder (3307 at first), unless something else holds it (another copy of
 * Crumbproof on this machine, another database): then a free one, remembered in `port` there so
 * the next start finds its data at the same address.
 * @param {string} dir The instance's folder (.data/mariadb).
 * @param {(message: string) => void} [log]
 * @returns {Promise<number>}
 */
export async function chooseDatabasePort(dir, log = console.log) {
  if (process.env.DB_PORT) return Number(process.env.DB_PORT);
  const file = join(resolve(dir), 'port');
  const remembered = existsSync(file) ? Number(readFileSync(file, 'utf8').trim()) : NaN;
  const port = Number.isInteger(remembered) && remembered > 0 ? remembered : 3307;
  // Our own database from an earlier run holds it: it is stopped and started again.
  if (instance({ dir, port }).runningPid() || (await isPortFree(port))) return port;
  const free = await freePort();
  mkdirSync(resolve(dir), { recursive: true });
  writeFileSync(file, `${free}\n`);
  log(
    `Port ${port} on 127.0.0.1 is taken (another copy of Crumbproof, or another database): this copy's database uses port ${free}, remembered in ${file}.`,
  );
  return free;
}
