import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** A manager's note that out-of-date labels of a printed item were dealt with (append-only: see migration 0011). */
@Table({ tableName: 'label_stale_handled', underscored: true, timestamps: false })
export class LabelStaleHandledModel extends Model {
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  runId: number;

  @Column({ type: DataType.INTEGER, allowNull: false })
  position: number;

  /** The approval that made the item out of date. */
  @Column({ type: DataType.INTEGER, allowNull: false })
  approvalId: number;

  @Column({ type: DataType.STRING(500), allowNull: false })
  note: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  handledBy: number;

  @Column({ type: DataType.STRING(160), allowNull: false })
  handledByName: string;

  @Column({ type: DataType.DATE(3), allowNull: false })
  handledAt: Date;
}
