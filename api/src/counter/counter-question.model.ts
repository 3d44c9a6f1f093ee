import { Column, DataType, Model, Table } from 'sequelize-typescript';

/** A question front of house asked the kitchen about a product, and the kitchen's answer once given. */
@Table({ tableName: 'counter_questions', underscored: true, timestamps: true, updatedAt: false })
export class CounterQuestionModel extends Model {
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  @Column({ type: DataType.STRING(80), allowNull: false })
  productCode: string;

  @Column({ type: DataType.STRING(160), allowNull: false })
  productName: string;

  @Column({ type: DataType.JSON, allowNull: false })
  avoid: unknown;

  @Column({ type: DataType.STRING(500), allowNull: true })
  note: string | null;

  @Column({ type: DataType.INTEGER, allowNull: false })
  askedBy: number;

  @Column({ type: DataType.STRING(160), allowNull: false })
  askedByName: string;

  @Column({ type: DataType.STRING(1000), allowNull: true })
  answer: string | null;

  @Column({ type: DataType.INTEGER, allowNull: true })
  answeredBy: number | null;

  @Column({ type: DataType.STRING(160), allowNull: true })
  answeredByName: string | null;

  @Column({ type: DataType.DATE(3), allowNull: true })
  answeredAt: Date | null;

  /** When it was asked. */
  declare createdAt: Date;
}
