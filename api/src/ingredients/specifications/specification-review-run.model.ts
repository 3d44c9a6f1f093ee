import { Column, DataType, Model, PrimaryKey, Table } from 'sequelize-typescript';

/** What one day's review of the kitchen's supplier specifications found, and the mail it sent (migration 0012). */
@Table({ tableName: 'specification_review_runs', underscored: true, timestamps: true, updatedAt: false })
export class SpecificationReviewRunModel extends Model {
  @PrimaryKey
  @Column({ type: DataType.INTEGER, allowNull: false })
  siteId: number;

  /** The kitchen's date, YYYY-MM-DD. */
  @PrimaryKey
  @Column({ type: DataType.DATEONLY, allowNull: false })
  day: string;

  @Column({ type: DataType.JSON, allowNull: false })
  overdue: unknown;

  @Column({ type: DataType.JSON, allowNull: false })
  dueSoon: unknown;

  @Column({ type: DataType.BIGINT, allowNull: true })
  mailId: string | null;

  declare createdAt: Date;
}
