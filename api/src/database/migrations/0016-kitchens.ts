import type { MigrationContext } from '../migrator';

/**
 * Several kitchens over one recipe book:
 * - sites gains each kitchen's id in the book (`code`; null for the one kitchen of a book given as
 *   site), the substitutions of its own ingredients for shared ones, and the recipes it sells (null:
 *   every recipe for sale). Ingredients and recipes stay keyed by the first site, the book's owner,
 *   and are shared by every kitchen.
 * - kitchen_roles: a person's role at each kitchen they work in; a person with no row for a kitchen
 *   has no access to it. Everyone already on an installation keeps their role at its kitchens.
 */
const opts = 'ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci';

export async function up({ sequelize }: MigrationContext) {
  await sequelize.query(
    `ALTER TABLE sites
      ADD COLUMN code VARCHAR(64) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin NULL AFTER id,
      ADD COLUMN substitutions JSON NOT NULL DEFAULT '[]' AFTER handles,
      ADD COLUMN sells JSON NULL AFTER substitutions,
      ADD UNIQUE KEY sites_code (code)`,
  );
  await sequelize.query(
    `CREATE TABLE kitchen_roles (
      user_id INT NOT NULL,
      site_id INT NOT NULL,
      role ENUM('manager', 'pastry-chef', 'front-of-house') NOT NULL,
      created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
      PRIMARY KEY (user_id, site_id),
      KEY kitchen_roles_site (site_id),
      CONSTRAINT kitchen_roles_user FOREIGN KEY (user_id) REFERENCES users (id) ON DELETE CASCADE,
      CONSTRAINT kitchen_roles_site FOREIGN KEY (site_id) REFERENCES sites (id) ON DELETE CASCADE
    ) ${opts}`,
  );
  await sequelize.query('INSERT INTO kitchen_roles (user_id, site_id, role) SELECT u.id, s.id, u.role FROM users u CROSS JOIN sites s');
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.query('DROP TABLE IF EXISTS kitchen_roles');
  await sequelize.query('ALTER TABLE sites DROP KEY sites_code, DROP COLUMN sells, DROP COLUMN substitutions, DROP COLUMN code');
}
