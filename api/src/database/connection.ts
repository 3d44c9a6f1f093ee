import type { Options } from 'sequelize';
import { databaseOwner, type AppConfig } from '../config/config';

/** The settings that name the database and its two users. */
export type DatabaseSettings = Pick<
  AppConfig,
  'DB_HOST' | 'DB_PORT' | 'DB_NAME' | 'DB_USER' | 'DB_PASSWORD' | 'DB_OWNER_USER' | 'DB_OWNER_PASSWORD'
>;

/**
 * How the API reaches MariaDB: as its runtime user (DB_USER) while it serves, as the owner
 * (DB_OWNER_USER) to migrate and grant (see runtime-grants.ts).
 */
export function connectionOptions(config: DatabaseSettings, as: 'runtime' | 'owner' = 'runtime'): Options {
  const who = as === 'owner' ? databaseOwner(config) : { user: config.DB_USER, password: config.DB_PASSWORD };
  return {
    dialect: 'mariadb',
    host: config.DB_HOST,
    port: config.DB_PORT,
    database: config.DB_NAME,
    username: who.user,
    password: who.password,
    logging: false,
    define: { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', underscored: true },
    timezone: '+00:00',
    dialectOptions: { connectTimeout: 5000 },
    // A connection the server dropped (stopped, restarted) is found invalid and replaced at its next
    // use, so service comes back as soon as the database does; a request waits at most 10 s for a
    // connection, then answers database-unavailable (common/database-unavailable.ts).
    pool: { max: 10, min: 0, idle: 10000, acquire: 10000 },
  };
}
