import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { createConnection } from 'mariadb';
import { Sequelize } from 'sequelize-typescript';
import { createApp } from '../../src/app.factory';
import { environmentConfig } from '../../src/config/config';
import { connectionOptions } from '../../src/database/connection';
import { revokeRuntime } from '../../src/database/runtime-grants';
import { setUpSchema } from '../../src/database/schema-setup';
import { SeedService } from '../../src/database/seed.service';
import { DEMO_PASSWORD } from '../../src/database/seeders/demo-users';

/** A statement run as the database's owner (DB_OWNER_USER), who creates and drops the tests' databases. */
export async function adminQuery(sql: string) {
  const conn = await createConnection({
    host: process.env.DB_HOST,
    port: Number(process.env.DB_PORT),
    user: process.env.DB_OWNER_USER ?? process.env.DB_USER,
    password: process.env.DB_OWNER_USER ? process.env.DB_OWNER_PASSWORD : process.env.DB_PASSWORD,
  });
  try {
    await conn.query(sql);
  } finally {
    await conn.end();
  }
}

/**
 * Creates a test database (or keeps the one there) and migrates it as the owner, granting the
 * runtime user its privileges, as `db setup` does; the app then runs as the runtime user.
 */
export async function createTestDatabase(database: string, create = true) {
  if (create) await adminQuery(`CREATE DATABASE \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await setUpSchema({ ...environmentConfig(), DB_NAME: database });
}

/** Takes back the runtime user's table grants (MariaDB keeps them after a DROP DATABASE), then drops the database. */
export async function dropTestDatabase(database: string) {
  const config = environmentConfig();
  const owner = new Sequelize({ ...connectionOptions({ ...config, DB_NAME: database }, 'owner'), models: [] });
  try {
    await revokeRuntime(owner, config.DB_USER);
  } catch {
    // the database is gone already
  } finally {
    await owner.close();
  }
  await adminQuery(`DROP DATABASE IF EXISTS \`${database}\``);
}

export interface TestApp {
  app: NestFastifyApplication;
  close(): Promise<void>;
  /** Signs in and returns the session cookie to send with later requests. */
  signIn(email: string, password?: string): Promise<string>;
  sequelize: Sequelize;
}

/** A real API on a fresh MariaDB database of its own, migrated, optionally seeded with the demo kitchen. */
export async function startTestApp(opts: { seed?: boolean } = {}): Promise<TestApp> {
  const db = process.env.DB_NAME!;
  await createTestDatabase(db);
  const app = await createApp({ logLevel: 'silent' });
  const sequelize = app.get(Sequelize);
  if (opts.seed) await app.get(SeedService).seedDemo();
  return {
    app,
    sequelize,
    async close() {
      await app.close();
      await dropTestDatabase(db);
    },
    async signIn(email, password = DEMO_PASSWORD) {
      const res = await app.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email, password } });
      if (res.statusCode !== 200) throw new Error(`Sign-in as ${email} failed: ${res.statusCode} ${res.body}`);
      const cookie = res.cookies.find((c) => c.name === 'cp_session');
      return `cp_session=${cookie!.value}`;
    },
  };
}
