import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import { createConnection } from 'mariadb';
import { Sequelize } from 'sequelize-typescript';
import type { Clock } from '../../src/common/clock';
import { environmentConfig } from '../../src/config/config';
import { connectionOptions } from '../../src/database/connection';
import { revokeRuntime } from '../../src/database/runtime-grants';
import { setUpSchema } from '../../src/database/schema-setup';
import { DEMO_ONE_KITCHEN, SeedService, type SeedKitchen } from '../../src/database/seed.service';
import { DEMO_PASSWORD } from '../../src/database/seeders/demo-users';
import type { FakeSmtp } from './fake-smtp';

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

/** Creates an empty database and connects to it as the owner, for a spec that migrates it step by step. */
export async function emptyOwnerDatabase(database: string): Promise<Sequelize> {
  await adminQuery(`CREATE DATABASE \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  return new Sequelize({ ...connectionOptions({ ...environmentConfig(), DB_NAME: database }, 'owner'), models: [] });
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

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** The session cookies of the demo kitchen's three accounts, one a role. */
export interface DemoSessions {
  manager: string;
  chef: string;
  counter: string;
}

export interface TestApp {
  app: NestFastifyApplication;
  close(): Promise<void>;
  /** Signs in and returns the session cookie to send with later requests. */
  signIn(email: string, password?: string): Promise<string>;
  /** Signs in as the demo manager, pastry chef and front of house (a seeded app). */
  signInDemo(): Promise<DemoSessions>;
  /** A JSON request, with the session cookie when one is given. */
  req(method: Method, url: string, cookie?: string, payload?: unknown): ReturnType<NestFastifyApplication['inject']>;
  /** The app's clock, which a test moves forward instead of waiting. */
  clock: Clock;
  /** Sends every mail that is due now and waits until the sender is done. */
  sendDueMail(): Promise<void>;
  sequelize: Sequelize;
}

export interface TestAppOptions {
  /**
   * Seed the one-kitchen demo (Wrenfield Lane Bakehouse, its products and its three accounts), or
   * the book and people given (DEMO_CHAIN: the app's demo of two kitchens).
   */
  seed?: boolean | SeedKitchen;
  /** Send the app's mail to this server (test/support/fake-smtp.ts), polled hourly so a test sends what is due itself. */
  mail?: FakeSmtp;
  /** Further settings of the app's environment (SIGN_IN_LIMIT, …), as `.env.example` names them. */
  settings?: Record<string, string>;
  /** Serve the database that is there already (a restored one, say): none is created, and `db setup`'s migrations and grants run over it. */
  existing?: boolean;
}

/** What a test app's mail server settings are, as the app's environment holds them. */
function mailSettings(smtp: FakeSmtp): Record<string, string> {
  return { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(smtp.port), MAIL_FROM: 'kitchen-mail@bakehouse.example', MAIL_POLL_SECONDS: '3600' };
}

/**
 * A real API on a fresh MariaDB database of its own, migrated, optionally seeded with the demo
 * kitchen and sending its mail to a server of the test's own. The configuration is read once, when
 * the app's modules first load in the test file, so the settings are set before that; an app whose
 * settings were read earlier fails to start here rather than run without them.
 */
export async function startTestApp(opts: TestAppOptions = {}): Promise<TestApp> {
  const db = process.env.DB_NAME!;
  const settings = { ...(opts.mail ? mailSettings(opts.mail) : {}), ...opts.settings };
  Object.assign(process.env, settings);
  await createTestDatabase(db, !opts.existing);
  const { createApp } = await import('../../src/app.factory');
  const { Clock: ClockClass } = await import('../../src/common/clock');
  const { MailSender } = await import('../../src/mail/mail-sender.service');
  const { ConfigService } = await import('@nestjs/config');
  const app = await createApp({ logLevel: 'silent' });
  const config = app.get(ConfigService);
  const unread = Object.entries(settings).filter(([name, value]) => String(config.get(name)) !== value);
  if (unread.length > 0) {
    await app.close();
    await dropTestDatabase(db);
    throw new Error(
      `The app was built with settings read before this test set ${unread.map(([n]) => n).join(', ')}; start it before any other app of this file.`,
    );
  }
  const sequelize = app.get(Sequelize);
  if (opts.seed) await app.get(SeedService).seedKitchen(opts.seed === true ? DEMO_ONE_KITCHEN : opts.seed);
  const sender = app.get(MailSender);
  const signIn = async (email: string, password = DEMO_PASSWORD) => {
    const res = await app.inject({ method: 'POST', url: '/api/auth/sign-in', payload: { email, password } });
    if (res.statusCode !== 200) throw new Error(`Sign-in as ${email} failed: ${res.statusCode} ${res.body}`);
    const cookie = res.cookies.find((c) => c.name === 'cp_session');
    return `cp_session=${cookie!.value}`;
  };
  return {
    app,
    sequelize,
    clock: app.get(ClockClass),
    async close() {
      await app.close();
      await dropTestDatabase(db);
    },
    signIn,
    async signInDemo() {
      return {
        manager: await signIn('manager@example.com'),
        chef: await signIn('chef@example.com'),
        counter: await signIn('counter@example.com'),
      };
    },
    req: (method, url, cookie, payload) =>
      app.inject({ method, url, headers: cookie ? { cookie } : {}, ...(payload === undefined ? {} : { payload: payload as object }) }),
    async sendDueMail() {
      sender.kick();
      await sender.whenIdle();
    },
  };
}
