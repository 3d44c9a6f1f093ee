import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** One product of a print run, as the log searches it: product, batch and dates. */
@Table({ tableName: 'label_run_items', underscored: true, timestamps: false })
export class LabelRunItemModel extends Model {
  /** label_runs.id (the migration's foreign key). */
  @Column({ type: DataType.INTEGER, allowNull: false })
  runId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  position: number;

  /** recipes.id of the product. */
  @Column({ type: DataType.INTEGER, allowNull: false })
  recipeId: number;

  @Column({ type: DataType.STRING(80), allowNull: false })
  productCode: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  revision: number;

  @Column({ type: DataType.STRING(20), allowNull: false })
  batch: string;

  /** YYYY-MM-DD: the best-before or use-by date printed, or null when the product has none. */
  @Column({ type: DataType.DATEONLY, allowNull: true })
  date: string | null;

  @Column({ type: DataType.DATEONLY, allowNull: false })
  productionDate: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  quantity: number;

  /** The input hash of the declaration printed (null for a reprint of an earlier revision, and for runs before approvals). */
  @Column({ type: DataType.CHAR(64), allowNull: true })
  inputHash: string | null;

  /** product_approvals.id the item was printed under. */
  @Column({ type: DataType.INTEGER, allowNull: true })
  approvalId: number | null;
}
