// A MariaDB Galera cluster on loopback for the cluster test: each node a private instance of
// mariadb.mjs (its own datadir, socket, port and option file) with Galera's wsrep settings added:
// Debian's galera-4 provider, the cluster's group address, a port of its own for replication
// (gcomm) and for state transfers (SST by rsync or mariabackup, IST), the first node started
// with --wsrep-new-cluster and the others joining it. Node built-ins only.
import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { findServerBinary, freePort, instance } from './mariadb.mjs';

/** Debian's mariadb-server makes this user. */
const NODE_USER = 'mysql';

export const GALERA_PROVIDER = '/usr/lib/galera/libgalera_smm.so';

/** mariabackup's SST when Debian's mariadb-backup is installed, rsync's otherwise. */
function sstMethod() {
  return existsSync('/usr/bin/mariabackup') || existsSync('/usr/bin/mariadb-backup') ? 'mariabackup' : 'rsync';
}

/**
 * @param {{ dir: string; nodes?: number; name?: string }} opts
 */
export async function galeraCluster({ dir, nodes = 3, name = 'crumbproof' }) {
  if (!existsSync(GALERA_PROVIDER)) throw new Error(`Galera's provider ${GALERA_PROVIDER} is missing: install Debian's galera-4.`);
  const method = sstMethod();
  /** @type {{ index: number; db: ReturnType<typeof instance>; gcomm: number; ist: number; sst: number }[]} */
  const members = [];
  for (let i = 0; i < nodes; i++) {
    const db = instance({ dir: join(dir, `node${i + 1}`), port: await freePort() });
    members.push({ index: i + 1, db, gcomm: await freePort(), ist: await freePort(), sst: await freePort() });
  }
  const address = `gcomm://${members.map((m) => `127.0.0.1:${m.gcomm}`).join(',')}`;

  /** @param {(typeof members)[number]} m */
  function wsrepOptions(m) {
    return [
      '',
      '[galera]',
      'wsrep_on=ON',
      `wsrep_provider=${GALERA_PROVIDER}`,
      `wsrep_cluster_name=${name}`,
      `wsrep_cluster_address=${address}`,
      `wsrep_node_name=node${m.index}`,
      `wsrep_node_address=127.0.0.1:${m.gcomm}`,
      `wsrep_provider_options="gmcast.listen_addr=tcp://127.0.0.1:${m.gcomm};ist.recv_addr=127.0.0.1:${m.ist};gcache.size=64M"`,
      `wsrep_sst_receive_address=127.0.0.1:${m.sst}`,
      `wsrep_sst_method=${method}`,
      // A read waits until this node has applied every write the cluster committed before it, so
      // what one instance wrote is what the next read on another node sees (causal reads).
      'wsrep_sync_wait=1',
      'binlog_format=ROW',
      'default_storage_engine=InnoDB',
      'innodb_autoinc_lock_mode=2',
      'wsrep_slave_threads=2',
      '',
    ].join('\n');
  }

  /**
   * Starts one node: the first bootstraps the cluster, the others join it and take a state
   * transfer, so only the first is initialised with mariadb-install-db.
   * @param {(typeof members)[number]} m
   * @param {boolean} bootstrap
   */
  async function startNode(m, bootstrap) {
    if (bootstrap && !existsSync(join(m.db.datadir, 'mysql'))) {
      await m.db.start();
      await m.db.stop();
    }
    m.db.writeConfig();
    mkdirSync(m.db.datadir, { recursive: true });
    // The nodes run as Debian's mysql user, not root: the rsync daemon that receives a state
    // transfer runs as its parent's user, and started by root it would write as nobody.
    writeFileSync(m.db.cnf, readFileSync(m.db.cnf, 'utf8').replace(/^user=root$/m, `user=${NODE_USER}`) + wsrepOptions(m));
    chmodSync(dir, 0o755);
    const own = spawnSync('chown', ['-R', `${NODE_USER}:${NODE_USER}`, m.db.dir]);
    if (own.status !== 0) throw new Error(`Could not give ${m.db.dir} to the ${NODE_USER} user: ${String(own.stderr)}`);
    const server = findServerBinary();
    if (!server) throw new Error('No MariaDB server binary (mariadbd or mysqld) was found.');
    const child = spawn(server, [`--defaults-file=${m.db.cnf}`, ...(bootstrap ? ['--wsrep-new-cluster'] : [])], {
      detached: true,
      stdio: 'ignore',
    });
    /** @type {{ code: number | null }} */
    const exited = { code: null };
    child.on('exit', (code) => (exited.code = code ?? -1));
    child.unref();
    const deadline = Date.now() + 120_000;
    while (Date.now() < deadline) {
      if (exited.code !== null)
        throw new Error(`Galera node ${m.index} stopped at start (exit ${exited.code}); see ${m.db.dir}/mysqld.err.`);
      if (m.db.ping() && status(m, 'wsrep_local_state_comment') === 'Synced') return;
      await new Promise((r) => setTimeout(r, 250));
    }
    throw new Error(`Galera node ${m.index} was not synced within 120 s; see ${m.db.dir}/mysqld.err.`);
  }

  /**
   * A wsrep status variable of one node, or null when it does not answer.
   * @param {(typeof members)[number]} m
   * @param {string} variable
   */
  function status(m, variable) {
    const r = m.db.sql(`SHOW GLOBAL STATUS LIKE '${variable}'`);
    if (r.status !== 0) return null;
    return r.stdout.trim().split('\t')[1] ?? null;
  }

  async function start() {
    const [first, ...rest] = members;
    if (!first) throw new Error('A cluster needs at least one node.');
    await startNode(first, true);
    for (const m of rest) await startNode(m, false);
    const size = status(first, 'wsrep_cluster_size');
    if (Number(size) !== members.length) throw new Error(`The cluster has ${size} nodes, not ${members.length}.`);
  }

  /** Stops every node that still runs, the last started first. */
  async function stop() {
    for (const m of [...members].reverse()) await m.db.stop();
  }

  /**
   * Kills one node's server at once (SIGKILL), as a crash would.
   * @param {number} index 1-based
   */
  function kill(index) {
    const m = members[index - 1];
    const pid = m?.db.runningPid();
    if (!pid) throw new Error(`Galera node ${index} is not running.`);
    process.kill(pid, 'SIGKILL');
    return pid;
  }

  return {
    address,
    method,
    nodes: members.map((m) => ({ index: m.index, port: m.db.port, db: m.db })),
    start,
    stop,
    kill,
    /** @param {number} index @param {string} variable */
    status: (index, variable) => {
      const m = members[index - 1];
      return m ? status(m, variable) : null;
    },
  };
}
