import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { databaseInWords, databaseState, dumpDatabase, referencedFileKeys } from '../database/database-dump';
import type { SchemaSettings } from '../database/schema-setup';
import { closeFileStore, fileStoreFrom } from '../storage/file-store.factory';
import { ARCHIVE_FORMAT, DUMP, fileEntry, FILES_DIR, FORMAT_VERSION, readArchive, writeArchive, type Manifest } from './backup-archive';
import { BackupError } from './backup-error';
import { bytesInWords, silentReporter, type Reporter } from './progress';

/** `crumbproof-2026-12-03T1412Z.tar.gz`: the minute it was made, in UTC; `-2`, `-3`… after it when that name is taken. */
export function archiveName(dir: string, at: Date): string {
  const stamp = at
    .toISOString()
    .replace(/:\d\d\.\d+Z$/, 'Z')
    .replace(':', '');
  for (let n = 1; ; n++) {
    const name = `crumbproof-${stamp}${n === 1 ? '' : `-${n}`}.tar.gz`;
    if (!existsSync(join(dir, name)) && !existsSync(join(dir, `${name}.partial`))) return name;
  }
}

export interface BackupResult {
  file: string;
  bytes: number;
  manifest: Manifest;
}

/**
 * Backs the kitchen up into one archive in `dir` (backup-archive.ts): the database dumped in one
 * consistent snapshot, every stored file a row names read from the store (each checked against
 * its key as it is read), and the manifest. The keys are listed after the dump: rows that name
 * files are only ever added, and a file is deleted only when no row names it, so the list holds
 * every file the dump names (and perhaps one a row added since, which costs a little space). The
 * archive is read back and checked whole before it is called done; on any failure nothing is left
 * in `dir`.
 */
export async function backUp(
  settings: SchemaSettings,
  dir: string,
  reporter: Reporter = silentReporter,
  now = new Date(),
): Promise<BackupResult> {
  const before = await databaseState(settings);
  if (!before.exists) throw new BackupError(`There is no ${databaseInWords(settings)}: nothing to back up. Check DB_NAME.`);
  if (!before.migrations?.length) {
    throw new BackupError(
      `${databaseInWords(settings, true)} is not a Crumbproof database (it has no schema_migrations, the migrations' record): nothing was backed up. Check DB_NAME.`,
    );
  }
  await mkdir(dir, { recursive: true });
  const file = join(dir, archiveName(dir, now));
  const staging = await mkdtemp(join(dir, `.${ARCHIVE_FORMAT}-${randomBytes(3).toString('hex')}-`));
  const store = fileStoreFrom(settings);
  try {
    reporter.step(`Dumping ${databaseInWords(settings)} (mariadb-dump, one consistent snapshot)…`);
    const dumpMeter = reporter.meter('Dumped', 0, 'bytes');
    const dump = await dumpDatabase(settings, join(staging, DUMP), (n) => dumpMeter.add(n));
    dumpMeter.done();
    const after = await databaseState(settings);
    if (after.migrations?.join() !== before.migrations.join()) {
      throw new BackupError(
        `${databaseInWords(settings, true)} was migrated while it was being dumped (now at ${after.migrations?.at(-1)}): nothing was backed up. Run the backup again.`,
      );
    }

    const keys = await referencedFileKeys(settings);
    reporter.step(`Copying ${keys.length} stored file${keys.length === 1 ? '' : 's'} from ${store.where}…`);
    await mkdir(join(staging, FILES_DIR));
    const filesMeter = reporter.meter('Copied', keys.length, 'files');
    const files: Manifest['files'] = [];
    for (const key of keys) {
      let bytes: Buffer;
      try {
        bytes = await store.get(key);
      } catch (err) {
        throw new BackupError(`${(err as Error).message} Nothing was backed up: a backup without it would not restore whole.`, {
          cause: err,
        });
      }
      await writeFile(join(staging, fileEntry(key)), bytes, { mode: 0o600 });
      files.push({ path: fileEntry(key), sha256: key, size: bytes.length });
      filesMeter.add(1);
    }
    filesMeter.done();

    const manifest: Manifest = {
      format: ARCHIVE_FORMAT,
      formatVersion: FORMAT_VERSION,
      createdAt: now.toISOString(),
      database: {
        name: settings.DB_NAME,
        migration: before.migrations.at(-1)!,
        migrations: before.migrations,
        tables: before.tables,
        dump: { path: DUMP, ...dump },
      },
      files,
      store: { kind: store.kind },
    };
    reporter.step(`Writing ${file}…`);
    const bytes = await writeArchive(staging, manifest, file, reporter);

    reporter.step('Checking that the archive reads back whole…');
    try {
      await readArchive(file, reporter);
    } catch (err) {
      await rm(file, { force: true });
      throw new BackupError(
        `The archive just written does not read back whole, so it was removed: ${(err as Error).message}\nCheck the disk of ${dir} and run the backup again.`,
        { cause: err },
      );
    }
    reporter.step(
      `Backed up ${databaseInWords(settings)} (${before.tables.length} tables, migration ${manifest.database.migration}) and ${files.length} stored file${files.length === 1 ? '' : 's'} into ${file} (${bytesInWords(bytes)}).`,
    );
    return { file, bytes, manifest };
  } catch (err) {
    await rm(`${file}.partial`, { force: true });
    throw err;
  } finally {
    closeFileStore(store);
    await rm(staging, { recursive: true, force: true });
  }
}
