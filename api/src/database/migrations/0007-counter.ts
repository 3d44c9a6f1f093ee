import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * The counter: the products on sale on each day of a kitchen (kept for every day, so what was on
 * sale on a past day can be looked up after a complaint or an incident), and the questions front
 * of house asks the kitchen, with who asked and when, and the kitchen's answer.
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
/** Codes compare byte for byte (as in migration 0005). */
const binary = (length: number) => `VARCHAR(${length}) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin`;
const site = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' };
const user = { type: DataTypes.INTEGER, references: { model: 'users', key: 'id' } };

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'counter_days',
    {
      site_id: { ...site, primaryKey: true },
      day: { type: DataTypes.DATEONLY, allowNull: false, primaryKey: true },
      /** The ids of the products on sale, in the order they were marked. */
      products: { type: DataTypes.JSON, allowNull: false },
      set_by: { ...user, allowNull: false },
      /** The name when marked, so the record reads the same after the account changes. */
      set_by_name: { type: DataTypes.STRING(160), allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );
  await q.createTable(
    'counter_questions',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      site_id: site,
      product_code: { type: binary(80), allowNull: false },
      /** The product's name when asked. */
      product_name: { type: DataTypes.STRING(160), allowNull: false },
      /** Allergen group codes and sources the customer must avoid. */
      avoid: { type: DataTypes.JSON, allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: true },
      asked_by: { ...user, allowNull: false },
      asked_by_name: { type: DataTypes.STRING(160), allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
      answer: { type: DataTypes.STRING(1000), allowNull: true },
      answered_by: { ...user, allowNull: true },
      answered_by_name: { type: DataTypes.STRING(160), allowNull: true },
      answered_at: { type: DataTypes.DATE(3), allowNull: true },
    },
    opts,
  );
  await q.addIndex('counter_questions', ['site_id', 'answered_at', 'created_at'], { name: 'counter_questions_open' });
}

export async function down({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  for (const table of ['counter_questions', 'counter_days']) await q.dropTable(table);
}
