import { DataTypes, QueryTypes } from 'sequelize';
import bcrypt from 'bcryptjs';
import type { MigrationContext } from '../migrator';
import { DEMO_PASSWORD } from '../seeders/demo-users';

/**
 * Sign-in state kept by the server, so that every instance of the API sees the same:
 * - sessions: one row per sign-in. The cookie's token names its row; signing out, a new
 *   password, a new role or deactivation end the row, and no token outlives it.
 * - sign_in_failures: wrong passwords in a row per email (known or not, so the answer never
 *   tells which emails have accounts), with the time until which that email must wait.
 * - sign_in_counters: failed sign-ins per fixed window, for one address and for the whole kitchen.
 * - first_manager_links: the one-time link that sets a kitchen's first manager; only its SHA-256 is kept.
 * - users.demo_password: the account still has the demo kitchen's published password (every
 *   existing account is checked against it here, so a database seeded before keeps the mark).
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'sessions',
    {
      id: { type: DataTypes.CHAR(32), primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
      idle_expires_at: { type: DataTypes.DATE(3), allowNull: false },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      ended_at: { type: DataTypes.DATE(3), allowNull: true },
      end_reason: { type: DataTypes.STRING(40), allowNull: true },
    },
    opts,
  );
  await q.addIndex('sessions', ['user_id'], { name: 'sessions_user' });
  await q.addIndex('sessions', ['expires_at'], { name: 'sessions_expires' });

  await q.createTable(
    'sign_in_failures',
    {
      email: { type: DataTypes.STRING(254), primaryKey: true },
      failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      wait_until: { type: DataTypes.DATE(3), allowNull: true },
      updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );

  await q.createTable(
    'sign_in_counters',
    {
      scope: { type: DataTypes.STRING(80), primaryKey: true },
      window_start: { type: DataTypes.DATE, primaryKey: true },
      failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    },
    opts,
  );
  await q.addIndex('sign_in_counters', ['window_start'], { name: 'sign_in_counters_window' });

  await q.createTable(
    'first_manager_links',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      token_sha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE(3), allowNull: false },
      used_at: { type: DataTypes.DATE(3), allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );

  await q.addColumn('users', 'demo_password', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  const users = await sequelize.query<{ id: number; password_hash: string }>('SELECT id, password_hash FROM users', {
    type: QueryTypes.SELECT,
  });
  for (const u of users) {
    if (await bcrypt.compare(DEMO_PASSWORD, u.password_hash)) {
      await sequelize.query('UPDATE users SET demo_password = TRUE WHERE id = ?', { replacements: [u.id] });
    }
  }
}

export async function down({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.removeColumn('users', 'demo_password');
  await q.dropTable('first_manager_links');
  await q.dropTable('sign_in_counters');
  await q.dropTable('sign_in_failures');
  await q.dropTable('sessions');
}
