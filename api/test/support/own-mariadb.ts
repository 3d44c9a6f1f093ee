import { instance } from '../../scripts/lib/mariadb.mjs';

/**
 * A MariaDB of a spec's own (api/scripts/lib/mariadb.mjs, never the shared test database),
 * started in `dir` on `port` with the owner and the runtime user as npm start creates them (the
 * owner may create the tests' databases), for `startTestApp` with `settings: {DB_HOST, DB_PORT}`.
 */
export async function startOwnMariadb(dir: string, port: number) {
  const db = instance({ dir, port });
  await db.start();
  db.createDatabase({
    database: 'crumbproof_test',
    user: process.env.DB_OWNER_USER!,
    password: process.env.DB_OWNER_PASSWORD!,
    runtimeUser: process.env.DB_USER!,
    runtimePassword: process.env.DB_PASSWORD!,
  });
  return db;
}
