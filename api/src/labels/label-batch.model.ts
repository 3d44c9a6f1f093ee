import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** A batch code given out: it names one product's production on one day, and no other. */
@Table({ tableName: 'label_batches', underscored: true, timestamps: true, updatedAt: false })
export class LabelBatchModel extends Model {
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @Column({ type: DataType.STRING(20), allowNull: false })
  code: string;

  @Column({ type: DataType.STRING(80), allowNull: false })
  productCode: string;

  /** YYYY-MM-DD: the production day. */
  @Column({ type: DataType.DATEONLY, allowNull: false })
  day: string;

  /** 1, 2, … per product and day from the kitchen's pattern; 0 for a code the printer gave. */
  @Column({ type: DataType.INTEGER, allowNull: false })
  sequence: number;
}
