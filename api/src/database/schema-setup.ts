import { Sequelize } from 'sequelize';
import { connectionOptions, type DatabaseSettings } from './connection';
import { migrateUp } from './migrator';
import { grantRuntime, type GrantOutcome } from './runtime-grants';
import { closeFileStore, fileStoreFrom, type StorageSettings } from '../storage/file-store.factory';

/** What setting up the schema reads: the database and its two users, and the file store (for migration 0014). */
export type SchemaSettings = DatabaseSettings & StorageSettings;

/**
 * Migrates as the owner (DB_OWNER_USER), then grants the runtime user (DB_USER) its privileges
 * on every table, so a table a migration added is covered at once: `db migrate` and `db setup`
 * (npm start, npm test, an existing install on its next start) and the tests' databases.
 */
export async function setUpSchema(config: SchemaSettings, log?: (m: string) => void): Promise<{ applied: string[]; grants: GrantOutcome }> {
  const owner = new Sequelize(connectionOptions(config, 'owner'));
  const files = fileStoreFrom(config);
  try {
    const applied = (await migrateUp(owner, log, files)).map((m) => m.name);
    const grants = await grantRuntime(owner, config.DB_USER);
    return { applied, grants };
  } finally {
    closeFileStore(files);
    await owner.close();
  }
}
