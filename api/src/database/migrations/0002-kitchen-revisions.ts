import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * Ingredients and recipes keep every revision: the row names the thing and points at its
 * current revision; each revision holds the full body as the recipe book writes it.
 * Declarations are kept per recipe revision and regime, keyed by a hash of all they depend on.
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const created = { created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW } };

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  for (const kind of ['ingredient', 'recipe'] as const) {
    await q.createTable(
      `${kind}s`,
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        site_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sites', key: 'id' } },
        code: { type: DataTypes.STRING(80), allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        current_revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        archived: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        ...created,
        updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
      },
      opts,
    );
    await q.addIndex(`${kind}s`, ['site_id', 'code'], { unique: true, name: `${kind}s_site_code` });
    await q.createTable(
      `${kind}_revisions`,
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        [`${kind}_id`]: { type: DataTypes.INTEGER, allowNull: false, references: { model: `${kind}s`, key: 'id' }, onDelete: 'CASCADE' },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        body: { type: DataTypes.JSON, allowNull: false },
        note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        author_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
        ...created,
      },
      opts,
    );
    await q.addIndex(`${kind}_revisions`, [`${kind}_id`, 'revision'], { unique: true, name: `${kind}_revisions_rev` });
  }
  await q.createTable(
    'declarations',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' }, onDelete: 'CASCADE' },
      recipe_revision: { type: DataTypes.INTEGER, allowNull: false },
      regime: { type: DataTypes.STRING(8), allowNull: false },
      input_hash: { type: DataTypes.CHAR(64), allowNull: false },
      body: { type: DataTypes.JSON, allowNull: false },
      ...created,
    },
    opts,
  );
  await q.addIndex('declarations', ['recipe_id', 'regime', 'input_hash'], { unique: true, name: 'declarations_key' });
}

export async function down({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.dropTable('declarations');
  for (const kind of ['recipe', 'ingredient']) {
    await q.dropTable(`${kind}_revisions`);
    await q.dropTable(`${kind}s`);
  }
}
