import type { ConfigService } from '@nestjs/config';
import { z } from 'zod';

/** An empty value (as .env.example leaves it) is the same as unset. */
const unsetIfEmpty = <S extends z.ZodType>(schema: S) => z.preprocess((v) => (v === '' ? undefined : v), schema);

/** The API's configuration, parsed once from the environment. Nothing else reads process.env. */
export const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z.string().min(1).default('crumbproof'),
  /** The API's runtime user: npm start's may only read and add rows of audit_events (see DB_OWNER_USER). */
  DB_USER: z.string().min(1).default('crumbproof'),
  DB_PASSWORD: z.string().default('crumbproof-local'),
  /**
   * The owner, who runs the migrations and then grants DB_USER its privileges table by table
   * (SELECT and INSERT only on audit_events). Unset: DB_USER is the owner too, and the audit
   * trail is append-only in the API alone, not in the database.
   */
  DB_OWNER_USER: unsetIfEmpty(z.string().min(1).optional()),
  DB_OWNER_PASSWORD: unsetIfEmpty(z.string().optional()),
  JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters.'),
  SESSION_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(30),
  /** The longest a session lasts however busy it is (the idle limit above renews; this does not). */
  SESSION_MAX_HOURS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 7)
    .default(12),
  /**
   * Unset: Secure outside development and loopback. The session cookie may go without Secure
   * only where it never crosses a network (see sessionCookieSecure below).
   */
  COOKIE_SECURE: unsetIfEmpty(z.enum(['true', 'false']).optional()),
  /** Failed sign-ins from one address in a window before that address waits. */
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
  /** Failed sign-ins across every account and address in a window before everyone waits. */
  SIGN_IN_GLOBAL_LIMIT: z.coerce.number().int().min(1).default(30),
  SIGN_IN_WINDOW_SECONDS: z.coerce.number().int().min(1).default(60),
  /**
   * The demo kitchen and its accounts with the published password. Unset: on in development and
   * test, off in production (npm start turns it on when it listens on loopback). Never beyond loopback.
   */
  DEMO_KITCHEN: unsetIfEmpty(z.enum(['true', 'false']).optional()),
  /**
   * The address people open Crumbproof at when a reverse proxy stands in front of it
   * (https://crumbproof.example): writes from pages of that origin are accepted even where the
   * proxy rewrote Host, and the first manager's link is printed with it.
   */
  PUBLIC_URL: unsetIfEmpty(z.url({ protocol: /^https?$/, error: 'PUBLIC_URL must be an http or https address.' }).optional()),
  /** The most the supplier specification files of one kitchen may take in all, in MB (1 MB = 1,048,576 bytes). */
  KITCHEN_FILE_QUOTA_MB: z.coerce.number().positive().default(500),
  /**
   * The mail server the kitchen's e-mail goes through (invitations, password resets, what other
   * features tell people). Unset: nothing is sent, and mails wait in the outbox (the manager's
   * Mail page says so) until a server is set.
   */
  SMTP_HOST: unsetIfEmpty(z.string().min(1).optional()),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  /** true: TLS from the first byte (usually port 465); false: STARTTLS when the server offers it (587, 25). */
  SMTP_SECURE: z.enum(['true', 'false']).default('false'),
  SMTP_USER: unsetIfEmpty(z.string().min(1).optional()),
  SMTP_PASSWORD: unsetIfEmpty(z.string().optional()),
  /** The address mail is sent from; the sender's name is the kitchen's ("Wrenfield Lane Bakehouse via Crumbproof"). */
  MAIL_FROM: unsetIfEmpty(z.email({ error: 'MAIL_FROM must be an email address such as crumbproof@bakery.example.' }).optional()),
  /** How often the sender looks for mail that is due (it is also woken as soon as a mail is queued). */
  MAIL_POLL_SECONDS: z.coerce.number().int().min(1).max(3600).default(30),
  /**
   * Where uploaded files (supplier specifications, label runs' PDFs) are kept: `local`, a folder
   * (STORAGE_DIR), or `s3`, a bucket of an S3-compatible object storage (the S3_ settings).
   */
  STORAGE: z.enum(['local', 's3']).default('local'),
  /** The folder of STORAGE=local, relative to where the API starts (npm start and npm run dev start it at the root). */
  STORAGE_DIR: z.string().min(1).default('.data/uploads'),
  /** The service's address (https://s3.eu-west-2.amazonaws.com, http://127.0.0.1:9000); unset: AWS's own for S3_REGION. */
  S3_ENDPOINT: unsetIfEmpty(z.url({ protocol: /^https?$/, error: 'S3_ENDPOINT must be an http or https address.' }).optional()),
  /** The bucket, which must exist: Crumbproof creates none. */
  S3_BUCKET: unsetIfEmpty(z.string().min(3).max(63).optional()),
  S3_REGION: z.string().min(1).default('us-east-1'),
  /** Both or neither; neither: the SDK's own chain (AWS_* variables, instance roles). */
  S3_ACCESS_KEY_ID: unsetIfEmpty(z.string().min(1).optional()),
  S3_SECRET_ACCESS_KEY: unsetIfEmpty(z.string().min(1).optional()),
  /** true: bucket in the path (http://host/bucket/key), as most S3-compatible services and fakes want. */
  S3_FORCE_PATH_STYLE: z.enum(['true', 'false']).default('false'),
  WEB_DIST: z.string().optional(),
  LOG_LEVEL: z.enum(['silent', 'error', 'warn', 'info', 'debug']).default('info'),
});
export type AppConfig = z.infer<typeof configSchema>;

