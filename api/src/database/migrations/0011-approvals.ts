import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * Approvals of products' declarations and out-of-date labels.
 * - product_approvals: append-only (the runtime user may only read and add rows, runtime-grants.ts).
 *   One row each time a manager approves a product's declaration under a regime: the kept
 *   declaration's row, its input hash and a copy of the declaration as served, who (name and
 *   role copied) and when. A product's current approval is its latest row for the kitchen's regime.
 * - label_run_items gain the declaration each printed item carried: its input hash and the
 *   approval it was printed under, so an approval since that changes it marks the labels out of date.
 * - label_stale_handled: append-only; a manager's note that out-of-date labels of a printed item
 *   were dealt with (reprinted, withdrawn), against the approval that made them out of date.
 */
const opts = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' };
const hash = 'CHAR(64) CHARACTER SET ascii COLLATE ascii_bin';

export async function up({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.createTable(
    'product_approvals',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      site_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' },
      recipe_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'recipes', key: 'id' } },
      regime: { type: DataTypes.STRING(8), allowNull: false },
      /** declarations.id of the kept declaration approved. */
      declaration_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'declarations', key: 'id' } },
      input_hash: { type: hash, allowNull: false },
      /** The declaration as served when approved (with its basis). */
      body: { type: DataTypes.JSON, allowNull: false },
      approved_by: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
      approved_by_name: { type: DataTypes.STRING(160), allowNull: false },
      approved_by_role: { type: DataTypes.STRING(20), allowNull: false },
      approved_at: { type: DataTypes.DATE(3), allowNull: false },
      note: { type: DataTypes.STRING(500), allowNull: true },
    },
    opts,
  );
  await q.addIndex('product_approvals', ['recipe_id', 'regime', 'id'], { name: 'product_approvals_latest' });
  await q.addColumn('label_run_items', 'input_hash', { type: hash, allowNull: true });
  /** product_approvals.id (no foreign key, so the column can be dropped again on its own). */
  await q.addColumn('label_run_items', 'approval_id', { type: DataTypes.INTEGER, allowNull: true });
  await q.createTable(
    'label_stale_handled',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      site_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sites', key: 'id' }, onDelete: 'CASCADE' },
      run_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'label_runs', key: 'id' } },
      position: { type: DataTypes.INTEGER, allowNull: false },
      /** The approval that made the printed item out of date: a later one makes it out of date again. */
      approval_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'product_approvals', key: 'id' } },
      note: { type: DataTypes.STRING(500), allowNull: false },
      handled_by: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
      handled_by_name: { type: DataTypes.STRING(160), allowNull: false },
      handled_at: { type: DataTypes.DATE(3), allowNull: false },
    },
    opts,
  );
  await q.addIndex('label_stale_handled', ['run_id', 'position', 'approval_id'], { name: 'label_stale_handled_item' });
}

export async function down({ sequelize }: MigrationContext) {
  const q = sequelize.getQueryInterface();
  await q.dropTable('label_stale_handled');
  await q.removeColumn('label_run_items', 'approval_id');
  await q.removeColumn('label_run_items', 'input_hash');
  await q.dropTable('product_approvals');
}
