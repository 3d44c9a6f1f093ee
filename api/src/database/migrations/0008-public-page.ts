import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * The kitchen's public product page: whether it is on and the address customers reach it at (the
 * QR codes on counter tickets point there). One row per kitchen, none until the manager first
 * saves it, which reads as off. Which products are published is a field of each recipe's sale
 * (`sale.published` in the recipe book), kept with its revisions like the rest of the recipe.
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const site = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' };

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'public_page_settings',
    {
      site_id: { ...site, primaryKey: true },
      enabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      base_url: { type: DataTypes.STRING(120), allowNull: true },
      updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.getQueryInterface().dropTable('public_page_settings');
}