/** 127.0.0.0/8, ::1 and localhost: addresses no other machine can reach. 0.0.0.0 and :: listen on every network. */
export function isLoopback(host: string): boolean {
  const h = host
    .trim()
    .toLowerCase()
    .replace(/^\[|\]$/g, '');
  return h === 'localhost' || h === '::1' || /^127(\.\d{1,3}){3}$/.test(h) || /^::ffff:127(\.\d{1,3}){3}$/.test(h);
}

/** The parsed settings, or the ConfigService that holds them. */
type Settings<K extends keyof AppConfig> = Pick<AppConfig, K> | ConfigService<AppConfig, true>;

function read<K extends keyof AppConfig>(settings: Settings<K>, key: K): AppConfig[K] {
  const service = settings as ConfigService<AppConfig, true>;
  return typeof service.get === 'function' ? service.get(key, { infer: true }) : (settings as Pick<AppConfig, K>)[key];
}

/** Whether this installation is the demo kitchen (see DEMO_KITCHEN). */
export function isDemoKitchen(settings: Settings<'DEMO_KITCHEN' | 'HOST' | 'NODE_ENV'>): boolean {
  if (!isLoopback(read(settings, 'HOST'))) return false;
  const demo = read(settings, 'DEMO_KITCHEN');
  if (demo !== undefined) return demo === 'true';
  return read(settings, 'NODE_ENV') !== 'production';
}

/** The session cookie is Secure everywhere but in development and on loopback, where it never crosses a network. */
export function sessionCookieSecure(settings: Settings<'COOKIE_SECURE' | 'HOST' | 'NODE_ENV'>): boolean {
  const secure = read(settings, 'COOKIE_SECURE');
  if (secure !== undefined) return secure === 'true';
  return !(read(settings, 'NODE_ENV') === 'development' || isLoopback(read(settings, 'HOST')));
}

/**
 * Where people open Crumbproof, for the links mail carries: PUBLIC_URL, or the address the API
 * listens on (loopback installations and tests).
 */
export function appAddress(settings: Settings<'PUBLIC_URL' | 'HOST' | 'PORT'>): string {
  const url = read(settings, 'PUBLIC_URL');
  if (url) return url.replace(/\/+$/, '');
  const host = read(settings, 'HOST');
  const shown = host === '0.0.0.0' || host === '::' ? '127.0.0.1' : host.includes(':') ? `[${host}]` : host;
  return `http://${shown}:${read(settings, 'PORT')}`;
}

/** Who runs the migrations: DB_OWNER_USER, or DB_USER when no owner is set. */
export function databaseOwner(config: Pick<AppConfig, 'DB_USER' | 'DB_PASSWORD' | 'DB_OWNER_USER' | 'DB_OWNER_PASSWORD'>) {
  return config.DB_OWNER_USER
    ? { user: config.DB_OWNER_USER, password: config.DB_OWNER_PASSWORD ?? '' }
    : { user: config.DB_USER, password: config.DB_PASSWORD };
}

/** The settings of this process, from its environment: the one place that reads process.env. */
export function environmentConfig(): AppConfig {
  return parseConfig(process.env);
}

