import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * Labels: the kitchen's label settings, the print log (every run with its PDF, and one row per
 * product printed, so that a recall finds every run of a batch), and the counters that give batch
 * codes and SSCC serials. Counters are raised inside the run's transaction under a row lock, so
 * two runs at once never get the same sequence or serial, and a refused run leaves them as they were.
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
/** Codes and keys compare byte for byte (as in migration 0005). */
const binary = (length: number) => `VARCHAR(${length}) CHARACTER SET utf8mb4 COLLATE utf8mb4_bin`;
const site = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' };

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'label_settings',
    {
      site_id: { ...site, primaryKey: true },
      batch_pattern: { type: DataTypes.STRING(60), allowNull: false },
      gs1_company_prefix: { type: binary(12), allowNull: true },
      sscc_extension: { type: DataTypes.TINYINT, allowNull: false },
      case_indicator: { type: DataTypes.TINYINT, allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );
  await q.createTable(
    'label_runs',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      site_id: site,
      printed_by: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
      /** The printer's name when printed, so the log reads the same after the account changes. */
      printed_by_name: { type: DataTypes.STRING(160), allowNull: false },
      template: { type: binary(40), allowNull: false },
      production_date: { type: DataTypes.DATEONLY, allowNull: false },
      request: { type: DataTypes.JSON, allowNull: false },
      items: { type: DataTypes.JSON, allowNull: false },
      /** What each item was rendered from (its served declaration and print details), so the same label can be printed again. */
      sources: { type: DataTypes.JSON, allowNull: false },
      override_reason: { type: DataTypes.STRING(300), allowNull: true },
      pdf: { type: DataTypes.BLOB('long'), allowNull: false },
      size_bytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: 'CHAR(64) CHARACTER SET ascii COLLATE ascii_bin', allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );
  await q.addIndex('label_runs', ['site_id', 'created_at'], { name: 'label_runs_printed' });
  await q.addIndex('label_runs', ['site_id', 'production_date'], { name: 'label_runs_production' });
  await q.createTable(
    'label_run_items',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      run_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'label_runs', key: 'id' }, onDelete: 'CASCADE' },
      site_id: site,
      /** 0-based place of the item in the run. */
      position: { type: DataTypes.INTEGER, allowNull: false },
      recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' } },
      product_code: { type: binary(80), allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      batch: { type: binary(20), allowNull: false },
      /** The best-before or use-by date printed, when the product has one. */
      date: { type: DataTypes.DATEONLY, allowNull: true },
      production_date: { type: DataTypes.DATEONLY, allowNull: false },
      quantity: { type: DataTypes.INTEGER, allowNull: false },
    },
    opts,
  );
  await q.addIndex('label_run_items', ['run_id', 'position'], { unique: true, name: 'label_run_items_place' });
  await q.addIndex('label_run_items', ['site_id', 'product_code', 'production_date'], { name: 'label_run_items_product' });
  await q.addIndex('label_run_items', ['site_id', 'batch'], { name: 'label_run_items_batch' });
  await q.createTable(
    'label_batches',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      site_id: site,
      /** The batch code as printed: one product and one day each, never two. */
      code: { type: binary(20), allowNull: false },
      product_code: { type: binary(80), allowNull: false },
      day: { type: DataTypes.DATEONLY, allowNull: false },
      /** 1, 2, … per product and day; 0 for a code the printer gave. */
      sequence: { type: DataTypes.INTEGER, allowNull: false },
      created_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );
  await q.addIndex('label_batches', ['site_id', 'code'], { unique: true, name: 'label_batches_code' });
  await q.addIndex('label_batches', ['site_id', 'product_code', 'day', 'sequence'], { name: 'label_batches_sequence' });
  await q.createTable(
    'sscc_serials',
    {
      site_id: { ...site, primaryKey: true },
      /** Serials are counted per company prefix and extension digit: together they make the SSCC's first digits. */
      company_prefix: { type: binary(12), allowNull: false, primaryKey: true },
      extension: { type: DataTypes.TINYINT, allowNull: false, primaryKey: true },
      /** The next serial reference to give (the SSCC's digits after extension and company prefix). */
      next_serial: { type: DataTypes.BIGINT, allowNull: false },
      updated_at: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
    },
    opts,
  );
}

export async function down({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  for (const table of ['sscc_serials', 'label_batches', 'label_run_items', 'label_runs', 'label_settings']) await q.dropTable(table);
}
