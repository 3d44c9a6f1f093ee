import { QueryTypes, type Sequelize } from 'sequelize';
import { contentKey, type FileStore } from '../../storage/file-store';
import type { MigrationContext } from '../migrator';

/**
 * Uploaded files leave the database for the FileStore (STORAGE: a folder or an S3-compatible
 * bucket): the supplier specifications' `content` and the label runs' `pdf`. Each row keeps its
 * checksum (`sha256`) and gains the object's key (`storage_key`, the same content address). The
 * bytes are checked against every row's checksum before anything changes, put in the store and
 * read back, and only then are the columns of bytes dropped; a row whose bytes do not match its
 * checksum stops the migration with nothing changed. Run again after a stop halfway (the store
 * unreachable), it carries on from the rows not yet moved.
 */
const TABLES = [
  { table: 'specifications', bytes: 'content', what: 'specification' },
  { table: 'label_runs', bytes: 'pdf', what: 'label run' },
] as const;

const KEY_TYPE = 'CHAR(64) CHARACTER SET ascii COLLATE ascii_bin';

async function columns(sequelize: Sequelize, table: string): Promise<Set<string>> {
  return new Set(Object.keys(await sequelize.getQueryInterface().describeTable(table)));
}

/** Each row still holding its bytes, one at a time by id (a file can be large). */
async function* rowsWithBytes(sequelize: Sequelize, table: string, bytes: string, hasKey: boolean) {
  let last = 0;
  for (;;) {
    const [row] = await sequelize.query<{ id: number; sha256: string; bytes: Buffer }>(
      `SELECT id, sha256, \`${bytes}\` AS bytes FROM \`${table}\` WHERE id > ?${hasKey ? ' AND storage_key IS NULL' : ''} ORDER BY id LIMIT 1`,
      { replacements: [last], type: QueryTypes.SELECT },
    );
    if (!row) return;
    last = row.id;
    yield row;
  }
}

export async function up({ sequelize, files }: MigrationContext) {
  const pending: { table: string; bytes: string; what: string; hasKey: boolean; count: number }[] = [];
  for (const t of TABLES) {
    const cols = await columns(sequelize, t.table);
    if (!cols.has(t.bytes)) continue;
    const hasKey = cols.has('storage_key');
    let count = 0;
    for await (const row of rowsWithBytes(sequelize, t.table, t.bytes, hasKey)) {
      const actual = contentKey(Buffer.from(row.bytes));
      if (actual !== row.sha256) {
        throw new Error(
          `The ${t.what} ${row.id}'s stored bytes have the SHA-256 ${actual}, not the ${row.sha256} recorded with them: ` +
            'the file was damaged in the database. Nothing was changed; put that row right (or restore a backup) and start again.',
        );
      }
      count++;
    }
    pending.push({ ...t, hasKey, count });
  }
  const total = pending.reduce((n, p) => n + p.count, 0);
  if (total > 0 && !files) throw new Error(`${total} uploaded file(s) are to move out of the database, and no file store was given.`);
  for (const t of pending) {
    if (!t.hasKey) await sequelize.query(`ALTER TABLE \`${t.table}\` ADD COLUMN storage_key ${KEY_TYPE} NULL AFTER sha256`);
    for await (const row of rowsWithBytes(sequelize, t.table, t.bytes, true)) {
      const store = files as FileStore;
      const key = await store.put(Buffer.from(row.bytes));
      await store.get(key); // read back and checked against its key before the row names it
      await sequelize.query(`UPDATE \`${t.table}\` SET storage_key = ? WHERE id = ?`, { replacements: [key, row.id] });
    }
    await sequelize.query(`ALTER TABLE \`${t.table}\` MODIFY storage_key ${KEY_TYPE} NOT NULL, DROP COLUMN \`${t.bytes}\``);
  }
}

/** Brings the bytes back into the rows from the store (which keeps its objects). */
export async function down({ sequelize, files }: MigrationContext) {
  const named = [];
  for (const t of TABLES) {
    const rows = await sequelize.query<{ id: number; storage_key: string }>(`SELECT id, storage_key FROM \`${t.table}\``, {
      type: QueryTypes.SELECT,
    });
    named.push({ ...t, rows });
  }
  // Refused before any table changes.
  const total = named.reduce((n, t) => n + t.rows.length, 0);
  if (total > 0 && !files) throw new Error(`${total} uploaded file(s) are to come back from the file store, and no file store was given.`);
  for (const t of named) {
    await sequelize.query(`ALTER TABLE \`${t.table}\` ADD COLUMN \`${t.bytes}\` LONGBLOB NULL AFTER sha256`);
    for (const row of t.rows) {
      const bytes = await files!.get(row.storage_key);
      await sequelize.query(`UPDATE \`${t.table}\` SET \`${t.bytes}\` = ? WHERE id = ?`, { replacements: [bytes, row.id] });
    }
    await sequelize.query(`ALTER TABLE \`${t.table}\` MODIFY \`${t.bytes}\` LONGBLOB NOT NULL, DROP COLUMN storage_key`);
  }
}