/** STORAGE=s3 needs its bucket, and the S3 keys go together. */
function storageIssues(c: Pick<AppConfig, 'STORAGE' | 'S3_BUCKET' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY'>, ctx: z.RefinementCtx) {
  if (c.STORAGE === 's3' && !c.S3_BUCKET) {
    ctx.addIssue({
      code: 'custom',
      path: ['S3_BUCKET'],
      message: 'Set S3_BUCKET, the bucket uploaded files are kept in, with STORAGE=s3.',
    });
  }
  if (!c.S3_ACCESS_KEY_ID !== !c.S3_SECRET_ACCESS_KEY) {
    ctx.addIssue({
      code: 'custom',
      path: [c.S3_ACCESS_KEY_ID ? 'S3_SECRET_ACCESS_KEY' : 'S3_ACCESS_KEY_ID'],
      message: 'Set S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY together (or leave both unset).',
    });
  }
}

/** The parsed settings, or every problem a line, naming the setting. */
function parsed<T>(result: z.ZodSafeParseResult<T>, notValid: string): T {
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`${notValid}:\n${lines.join('\n')}`);
  }
  return result.data;
}

export function parseConfig(env: Record<string, string | undefined>): AppConfig {
  const result = configSchema
    .superRefine((c, ctx) => {
      if (c.DEMO_KITCHEN === 'true' && !isLoopback(c.HOST)) {
        ctx.addIssue({
          code: 'custom',
          path: ['DEMO_KITCHEN'],
          message: `The demo kitchen's accounts have a published password, so it listens on loopback only; HOST is ${c.HOST}.`,
        });
      }
      if (c.COOKIE_SECURE === 'false' && c.NODE_ENV !== 'development' && !isLoopback(c.HOST)) {
        ctx.addIssue({
          code: 'custom',
          path: ['COOKIE_SECURE'],
          message: `A session cookie without Secure would cross the network from ${c.HOST} in clear text: serve Crumbproof over HTTPS and leave COOKIE_SECURE unset.`,
        });
      }
      if (c.SMTP_HOST && !c.MAIL_FROM) {
        ctx.addIssue({ code: 'custom', path: ['MAIL_FROM'], message: 'Set MAIL_FROM, the address mail is sent from, with SMTP_HOST.' });
      }
      if (c.SMTP_PASSWORD && !c.SMTP_USER) {
        ctx.addIssue({ code: 'custom', path: ['SMTP_USER'], message: 'Set SMTP_USER with SMTP_PASSWORD (or leave both unset).' });
      }
      storageIssues(c, ctx);
      if (c.SESSION_MAX_HOURS * 60 < c.SESSION_MINUTES) {
        ctx.addIssue({ code: 'custom', path: ['SESSION_MAX_HOURS'], message: 'SESSION_MAX_HOURS must be at least SESSION_MINUTES.' });
      }
    })
    .safeParse(env);
  return parsed(result, "The API's configuration is not valid");
}

/**
 * What `npm run backup` and `npm run restore` read: the database (its owner dumps and loads it)
 * and the store of uploaded files, as the API names them, and the folder archives go to
 * (BACKUP_DIR, relative to the repository's root; `backups` when unset). No secret of the API's
 * own is needed.
 */
export const backupSettingsSchema = configSchema
  .pick({
    DB_HOST: true,
    DB_PORT: true,
    DB_NAME: true,
    DB_USER: true,
    DB_PASSWORD: true,
    DB_OWNER_USER: true,
    DB_OWNER_PASSWORD: true,
    STORAGE: true,
    STORAGE_DIR: true,
    S3_ENDPOINT: true,
    S3_BUCKET: true,
    S3_REGION: true,
    S3_ACCESS_KEY_ID: true,
    S3_SECRET_ACCESS_KEY: true,
    S3_FORCE_PATH_STYLE: true,
  })
  .extend({ BACKUP_DIR: unsetIfEmpty(z.string().min(1).default('backups')) });
export type BackupSettings = z.infer<typeof backupSettingsSchema>;

export function parseBackupSettings(env: Record<string, string | undefined>): BackupSettings {
  return parsed(backupSettingsSchema.superRefine(storageIssues).safeParse(env), 'The backup settings are not valid');
}

/** The backup and restore commands' settings, from this process's environment. */
export function environmentBackupSettings(): BackupSettings {
  return parseBackupSettings(process.env);
}

/** What `npm run bench` hands its measuring process (api/scripts/bench.mjs): the app it started and the counter's timing. */
export interface BenchEnvironment {
  apiUrl: string | null;
  apiPid: number | null;
  counterMs: number | null;
}

export function benchEnvironment(env: Record<string, string | undefined> = process.env): BenchEnvironment {
  const number = (value: string | undefined) => (value && Number.isFinite(Number(value)) ? Number(value) : null);
  return { apiUrl: env.BENCH_API_URL || null, apiPid: number(env.BENCH_API_PID), counterMs: number(env.BENCH_COUNTER_MS) };
}
