import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

const stamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
  updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
};

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'users',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      role: { type: DataTypes.ENUM('manager', 'pastry-chef', 'front-of-house'), allowNull: false },
      password_hash: { type: DataTypes.STRING(100), allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      ...stamps,
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await q.createTable(
    'sites',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(160), allowNull: false },
      address: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
      regime: { type: DataTypes.ENUM('EU', 'UK', 'US', 'CA', 'ANZ'), allowNull: false },
      measures: { type: DataTypes.STRING(20), allowNull: true },
      handles: { type: DataTypes.JSON, allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      ...stamps,
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
}

export async function down({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.dropTable('sites');
  await q.dropTable('users');
}
