import type { MigrationContext } from '../migrator';

/**
 * A revision per kind of change that every API instance keeps copies of in memory and asks for
 * every 200 ms instead of reading the rows at each request (ChangeFeed): `access` is raised in the
 * transaction of every change to sessions, accounts and kitchen roles (a sign-out, a password
 * change, a deactivation, a role changed or taken off), so every instance drops its copies of them.
 */
export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(
    `CREATE TABLE change_revisions (
       name VARCHAR(40) NOT NULL PRIMARY KEY,
       revision BIGINT UNSIGNED NOT NULL DEFAULT 0
     ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`,
  );
  await sequelize.query("INSERT INTO change_revisions (name, revision) VALUES ('access', 0)");
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('DROP TABLE change_revisions');
}
