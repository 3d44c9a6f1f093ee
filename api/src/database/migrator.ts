import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import type { FileStore } from '../storage/file-store';

export interface MigrationContext {
  sequelize: Sequelize;
  /** Where uploaded files are kept (STORAGE), for the migrations that move bytes there (0014). */
  files?: FileStore;
}

/**
 * Versioned schema changes. Names drop their extension so that the TypeScript sources (tests)
 * and the compiled JavaScript (dist) are the same migration.
 */
export function migrator(sequelize: Sequelize, log: (m: string) => void = () => {}, files?: FileStore) {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: ['migrations/*.{js,ts}', { cwd: __dirname, ignore: ['**/*.d.ts', '**/*.spec.ts'] }],
      resolve: ({ name, path, context }) => {
        // eslint-disable-next-line @typescript-eslint/no-require-imports -- a migration is a file found at run time by its name
        const migration = require(path!) as {
          up: (c: MigrationContext) => Promise<void>;
          down: (c: MigrationContext) => Promise<void>;
        };
        return {
          name: name.replace(/\.(js|ts)$/, ''),
          up: () => migration.up(context),
          down: () => migration.down(context),
        };
      },
    },
    context: { sequelize, files },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: { info: (m) => log(typeof m === 'string' ? m : JSON.stringify(m)), warn: () => {}, error: () => {}, debug: () => {} },
  });
}

export async function migrateUp(sequelize: Sequelize, log?: (m: string) => void, files?: FileStore) {
  return migrator(sequelize, log, files).up();
}

/** The name of every migration this version of Crumbproof has, in order (a restore refuses a dump from beyond them). */
export function knownMigrations(): string[] {
  return readdirSync(join(__dirname, 'migrations'))
    .filter((f) => /\.(js|ts)$/.test(f) && !/\.(d|spec)\.ts$/.test(f))
    .map((f) => f.replace(/\.(js|ts)$/, ''))
    .sort();
}
