import { Sequelize } from 'sequelize';
import type { AppConfig } from '../config/config';
import { connectionOptions } from './connection';
import { migrateUp } from './migrator';
import { grantRuntime, type GrantOutcome } from './runtime-grants';
import { closeFileStore, fileStoreFrom } from '../storage/file-store.factory';

/**
 * Migrates as the owner (DB_OWNER_USER), then grants the runtime user (DB_USER) its privileges
 * on every table, so a table a migration added is covered at once: `db migrate` and `db setup`
 * (npm start, npm test, an existing install on its next start) and the tests' databases.
 */
export async function setUpSchema(config: AppConfig, log?: (m: string) => void): Promise<{ applied: string[]; grants: GrantOutcome }> {
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
