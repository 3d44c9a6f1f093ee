import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdtemp, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Transform, type Readable, type Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createConnection, type Connection } from 'mariadb';
import { BackupError } from '../backup/backup-error';
import { databaseOwner } from '../config/config';
import type { DatabaseSettings } from './connection';
import { FILE_KEY_COLUMNS } from '../storage/file-references.repository';

/** The database in words, for messages: `the database crumbproof at 127.0.0.1:3307` (`The …` to begin a sentence). */
export const databaseInWords = (db: DatabaseSettings, begins = false) =>
  `${begins ? 'The' : 'the'} database ${db.DB_NAME} at ${db.DB_HOST}:${db.DB_PORT}`;

const why = (err: unknown) => {
  const text = (err as { text?: unknown }).text;
  return typeof text === 'string' ? text : err instanceof Error ? err.message : String(err);
};

/** Runs `fn` on a connection as the owner (DB_OWNER_USER, or DB_USER without one), to the server (no default database). */
async function asOwner<T>(db: DatabaseSettings, fn: (conn: Connection) => Promise<T>): Promise<T> {
  const owner = databaseOwner(db);
  let conn: Connection;
  try {
    conn = await createConnection({ host: db.DB_HOST, port: db.DB_PORT, user: owner.user, password: owner.password, connectTimeout: 5000 });
  } catch (err) {
    throw new BackupError(
      `Could not reach ${databaseInWords(db)} as ${owner.user}: ${why(err)}. Check that it is running and that DB_HOST, DB_PORT and the owner's name and password (DB_OWNER_USER, DB_OWNER_PASSWORD) are right.`,
      { cause: err },
    );
  }
  try {
    return await fn(conn);
  } catch (err) {
    if (err instanceof BackupError) throw err;
    throw new BackupError(`${databaseInWords(db, true)} refused a statement of the owner ${owner.user}: ${why(err)}.`, { cause: err });
  } finally {
    await conn.end().catch(() => undefined);
  }
}

const id = (name: string) => `\`${name.replace(/`/g, '``')}\``;

export interface DatabaseState {
  exists: boolean;
  /** Every table and view in it, by name. */
  tables: string[];
  /** The migrations applied (schema_migrations), by name; null without that table. */
  migrations: string[] | null;
}

/** What the database holds: whether it exists, its tables and the migrations applied to it. */
export function databaseState(db: DatabaseSettings): Promise<DatabaseState> {
  return asOwner(db, async (conn) => {
    const schemas = await conn.query<{ n: string }[]>('SELECT schema_name AS n FROM information_schema.schemata WHERE schema_name = ?', [
      db.DB_NAME,
    ]);
    if (schemas.length === 0) return { exists: false, tables: [], migrations: null };
    const tables = (
      await conn.query<{ n: string }[]>(
        'SELECT table_name AS n FROM information_schema.tables WHERE table_schema = ? ORDER BY table_name',
        [db.DB_NAME],
      )
    ).map((t) => t.n);
    const migrations = tables.includes('schema_migrations')
      ? (await conn.query<{ name: string }[]>(`SELECT name FROM ${id(db.DB_NAME)}.schema_migrations ORDER BY name`)).map((m) => m.name)
      : null;
    return { exists: true, tables, migrations };
  });
}

/**
 * The key of every stored file a row names (FILE_KEY_COLUMNS), each once. Before migration 0014
 * the bytes were in the rows themselves and no such column exists: none is named then.
 */
export function referencedFileKeys(db: DatabaseSettings): Promise<string[]> {
  return asOwner(db, async (conn) => {
    const present = await conn.query<{ t: string; c: string }[]>(
      'SELECT table_name AS t, column_name AS c FROM information_schema.columns WHERE table_schema = ?',
      [db.DB_NAME],
    );
    const columns = FILE_KEY_COLUMNS.filter((k) => present.some((p) => p.t === k.table && p.c === k.column));
    if (columns.length === 0) return [];
    const union = columns
      .map((k) => `SELECT ${id(k.column)} AS k FROM ${id(db.DB_NAME)}.${id(k.table)} WHERE ${id(k.column)} IS NOT NULL`)
      .join(' UNION ');
    return (await conn.query<{ k: string }[]>(`SELECT k FROM (${union}) refs ORDER BY k`)).map((r) => r.k);
  });
}

