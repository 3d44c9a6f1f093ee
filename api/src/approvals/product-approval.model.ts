import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** A manager's approval of a product's declaration under a regime (append-only: see migration 0011). */
@Table({ tableName: 'product_approvals', underscored: true, timestamps: false })
export class ProductApprovalModel extends Model {
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  /** recipes.id of the product. */
  @Column({ type: DataType.INTEGER, allowNull: false })
  recipeId: number;

  @Column({ type: DataType.STRING(8), allowNull: false })
  regime: string;

  /** declarations.id of the kept declaration approved. */
  @Column({ type: DataType.INTEGER, allowNull: false })
  declarationId: number;

  @Column({ type: DataType.CHAR(64), allowNull: false })
  inputHash: string;

  @Column({ type: DataType.JSON, allowNull: false })
  body: unknown;

  @Column({ type: DataType.INTEGER, allowNull: false })
  approvedBy: number;

  @Column({ type: DataType.STRING(160), allowNull: false })
  approvedByName: string;

  @Column({ type: DataType.STRING(20), allowNull: false })
  approvedByRole: string;

  @Column({ type: DataType.DATE(3), allowNull: false })
  approvedAt: Date;

  @Column({ type: DataType.STRING(500), allowNull: true })
  note: string | null;
}
