import { readFile, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import {
  createDatabaseIfMissing,
  databaseInWords,
  databaseState,
  dropEveryTable,
  loadDump,
  referencedFileKeys,
} from '../database/database-dump';
import { knownMigrations } from '../database/migrator';
import { setUpSchema, type SchemaSettings } from '../database/schema-setup';
import { closeFileStore, fileStoreFrom } from '../storage/file-store.factory';
import { DUMP, readArchive, type Manifest } from './backup-archive';
import { BackupError } from './backup-error';
import { bytesInWords, silentReporter, type Reporter } from './progress';

const NOTHING_CHANGED = 'Nothing was restored: the database and the file store are as they were.';

/** Up to `n` names, then how many more. */
const someOf = (names: string[], n = 8) =>
  names.length <= n ? names.join(', ') : `${names.slice(0, n).join(', ')} and ${names.length - n} more`;

/** Refuses an archive whose migrations this Crumbproof does not all have (made by a newer version, or by another program). */
function checkMigrations(file: string, manifest: Manifest) {
  const known = new Set(knownMigrations());
  const unknown = manifest.database.migrations.filter((m) => !known.has(m));
  if (unknown.length > 0) {
    throw new BackupError(
      `${basename(file)} holds a database at migration ${manifest.database.migration}, and this version of Crumbproof does not have ${someOf(unknown)}: restore it with the version that made it (or a later one). ${NOTHING_CHANGED}`,
    );
  }
}

export interface RestoreResult {
  manifest: Manifest;
  /** The migrations applied after loading, to bring an older backup up to this version. */
  migrated: string[];
}

/**
 * Restores an archive of `npm run backup` into an empty database and the file store the settings
 * name. In order, and nothing changed until the checks have passed:
 *
 * 1. the whole archive is read and checked against its manifest (readArchive) into a folder of
 *    its own, and a bad, cut-short or foreign one is refused;
 * 2. its migrations must all be this version's;
 * 3. the database must hold no table (or not exist yet: it is then created, empty);
 * 4. every file is put into the store and read back, checked against its SHA-256 (the store keeps
 *    bytes under their SHA-256, so a file already there is left as it is);
 * 5. the dump is loaded; should the load fail, every table is dropped again, leaving the database
 *    empty as it was (files put in step 4 that no row names take space and nothing else);
 * 6. the schema is brought up to this version and the runtime user granted its privileges (as
 *    `db setup` does), and every file a row names is checked to be in the store.
 */
export async function restore(settings: SchemaSettings, file: string, reporter: Reporter = silentReporter): Promise<RestoreResult> {
  const work = await mkdtemp(join(tmpdir(), 'crumbproof-restore-'));
  const store = fileStoreFrom(settings);
  try {
    reporter.step(`Checking ${file} whole before anything changes…`);
    let manifest: Manifest;
    try {
      manifest = await readArchive(file, reporter, work);
    } catch (err) {
      if (err instanceof BackupError) throw new BackupError(`${err.message}\n${NOTHING_CHANGED}`, { cause: err });
      throw err;
    }
    checkMigrations(file, manifest);

    const target = await databaseState(settings);
    if (target.tables.length > 0) {
      throw new BackupError(
        `${databaseInWords(settings, true)} already holds ${target.tables.length} table${target.tables.length === 1 ? '' : 's'} (${someOf(target.tables)}): a backup is restored only into an empty database, so that nothing of the kitchen there is mixed with it or lost. Name an empty one (DB_NAME), or empty this one yourself if you mean to replace it. ${NOTHING_CHANGED}`,
      );
    }
    reporter.step(
      `${basename(file)} is whole: made ${manifest.createdAt}, migration ${manifest.database.migration}, ${manifest.database.tables.length} tables and ${manifest.files.length} stored file${manifest.files.length === 1 ? '' : 's'}.`,
    );

    if (!target.exists) await createDatabaseIfMissing(settings);

    reporter.step(`Putting ${manifest.files.length} file${manifest.files.length === 1 ? '' : 's'} into ${store.where}…`);
    const filesMeter = reporter.meter('Put into the store', manifest.files.length, 'files');
    for (const f of manifest.files) {
      try {
        const bytes = await readFile(join(work, f.path));
        const key = await store.put(bytes);
        if (key !== f.sha256) throw new BackupError(`The store kept ${f.path} as ${key}.`);
        await store.get(key);
      } catch (err) {
        throw new BackupError(
          `Could not put ${f.path} back into ${store.where}: ${(err as Error).message} The database is as it was (nothing loaded); run the restore again once the store answers.`,
          { cause: err },
        );
      }
      filesMeter.add(1);
    }
    filesMeter.done();

    reporter.step(`Loading the dump into ${databaseInWords(settings)}…`);
    const loadMeter = reporter.meter('Loaded', manifest.database.dump.size, 'bytes');
    try {
      await loadDump(settings, join(work, DUMP), (n) => loadMeter.add(n));
    } catch (err) {
      const emptied = await dropEveryTable(settings).then(
        () => 'every table it had loaded was dropped again, so the database is empty as it was',
        (dropErr: unknown) => `and emptying it again failed too (${(dropErr as Error).message}): drop its tables before trying again`,
      );
      throw new BackupError(`The dump could not be loaded: ${(err as Error).message}\nThe restore stopped; ${emptied}.`, { cause: err });
    }
    loadMeter.done();

    reporter.step('Bringing the schema up to this version and granting the API its privileges…');
    const { applied } = await setUpSchema(settings);
    const missing: string[] = [];
    for (const key of await referencedFileKeys(settings)) if (!(await store.has(key))) missing.push(key);
    if (missing.length > 0) {
      throw new BackupError(
        `The database was restored, but ${missing.length} file${missing.length === 1 ? '' : 's'} its rows name ${missing.length === 1 ? 'is' : 'are'} not in ${store.where} (${someOf(missing, 3)}): the backup was made without ${missing.length === 1 ? 'it' : 'them'}. Those files will be refused when opened.`,
      );
    }
    reporter.step(
      `Restored ${databaseInWords(settings)} (migration ${manifest.database.migration}${applied.length ? `, then ${applied.join(', ')}` : ''}) and ${manifest.files.length} stored file${manifest.files.length === 1 ? '' : 's'} (${bytesInWords(manifest.files.reduce((s, f) => s + f.size, 0))}) from ${basename(file)}.`,
    );
    return { manifest, migrated: applied };
  } finally {
    closeFileStore(store);
    await rm(work, { recursive: true, force: true });
  }
}
