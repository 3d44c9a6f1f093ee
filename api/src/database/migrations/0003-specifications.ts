import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * Supplier specifications: the documents (PDF or image) behind an ingredient's allergen and
 * composition data. Every upload is a new version; the newest is the current one. review_by is
 * the date by which the kitchen must check the specification again.
 */
export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'specifications',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      ingredient_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'ingredients', key: 'id' }, onDelete: 'CASCADE' },
      version: { type: DataTypes.INTEGER, allowNull: false },
      filename: { type: DataTypes.STRING(200), allowNull: false },
      media_type: { type: DataTypes.STRING(100), allowNull: false },
      size_bytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      content: { type: DataTypes.BLOB('long'), allowNull: false },
      review_by: { type: DataTypes.DATEONLY, allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
      uploaded_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
  );
  await q.addIndex('specifications', ['ingredient_id', 'version'], { unique: true, name: 'specifications_version' });
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.getQueryInterface().dropTable('specifications');
}
