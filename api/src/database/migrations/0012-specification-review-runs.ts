import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * What the daily review of supplier specifications found, one row per kitchen and day (the
 * kitchen's date): the overdue ones and those due within 30 days as they stood, and the mail
 * that told the pastry chefs and managers, so each day is looked at and mailed once.
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const site = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' };

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'specification_review_runs',
    {
      site_id: { ...site, primaryKey: true },
      day: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      overdue: { type: DataTypes.JSON, allowNull: false },
      due_soon: { type: DataTypes.JSON, allowNull: false },
      /** The outbox row of the day's mail; null when there was nothing to tell or nobody to tell it to. */
      mail_id: { type: DataTypes.BIGINT, allowNull: true },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.getQueryInterface().dropTable('specification_review_runs');
}
