import { z } from 'zod';

/** The API's configuration, parsed once from the environment. Nothing else reads process.env. */
export const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z.string().min(1).default('crumbproof'),
  DB_USER: z.string().min(1).default('crumbproof'),
  DB_PASSWORD: z.string().default('crumbproof-local'),
  JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters.'),
  SESSION_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(30),
  COOKIE_SECURE: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
  SIGN_IN_WINDOW_SECONDS: z.coerce.number().int().min(1).default(60),
  WEB_DIST: z.string().optional(),
  REFERENCE_DATA_DIR: z.string().optional(),
  LOG_LEVEL: z.enum(['silent', 'error', 'warn', 'info', 'debug']).default('info'),
});
export type AppConfig = z.infer<typeof configSchema>;

export function parseConfig(env: Record<string, string | undefined>): AppConfig {
  const result = configSchema.safeParse(env);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`The API's configuration is not valid:\n${lines.join('\n')}`);
  }
  return result.data;
}
