import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { Sequelize } from 'sequelize-typescript';
import { createTestDatabase, dropTestDatabase } from './test-app';

export interface SettingsApp {
  app: NestFastifyApplication;
  sequelize: Sequelize;
  database: string;
  /** What main.ts does at start: a new one-time first-manager link's token, or null when the kitchen has its manager. */
  issueFirstManagerLink(): Promise<string | null>;
  /** What `db setup` does after migrating: seeds the demo (the chain of two kitchens) into an empty database, and nothing into one with a kitchen. */
  seedDemo(): Promise<'seeded' | 'kept'>;
  /** Closes the app; drops its database unless it is to be opened again. */
  close(opts?: { keepDatabase?: boolean }): Promise<void>;
}

/**
 * A real API with settings of its own (the configuration is read once per module registry, so
 * the app is built in a fresh one), on a database of its own or on one an earlier app left.
 */
export async function startAppWith(
  settings: Record<string, string | undefined>,
  opts: { database: string; create?: boolean; seed?: boolean },
): Promise<SettingsApp> {
  const saved: Record<string, string | undefined> = {};
  const all = { ...settings, DB_NAME: opts.database };
  for (const [k, v] of Object.entries(all)) {
    saved[k] = process.env[k];
    if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
  try {
    await createTestDatabase(opts.database, opts.create !== false);
    let built!: Pick<SettingsApp, 'app' | 'sequelize' | 'issueFirstManagerLink' | 'seedDemo'>;
    await jest.isolateModulesAsync(async () => {
      const { createApp } = await import('../../src/app.factory');
      const { DEMO_ONE_KITCHEN, SeedService } = await import('../../src/database/seed.service');
      const { Sequelize: IsolatedSequelize } = await import('sequelize-typescript');
      const { FirstManagerService } = await import('../../src/auth/first-manager.service');
      const app = await createApp({ logLevel: 'silent' });
      const sequelize = app.get(IsolatedSequelize);
      if (opts.seed) await app.get(SeedService).seedKitchen(DEMO_ONE_KITCHEN);
      built = {
        app,
        sequelize,
        issueFirstManagerLink: async () => (await app.get(FirstManagerService).issue())?.token ?? null,
        seedDemo: () => app.get(SeedService).seedDemo(),
      };
    });
    return {
      ...built,
      database: opts.database,
      async close({ keepDatabase = false } = {}) {
        await built.app.close();
        if (!keepDatabase) await dropTestDatabase(opts.database);
      },
    };
  } finally {
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  }
}
