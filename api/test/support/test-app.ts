import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { createConnection } from 'mariadb';
import { Sequelize } from 'sequelize-typescript';
import { createApp } from '../../src/app.factory';
import { migrateUp } from '../../src/database/migrator';
import { SeedService } from '../../src/database/seed.service';
import { DEMO_PASSWORD } from '../../src/database/seeders/demo-users';

export async function adminQuery(sql: string) {
  const conn = await createConnection({
    host: process.env.DB_HOST,
    port: Number(process.env.DB_PORT),
    user: process.env.DB_USER,
    password: process.env.DB_PASSWORD,
  });
  try {
    await conn.query(sql);
  } finally {
    await conn.end();
  }
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
  await adminQuery(`CREATE DATABASE \`${db}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  const app = await createApp({ logLevel: 'silent' });
  const sequelize = app.get(Sequelize);
  await migrateUp(sequelize);
  if (opts.seed) await app.get(SeedService).seedDemo();
  return {
    app,
    sequelize,
    async close() {
      await app.close();
      await adminQuery(`DROP DATABASE IF EXISTS \`${db}\``);
    },
    async signIn(email, password = DEMO_PASSWORD) {
      const res = await app.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email, password } });
      if (res.statusCode !== 200) throw new Error(`Sign-in as ${email} failed: ${res.statusCode} ${res.body}`);
      const cookie = res.cookies.find((c) => c.name === 'cp_session');
      return `cp_session=${cookie!.value}`;
    },
  };
}