/** Creates the database when it is not there (utf8mb4, as npm start creates its own). */
export function createDatabaseIfMissing(db: DatabaseSettings): Promise<void> {
  return asOwner(db, async (conn) => {
    await conn.query(`CREATE DATABASE IF NOT EXISTS ${id(db.DB_NAME)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  });
}

/** Drops every table and view of the database, bringing a database that was empty before a failed load back to empty. */
export function dropEveryTable(db: DatabaseSettings): Promise<void> {
  return asOwner(db, async (conn) => {
    const rows = await conn.query<{ n: string; t: string }[]>(
      'SELECT table_name AS n, table_type AS t FROM information_schema.tables WHERE table_schema = ?',
      [db.DB_NAME],
    );
    await conn.query('SET FOREIGN_KEY_CHECKS = 0');
    for (const r of rows) await conn.query(`DROP ${r.t === 'VIEW' ? 'VIEW' : 'TABLE'} IF EXISTS ${id(db.DB_NAME)}.${id(r.n)}`);
  });
}

/** A value of a MariaDB option file, quoted so that any password reads back as written. */
const optionValue = (value: string) => `"${value.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;

/**
 * Runs `fn` with an option file of the owner's address and password (mode 600, removed after),
 * so the password is on no command line; passed first as --defaults-file, it is the only option
 * file the client programs read.
 */
async function withOptionFile<T>(db: DatabaseSettings, fn: (file: string) => Promise<T>): Promise<T> {
  const owner = databaseOwner(db);
  const dir = await mkdtemp(join(tmpdir(), 'crumbproof-client-'));
  const file = join(dir, 'client.cnf');
  try {
    await writeFile(
      file,
      [
        '[client]',
        `host=${optionValue(db.DB_HOST)}`,
        `port=${db.DB_PORT}`,
        'protocol=TCP',
        `user=${optionValue(owner.user)}`,
        `password=${optionValue(owner.password)}`,
        '',
      ].join('\n'),
      { mode: 0o600 },
    );
    return await fn(file);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

/** Counts (and hashes) the bytes that pass. */
function counter(onBytes: (n: number) => void) {
  const hash = createHash('sha256');
  let size = 0;
  const stream = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      hash.update(chunk);
      size += chunk.length;
      onBytes(chunk.length);
      done(null, chunk);
    },
  });
  return { stream, result: () => ({ sha256: hash.digest('hex'), size }) };
}

/**
 * Runs one of MariaDB's client programs with its input and output streamed, and refuses in words
 * when it cannot be started or exits with an error (its own message, which names what failed).
 */
async function runClient(program: string, args: string[], io: { stdin?: Readable; stdout?: Writable }, what: string): Promise<void> {
  const child = spawn(program, args, { stdio: [io.stdin ? 'pipe' : 'ignore', io.stdout ? 'pipe' : 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr!.setEncoding('utf8').on('data', (chunk: string) => (stderr = (stderr + chunk).slice(-4000)));
  const exited = new Promise<number | null>((resolve, reject) => {
    child.once('error', reject);
    child.once('close', (code) => resolve(code));
  });
  const streams = [...(io.stdin ? [pipeline(io.stdin, child.stdin!)] : []), ...(io.stdout ? [pipeline(child.stdout!, io.stdout)] : [])];
  const [exit, ...piped] = await Promise.allSettled([exited, ...streams]);
  if (exit.status === 'rejected') {
    const err = exit.reason as NodeJS.ErrnoException;
    if (err.code === 'ENOENT')
      throw new BackupError(`${program} is not installed: it comes with Debian's mariadb-client (apt-get install mariadb-client).`);
    throw new BackupError(`Could not run ${program} to ${what}: ${err.message}`, { cause: err });
  }
  if (exit.value !== 0) {
    const said = stderr.trim().split('\n').slice(-5).join('\n');
    throw new BackupError(`${program} could not ${what} (exit ${exit.value})${said ? `: ${said}` : '.'}`);
  }
  const failed = piped.find((p) => p.status === 'rejected');
  if (failed) throw new BackupError(`Could not ${what}: ${why(failed.reason)}`, { cause: failed.reason });
}

/**
 * Dumps the database into `file` with mariadb-dump: one consistent snapshot of every InnoDB table
 * (--single-transaction: a backup taken while the kitchen works never locks it and never sees a
 * write halfway), with triggers and stored routines should the schema ever have them, binary
 * columns in hex. No CREATE DATABASE or USE: the dump loads into whichever database a restore names.
 */
export async function dumpDatabase(db: DatabaseSettings, file: string, onBytes: (n: number) => void = () => {}) {
  return withOptionFile(db, async (options) => {
    const count = counter(onBytes);
    const out = createWriteStream(file, { flags: 'wx', mode: 0o600 });
    const written = pipeline(count.stream, out);
    await runClient(
      'mariadb-dump',
      [
        `--defaults-file=${options}`,
        '--single-transaction',
        '--quick',
        '--routines',
        '--triggers',
        '--hex-blob',
        '--skip-add-locks',
        '--no-tablespaces',
        '--default-character-set=utf8mb4',
        '--max-allowed-packet=1G',
        db.DB_NAME,
      ],
      { stdout: count.stream },
      `dump ${databaseInWords(db)}`,
    );
    await written;
    return count.result();
  });
}

/** Loads a dump into the database with the mariadb client, as its owner. */
export async function loadDump(db: DatabaseSettings, file: string, onBytes: (n: number) => void = () => {}) {
  const { size } = await stat(file);
  await withOptionFile(db, async (options) => {
    const count = counter(onBytes);
    await runClient(
      'mariadb',
      [`--defaults-file=${options}`, '--batch', '--default-character-set=utf8mb4', '--max-allowed-packet=1G', db.DB_NAME],
      { stdin: createReadStream(file).pipe(count.stream) },
      `load the dump into ${databaseInWords(db)}`,
    );
  });
  return size;
}
