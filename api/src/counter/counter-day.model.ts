import { Column, DataType, Model, PrimaryKey, Table } from 'sequelize-typescript';

/** The products on sale on one day of a kitchen, and who marked them. */
@Table({ tableName: 'counter_days', underscored: true, timestamps: true, createdAt: false })
export class CounterDayModel extends Model {
  @PrimaryKey
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  /** YYYY-MM-DD. */
  @PrimaryKey
  @Column({ type: DataType.DATEONLY, allowNull: false })
  day: string;

  @Column({ type: DataType.JSON, allowNull: false })
  products: unknown;

  @Column({ type: DataType.INTEGER, allowNull: false })
  setBy: number;

  @Column({ type: DataType.STRING(160), allowNull: false })
  setByName: string;

  declare updatedAt: Date;
}
